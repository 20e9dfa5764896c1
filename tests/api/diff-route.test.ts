/**
 * GET /api/patterns/:id/diff?from=N&to=M against the real database: the
 * answer is shared/diff's result for the two stored sources (semantic JSON
 * and its text form), and the route checks parameters and who may read
 * which revision.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { diffRevisions, formatDiffText } from '../../shared/diff/index.ts';
import { startHarness, type ApiHarness } from './helpers.ts';
import { as, makeReviewCast, saveRevision, type ReviewCast } from './review-fixture.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let cast: ReviewCast;
let base: string;
const first = sampleSource();
// An edited second revision: the cuff rib worked for two more rounds (the first rib range 1-12 becomes 1-14).
const second = first.replace(/\b12\b/, '14');

beforeAll(async () => {
  h = await startHarness();
  cast = await makeReviewCast(h.app, 'df');
  base = `/api/patterns/${cast.patternId}`;
  await saveRevision(h.app, cast, second, 'longer cuff');
});
afterAll(async () => h.close());

describe('GET /api/patterns/:id/diff', () => {
  it('answers shared/diff\'s semantic diff and text for the two stored revisions', async () => {
    expect(second).not.toBe(first);
    const res = await as(h.app, cast.people.editor, 'get', `${base}/diff?from=1&to=2`);
    expect(res.status).toBe(200);
    const expected = diffRevisions(first, second);
    expect(res.body).toEqual({ from: 1, to: 2, size: null, semantic: JSON.parse(JSON.stringify(expected)), text: formatDiffText(expected) });
    expect(res.body.semantic.same).toBe(false);
    expect(res.body.semantic.text.hunks.length).toBeGreaterThan(0);
  });

  it('diffs one size when asked, and a revision against itself is the same', async () => {
    const one = await as(h.app, cast.people.owner, 'get', `${base}/diff?from=2&to=1&size=M`);
    expect(one.status).toBe(200);
    expect(one.body.size).toBe('M');
    expect(one.body.semantic.sizes.map((s: { size: string }) => s.size)).toEqual(['M']);
    const same = await as(h.app, cast.people.owner, 'get', `${base}/diff?from=2&to=2`);
    expect(same.body.semantic.same).toBe(true);
  });

  it('answers 400 for missing or malformed parameters and 404 for unknown revisions', async () => {
    for (const q of ['', '?from=1', '?to=2', '?from=a&to=2', '?from=0&to=2', '?from=1&to=-2', '?from=1.5&to=2', '?from=1&to=2&from=2']) {
      const r = await as(h.app, cast.people.owner, 'get', `${base}/diff${q}`);
      expect(r.status, q).toBe(400);
      expect(r.body.error.code).toBe('invalid-request');
    }
    expect((await as(h.app, cast.people.owner, 'get', `${base}/diff?from=1&to=99`)).status).toBe(404);
    expect((await as(h.app, cast.people.owner, 'get', '/api/patterns/999999999/diff?from=1&to=2')).status).toBe(404);
  });

  it('needs both revisions visible: knitters see released ones only; strangers nothing', async () => {
    expect((await as(h.app, cast.people.knitter, 'get', `${base}/diff?from=1&to=2`)).status).toBe(404);
    expect((await as(h.app, cast.people.stranger, 'get', `${base}/diff?from=1&to=2`)).status).toBe(404);
    expect((await as(h.app, null, 'get', `${base}/diff?from=1&to=2`)).status).toBe(401);
  });

  it('handles a source that does not compile (diagnostics, no crash)', async () => {
    const broken = path.resolve(import.meta.dirname, '..', '..', 'examples', 'broken');
    const file = (await import('node:fs')).readdirSync(broken).filter((f) => f.endsWith('.loop')).sort()[0]!;
    const n = await saveRevision(h.app, cast, readFileSync(path.join(broken, file), 'utf8'), 'broken');
    const res = await as(h.app, cast.people.owner, 'get', `${base}/diff?from=2&to=${n}`);
    expect(res.status).toBe(200);
    expect(res.body.semantic.new.ok).toBe(false);
    expect(res.body.semantic.diagnostics.introduced.length).toBeGreaterThan(0);
  });
});
