/**
 * The role matrix: every pattern route for every kind of caller, with the
 * pattern in draft and after release. The expected table below is written
 * out by hand from product.md's role table and the access rules of issue 5
 * (owner does everything; an invited editor reads every revision and
 * comments; invited test knitters and knitters read the released revision
 * only; anybody else gets 404 so existence is not leaked; admins manage
 * accounts; signed-out callers get 401). It is deliberately not derived from
 * server/services/access.ts, so a change there that breaks a rule fails here.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Comment, Membership, Pattern, Revision, User } from '../../server/models/index.ts';
import { makeUser, startHarness, uniqueEmail, type ApiHarness, type TestUser } from './helpers.ts';
import { pngBytes } from './images.ts';
import { sampleSource } from './sample-source.ts';

const ROLES = ['owner', 'editor', 'testKnitter', 'knitter', 'stranger', 'admin', 'anon'] as const;
type Role = (typeof ROLES)[number];
type Outcome = number | 'in' | 'out';

let h: ApiHarness;
const users = {} as Record<Exclude<Role, 'anon'>, TestUser>;
let patternId: number;
let dummyId: number;
let uploadId: number;
let commentId: number;

beforeAll(async () => {
  h = await startHarness();
  users.owner = await makeUser(h.app, 'm-owner', ['designer']);
  users.editor = await makeUser(h.app, 'm-editor', ['editor']);
  users.testKnitter = await makeUser(h.app, 'm-tk', ['knitter']);
  users.knitter = await makeUser(h.app, 'm-knitter', ['knitter']);
  users.stranger = await makeUser(h.app, 'm-stranger', ['designer']);
  users.admin = await makeUser(h.app, 'm-admin', ['admin']);
  const dummy = await makeUser(h.app, 'm-dummy', ['knitter']);
  dummyId = dummy.id;
  const created = await request(h.app).post('/api/patterns').set('Authorization', users.owner.auth).send({ title: 'Lantern Mitts', source: sampleSource() });
  patternId = created.body.pattern.id;
  await request(h.app).post(`/api/patterns/${patternId}/revisions`).set('Authorization', users.owner.auth).send({ source: sampleSource('r2'), baseRevision: 1, message: 'r2' });
  await Membership.bulkCreate([
    { patternId, userId: users.editor.id, role: 'editor' },
    { patternId, userId: users.testKnitter.id, role: 'test-knitter' },
    { patternId, userId: users.knitter.id, role: 'knitter' },
  ]);
  const up = await request(h.app).post(`/api/patterns/${patternId}/uploads`).set('Authorization', users.owner.auth).attach('file', pngBytes(), 'swatch.png');
  uploadId = up.body.upload.id;
  const r1 = await Revision.findOne({ where: { patternId, number: 1 } });
  commentId = (await Comment.create({ revisionId: r1!.id, authorId: users.owner.id, body: 'Check round 3', round: 3 })).id;
});
afterAll(async () => { await h.close(); });

/** Puts the pattern into the phase under test and restores what earlier calls changed. */
async function setPhase(phase: 'draft' | 'released') {
  await Pattern.update(phase === 'draft' ? { status: 'draft', approvedRevision: null, releasedRevision: null } : { status: 'released', approvedRevision: 1, releasedRevision: 1 }, { where: { id: patternId } });
  await Membership.findOrCreate({ where: { patternId, userId: dummyId }, defaults: { patternId, userId: dummyId, role: 'knitter' } });
}

const send = (method: 'get' | 'post' | 'patch' | 'delete', url: string, who: Role) => {
  const req = request(h.app)[method](url);
  return who === 'anon' ? req : req.set('Authorization', users[who].auth);
};

interface Row { name: string; call(who: Role): Promise<Outcome>; draft: Outcome[]; released: Outcome[] }
const status = (p: request.Test) => p.then((r) => r.status);

//            owner   editor  tk      knitter stranger admin  anon
const ROWS: Row[] = [
  { name: 'GET /api/patterns (is it listed?)', call: async (who) => {
      const r = await send('get', '/api/patterns', who);
      return r.status !== 200 ? r.status : (r.body.patterns as { id: number }[]).some((p) => p.id === patternId) ? 'in' : 'out';
    },
    draft:    ['in',  'in',  'out', 'out', 'out', 'out', 401],
    released: ['in',  'in',  'in',  'in',  'out', 'out', 401] },
  { name: 'GET /api/patterns/:id', call: (who) => status(send('get', `/api/patterns/${patternId}`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 200, 200, 404, 404, 401] },
  { name: 'GET /api/patterns/:id/revisions', call: (who) => status(send('get', `/api/patterns/${patternId}/revisions`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 200, 200, 404, 404, 401] },
  { name: 'GET /api/patterns/:id/revisions/1 (released one)', call: (who) => status(send('get', `/api/patterns/${patternId}/revisions/1`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 200, 200, 404, 404, 401] },
  { name: 'GET /api/patterns/:id/revisions/2 (unreleased)', call: (who) => status(send('get', `/api/patterns/${patternId}/revisions/2`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 404, 404, 404, 404, 401] },
  { name: 'POST /api/patterns/:id/revisions', call: async (who) => {
      const p = await Pattern.findByPk(patternId);
      return status(send('post', `/api/patterns/${patternId}/revisions`, who).send({ source: sampleSource(`by ${who}`), baseRevision: p!.latestRevision, message: who }));
    },
    draft:    [201, 403, 404, 404, 404, 404, 401],
    released: [201, 403, 403, 403, 404, 404, 401] },
  { name: 'GET /api/patterns/:id/members', call: (who) => status(send('get', `/api/patterns/${patternId}/members`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 403, 403, 404, 404, 401] },
  { name: 'POST /api/patterns/:id/members', call: (who) => status(send('post', `/api/patterns/${patternId}/members`, who).send({ email: uniqueEmail('mx'), role: 'knitter' })),
    draft:    [201, 403, 404, 404, 404, 404, 401],
    released: [201, 403, 403, 403, 404, 404, 401] },
  { name: 'DELETE /api/patterns/:id/members/:userId (someone else)', call: (who) => status(send('delete', `/api/patterns/${patternId}/members/${dummyId}`, who)),
    draft:    [204, 403, 404, 404, 404, 404, 401],
    released: [204, 403, 403, 403, 404, 404, 401] },
  { name: 'POST /api/patterns/:id/uploads', call: (who) => status(send('post', `/api/patterns/${patternId}/uploads`, who).attach('file', pngBytes(), 'swatch.png')),
    draft:    [201, 403, 404, 404, 404, 404, 401],
    released: [201, 403, 403, 403, 404, 404, 401] },
  { name: 'GET /api/patterns/:id/uploads', call: (who) => status(send('get', `/api/patterns/${patternId}/uploads`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 200, 200, 404, 404, 401] },
  { name: 'GET /api/uploads/:id', call: (who) => status(send('get', `/api/uploads/${uploadId}`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 200, 200, 404, 404, 401] },
  { name: 'GET /api/patterns/:id/revisions/1/comments', call: (who) => status(send('get', `/api/patterns/${patternId}/revisions/1/comments`, who)),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 403, 403, 404, 404, 401] },
  { name: 'POST /api/patterns/:id/revisions/1/comments', call: (who) => status(send('post', `/api/patterns/${patternId}/revisions/1/comments`, who).send({ body: `note from ${who}`, round: 2 })),
    draft:    [201, 201, 404, 404, 404, 404, 401],
    released: [201, 201, 403, 403, 404, 404, 401] },
  { name: 'PATCH /api/patterns/:id/comments/:commentId {resolved}', call: (who) => status(send('patch', `/api/patterns/${patternId}/comments/${commentId}`, who).send({ resolved: true })),
    draft:    [200, 200, 404, 404, 404, 404, 401],
    released: [200, 200, 403, 403, 404, 404, 401] },
  { name: 'POST /api/patterns/:id/status {in-review}', call: (who) => status(send('post', `/api/patterns/${patternId}/status`, who).send({ status: 'in-review' })),
    draft:    [200, 403, 404, 404, 404, 404, 401],
    released: [200, 403, 403, 403, 404, 404, 401] },
  { name: 'POST /api/patterns (create, global role)', call: (who) => status(send('post', '/api/patterns', who).send({ title: `By ${who}` })),
    draft:    [201, 403, 403, 403, 201, 201, 401],
    released: [201, 403, 403, 403, 201, 201, 401] },
  { name: 'POST /api/patterns/import (global role)', call: (who) => status(send('post', '/api/patterns/import', who).attach('file', Buffer.from(sampleSource()), 'tote.loop')),
    draft:    [201, 403, 403, 403, 201, 201, 401],
    released: [201, 403, 403, 403, 201, 201, 401] },
  { name: 'GET /api/admin/users', call: (who) => status(send('get', '/api/admin/users', who)),
    draft:    [403, 403, 403, 403, 403, 200, 401],
    released: [403, 403, 403, 403, 403, 200, 401] },
];

describe.each(['draft', 'released'] as const)('role matrix with the pattern %s', (phase) => {
  it.each(ROWS.map((row) => [row.name, row] as const))('%s', async (_name, row) => {
    const got: Record<string, Outcome> = {};
    const want: Record<string, Outcome> = {};
    for (const [i, who] of ROLES.entries()) {
      await setPhase(phase);
      got[who] = await row.call(who);
      want[who] = row[phase][i]!;
    }
    expect(got).toEqual(want);
  });
});

describe('what each role sees', () => {
  it('a 404 for a hidden pattern looks exactly like one for a pattern that does not exist', async () => {
    await setPhase('draft');
    const hidden = await send('get', `/api/patterns/${patternId}`, 'knitter');
    const missing = await send('get', '/api/patterns/2147483000', 'knitter');
    expect(hidden.status).toBe(404);
    expect(hidden.body).toEqual(missing.body);
  });

  it('after release, knitters get the released revision as the latest, and only that one', async () => {
    await setPhase('released');
    const p = await send('get', `/api/patterns/${patternId}`, 'knitter');
    expect(p.body.pattern).toMatchObject({ latestRevision: 1, releasedRevision: 1, myRole: 'knitter', approvedRevision: null });
    expect(p.body.latestRevision.number).toBe(1);
    const revs = await send('get', `/api/patterns/${patternId}/revisions`, 'testKnitter');
    expect(revs.body.revisions.map((r: { number: number }) => r.number)).toEqual([1]);
    const owner = await send('get', `/api/patterns/${patternId}`, 'owner');
    expect(owner.body.pattern.latestRevision).toBeGreaterThan(1);
  });

  it('a member may leave (DELETE themselves) but not remove others', async () => {
    await setPhase('released');
    const leaver = await makeUser(h.app, 'm-leaver', ['knitter']);
    await Membership.create({ patternId, userId: leaver.id, role: 'knitter' });
    expect((await request(h.app).delete(`/api/patterns/${patternId}/members/${users.knitter.id}`).set('Authorization', leaver.auth)).status).toBe(403);
    expect((await request(h.app).delete(`/api/patterns/${patternId}/members/${leaver.id}`).set('Authorization', leaver.auth)).status).toBe(204);
    expect((await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', leaver.auth)).status).toBe(404);
  });
});

describe('review workflow', () => {
  it('owner submits, editor approves, owner releases the approved revision; wrong moves get 403 or 400', async () => {
    await setPhase('draft');
    const statusAs = (who: Role, s: string) => send('post', `/api/patterns/${patternId}/status`, who).send({ status: s });
    expect((await statusAs('owner', 'released')).status).toBe(400); // not approved yet
    expect((await statusAs('owner', 'in-review')).body.pattern.status).toBe('in-review');
    expect((await statusAs('owner', 'approved')).status).toBe(403);
    expect((await statusAs('editor', 'released')).status).toBe(403);
    const approved = await statusAs('editor', 'approved');
    expect(approved.status).toBe(200);
    const approvedNumber = approved.body.pattern.approvedRevision as number;
    expect(approvedNumber).toBe((await Pattern.findByPk(patternId))!.latestRevision);
    // A save after approval does not change what gets released.
    await send('post', `/api/patterns/${patternId}/revisions`, 'owner').send({ source: sampleSource('after approval'), baseRevision: approvedNumber, message: 'later' });
    const released = await statusAs('owner', 'released');
    expect(released.status).toBe(200);
    expect(released.body.pattern).toMatchObject({ status: 'released', releasedRevision: approvedNumber });
    const k = await send('get', `/api/patterns/${patternId}`, 'knitter');
    expect(k.body.latestRevision.number).toBe(approvedNumber);
    expect((await statusAs('owner', 'bogus')).status).toBe(400);
  });
});

describe('admins manage accounts', () => {
  it('an admin changes roles; nobody else may; an admin cannot drop their own admin role', async () => {
    const target = await makeUser(h.app, 'm-target', ['knitter']);
    const patch = (who: Role, id: number, roles: string[]) => {
      const r = request(h.app).patch(`/api/admin/users/${id}`).send({ roles });
      return who === 'anon' ? r : r.set('Authorization', users[who].auth);
    };
    expect((await patch('owner', target.id, ['designer'])).status).toBe(403);
    expect((await patch('anon', target.id, ['designer'])).status).toBe(401);
    const ok = await patch('admin', target.id, ['designer', 'knitter']);
    expect(ok.status).toBe(200);
    expect((await User.findByPk(target.id))!.roles).toEqual(['designer', 'knitter']);
    expect((await patch('admin', users.admin.id, ['designer'])).status).toBe(400);
    expect((await patch('admin', target.id, ['wizard'])).status).toBe(400);
    expect((await patch('admin', 2147483000, ['designer'])).status).toBe(404);
  });
});
