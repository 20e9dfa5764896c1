/**
 * Patterns and revisions: create, list, read, save on the latest base, 409
 * on a stale base (nothing written), 413 for sources over 1 MiB, 400 for bad
 * payloads, immutability of stored revisions, and the compile summary being
 * computed on the server with the shared compiler (never taken from the
 * client). Status codes per RFC 9110.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compile, summarizeForStorage } from '../../shared/index.ts';
import { SOURCE_MAX_BYTES } from '../../shared/api-schemas.ts';
import { Revision } from '../../server/models/index.ts';
import { makeUser, startHarness, type ApiHarness, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let designer: TestUser;
beforeAll(async () => {
  h = await startHarness();
  designer = await makeUser(h.app, 'pat-designer');
});
afterAll(async () => { await h.close(); });

const post = (url: string, user: TestUser) => request(h.app).post(url).set('Authorization', user.auth);
const get = (url: string, user: TestUser) => request(h.app).get(url).set('Authorization', user.auth);

describe('creating and reading patterns', () => {
  it('POST /api/patterns creates revision 1 with a server-computed summary', async () => {
    const source = sampleSource();
    const res = await post('/api/patterns', designer).send({ title: 'Tidepool Cowl', source, summary: { errors: 99, warnings: 99, sizes: [] } });
    expect(res.status).toBe(201);
    expect(res.body.pattern).toMatchObject({ title: 'Tidepool Cowl', status: 'draft', latestRevision: 1, myRole: 'owner', owner: { id: designer.id } });
    expect(res.body.revision).toMatchObject({ number: 1, source, author: { id: designer.id, name: designer.name } });
    // Oracle: the shared compiler run on the same text.
    const expected = summarizeForStorage(compile(source));
    expect(res.body.revision.summary).toEqual(expected);
    expect(res.body.revision.errors).toBe(expected.errors);
  });

  it('creates a pattern without a source (empty revision 1) and refuses an empty title with 400', async () => {
    const ok = await post('/api/patterns', designer).send({ title: 'Lantern Mitts' });
    expect(ok.status).toBe(201);
    expect(ok.body.revision.source).toBe('');
    const bad = await post('/api/patterns', designer).send({ title: '   ' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.details[0].path).toBe('title');
  });

  it('GET /api/patterns lists what the caller may see, newest first, with counts and the latest author', async () => {
    const other = await makeUser(h.app, 'pat-other');
    const mine = await post('/api/patterns', other).send({ title: 'Quarry Tote panel', source: sampleSource() });
    const list = await get('/api/patterns', other);
    expect(list.status).toBe(200);
    expect(list.body.patterns).toHaveLength(1);
    const item = list.body.patterns[0];
    expect(item).toMatchObject({ id: mine.body.pattern.id, title: 'Quarry Tote panel', status: 'draft', latestRevision: 1, myRole: 'owner', latestAuthor: { id: other.id, name: other.name } });
    expect(item.sizes).toEqual(mine.body.revision.summary.sizes.map((s: { name: string }) => s.name));
    expect(item.errors).toBe(mine.body.revision.summary.errors);
    expect(item.warnings).toBe(mine.body.revision.summary.warnings);
    // The designer's own patterns are not in the other account's list, and vice versa.
    const designerList = await get('/api/patterns', designer);
    expect(designerList.body.patterns.map((p: { id: number }) => p.id)).not.toContain(mine.body.pattern.id);
  });

  it('GET /api/patterns/:id returns the pattern and the latest revision with source and summary', async () => {
    const created = await post('/api/patterns', designer).send({ title: 'Read me', source: sampleSource() });
    const res = await get(`/api/patterns/${created.body.pattern.id}`, designer);
    expect(res.status).toBe(200);
    expect(res.body.pattern.id).toBe(created.body.pattern.id);
    expect(res.body.latestRevision).toMatchObject({ number: 1, source: created.body.revision.source, message: 'First version', author: { id: designer.id } });
    expect(res.body.latestRevision.summary).toEqual(created.body.revision.summary);
    expect((await get('/api/patterns/999999999', designer)).status).toBe(404);
    expect((await get('/api/patterns/not-a-number', designer)).status).toBe(404);
  });
});

describe('saving revisions', () => {
  let patternId: number;
  beforeAll(async () => {
    patternId = (await post('/api/patterns', designer).send({ title: 'Saves', source: sampleSource() })).body.pattern.id;
  });

  it('saves on the latest base (201) and numbers revisions 1, 2, 3', async () => {
    const r2 = await post(`/api/patterns/${patternId}/revisions`, designer).send({ source: sampleSource('second'), baseRevision: 1, message: 'Second' });
    expect(r2.status).toBe(201);
    expect(r2.body.revision).toMatchObject({ number: 2, message: 'Second', source: sampleSource('second') });
    const r3 = await post(`/api/patterns/${patternId}/revisions`, designer).send({ source: sampleSource('third'), baseRevision: 2, message: 'Third' });
    expect(r3.body.revision.number).toBe(3);
    const list = await get(`/api/patterns/${patternId}/revisions`, designer);
    expect(list.body.revisions.map((r: { number: number }) => r.number)).toEqual([3, 2, 1]);
    expect(list.body.revisions[0].source).toBeUndefined();
    const one = await get(`/api/patterns/${patternId}/revisions/2`, designer);
    expect(one.body.revision).toMatchObject({ number: 2, source: sampleSource('second') });
    expect(one.body.revision.summary).toEqual(summarizeForStorage(compile(sampleSource('second'))));
    expect((await get(`/api/patterns/${patternId}/revisions/42`, designer)).status).toBe(404);
  });

  it('answers a stale base with 409 and the latest revision, and writes nothing', async () => {
    const before = await Revision.count({ where: { patternId } });
    const stale = await post(`/api/patterns/${patternId}/revisions`, designer).send({ source: 'lost?', baseRevision: 1, message: 'Stale' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale-revision');
    expect(stale.body.latest).toMatchObject({ number: before, source: sampleSource('third') });
    expect(await Revision.count({ where: { patternId } })).toBe(before);
  });

  it('answers a source over 1 MiB with 413 (and one of exactly 1 MiB with 201)', async () => {
    const latest = (await get(`/api/patterns/${patternId}`, designer)).body.pattern.latestRevision as number;
    const huge = await post(`/api/patterns/${patternId}/revisions`, designer).send({ source: 'x'.repeat(SOURCE_MAX_BYTES + 1), baseRevision: latest, message: 'Huge' });
    expect(huge.status).toBe(413);
    expect(huge.body.error.code).toBe('too-large');
    // Multi-byte text counts in UTF-8 bytes: 2 bytes per "é".
    const wide = await post(`/api/patterns/${patternId}/revisions`, designer).send({ source: 'é'.repeat(SOURCE_MAX_BYTES / 2 + 1), baseRevision: latest, message: 'Wide' });
    expect(wide.status).toBe(413);
    const exact = await post(`/api/patterns/${patternId}/revisions`, designer).send({ source: '#'.repeat(SOURCE_MAX_BYTES), baseRevision: latest, message: 'Exactly the limit' });
    expect(exact.status).toBe(201);
    const create = await post('/api/patterns', designer).send({ title: 'Too big', source: 'x'.repeat(SOURCE_MAX_BYTES + 1) });
    expect(create.status).toBe(413);
  });

  it('answers bad payloads with 400', async () => {
    for (const body of [{}, { source: 'x' }, { source: 'x', baseRevision: 0 }, { source: 'x', baseRevision: '1' }, { source: 7, baseRevision: 1 }, { source: 'x', baseRevision: 1, message: 'm'.repeat(501) }]) {
      const res = await post(`/api/patterns/${patternId}/revisions`, designer).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.code).toBe('invalid-request');
    }
  });

  it('keeps stored revisions immutable (the database refuses updates)', async () => {
    await expect(h.sequelize.query(`UPDATE revisions SET source = 'changed' WHERE patternId = ${patternId} AND number = 1`)).rejects.toThrow(/immutable/);
    const r1 = await Revision.findOne({ where: { patternId, number: 1 } });
    r1!.message = 'rewritten';
    await expect(r1!.save()).rejects.toThrow(/immutable/);
    expect((await get(`/api/patterns/${patternId}/revisions/1`, designer)).body.revision.message).toBe('First version');
  });
});
