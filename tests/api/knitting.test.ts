/**
 * The knitter's side of a release against the real database: the list of
 * released versions, progress saved per knitter, release and size (rounds
 * done and the current round), and errata that reach the designer as a
 * comment on the released revision and a mail.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startHarness, type ApiHarness } from './helpers.ts';
import { as, makeReviewCast, releaseRevision, saveRevision, type ReviewCast, type Who } from './review-fixture.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let cast: ReviewCast;
let base: string;
/** Rounds per size of revision 1, from the summary the server stored (the shared compiler's counts). */
let roundsBySize: Map<string, number>;

beforeAll(async () => {
  h = await startHarness();
  cast = await makeReviewCast(h.app, 'kn');
  base = `/api/patterns/${cast.patternId}`;
  const rev = await as(h.app, cast.people.owner, 'get', `${base}/revisions/1`);
  roundsBySize = new Map((rev.body.revision.summary.sizes as { name: string; rounds: unknown[] }[]).map((s) => [s.name, s.rounds.length]));
});
afterAll(async () => h.close());

const call = (who: Who, method: 'get' | 'put' | 'post', path: string) => as(h.app, cast.people[who], method, `${base}${path}`);

describe('releases list', () => {
  it('is hidden from knitters before the first release and lists every release after', async () => {
    expect((await call('knitter', 'get', '/releases')).status).toBe(404);
    expect((await call('owner', 'get', '/releases')).body.releases).toEqual([]);
    expect((await releaseRevision(h.app, cast, 1, '1.0')).status).toBe(201);
    const second = await saveRevision(h.app, cast, sampleSource('1.1'), 'erratum');
    expect((await releaseRevision(h.app, cast, second, '1.1')).status).toBe(201);
    const list = await call('knitter', 'get', '/releases');
    expect(list.status).toBe(200);
    expect(list.body.releases).toMatchObject([{ label: '1.1', revision: second }, { label: '1.0', revision: 1 }]);
    expect((await call('stranger', 'get', '/releases')).status).toBe(404);
  });

  it('lets a knitter read every released revision, not only the newest, and no other', async () => {
    expect((await call('knitter', 'get', '/diff?from=1&to=2')).status).toBe(200);
    expect((await call('knitter', 'get', '/revisions/1')).body.revision.number).toBe(1);
    await saveRevision(h.app, cast, sampleSource('draft 3'), 'unreleased');
    expect((await call('knitter', 'get', '/diff?from=2&to=3')).status).toBe(404);
    expect((await call('knitter', 'get', '/revisions/3')).status).toBe(404);
    const listed = await call('testKnitter', 'get', '/revisions');
    expect(listed.body.revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
  });
});

describe('progress per knitter, release and size', () => {
  it('starts empty, saves rounds done (sorted, once each) and the current round, and reads them back', async () => {
    const empty = await call('knitter', 'get', '/releases/1.0/progress?size=M');
    expect(empty.status).toBe(200);
    expect(empty.body.progress).toEqual({ release: '1.0', revision: 1, size: 'M', rounds: roundsBySize.get('M'), roundsDone: [], currentRound: null, updatedAt: null });
    const put = await call('knitter', 'put', '/releases/1.0/progress?size=M').send({ roundsDone: [3, 1, 2, 2], currentRound: 4 });
    expect(put.status).toBe(200);
    expect(put.body.progress).toMatchObject({ roundsDone: [1, 2, 3], currentRound: 4 });
    const again = await call('knitter', 'get', '/releases/1.0/progress?size=M');
    expect(again.body.progress).toMatchObject({ roundsDone: [1, 2, 3], currentRound: 4 });
    expect(typeof again.body.progress.updatedAt).toBe('string');
    // Saving replaces what was there.
    await call('knitter', 'put', '/releases/1.0/progress?size=M').send({ roundsDone: [1, 2, 3, 4], currentRound: 5 });
    expect((await call('knitter', 'get', '/releases/1.0/progress?size=M')).body.progress).toMatchObject({ roundsDone: [1, 2, 3, 4], currentRound: 5 });
  });

  it('keeps sizes, releases and knitters apart', async () => {
    await call('knitter', 'put', '/releases/1.0/progress?size=S').send({ roundsDone: [1], currentRound: 2 });
    expect((await call('knitter', 'get', '/releases/1.0/progress?size=S')).body.progress).toMatchObject({ size: 'S', roundsDone: [1], currentRound: 2 });
    expect((await call('knitter', 'get', '/releases/1.0/progress?size=M')).body.progress.currentRound).toBe(5);
    expect((await call('knitter', 'get', '/releases/1.1/progress?size=M')).body.progress).toMatchObject({ release: '1.1', roundsDone: [], currentRound: null });
    expect((await call('testKnitter', 'get', '/releases/1.0/progress?size=M')).body.progress).toMatchObject({ roundsDone: [], currentRound: null });
    await call('testKnitter', 'put', '/releases/1.0/progress?size=M').send({ roundsDone: [], currentRound: 1 });
    expect((await call('knitter', 'get', '/releases/1.0/progress?size=M')).body.progress.currentRound).toBe(5);
  });

  it('refuses unknown sizes, rounds past the end, bad bodies and unknown releases', async () => {
    expect((await call('knitter', 'get', '/releases/1.0/progress')).body.error.code).toBe('size-required');
    expect((await call('knitter', 'get', '/releases/1.0/progress?size=XXL')).body.error.code).toBe('unknown-size');
    const rounds = roundsBySize.get('M')!;
    const past = await call('knitter', 'put', '/releases/1.0/progress?size=M').send({ roundsDone: [rounds + 1], currentRound: null });
    expect(past.status).toBe(400);
    expect(past.body.error.code).toBe('round-out-of-range');
    expect((await call('knitter', 'put', '/releases/1.0/progress?size=M').send({ roundsDone: [0], currentRound: null })).status).toBe(400);
    expect((await call('knitter', 'put', '/releases/1.0/progress?size=M').send({ roundsDone: 'all' })).status).toBe(400);
    expect((await call('knitter', 'get', '/releases/7.0/progress?size=M')).status).toBe(404);
    expect((await call('stranger', 'get', '/releases/1.0/progress?size=M')).status).toBe(404);
    // Nothing was overwritten by the refused saves.
    expect((await call('knitter', 'get', '/releases/1.0/progress?size=M')).body.progress).toMatchObject({ roundsDone: [1, 2, 3, 4], currentRound: 5 });
  });
});

describe('errata', () => {
  it('an erratum on a round becomes a comment on the released revision and mails the designer', async () => {
    const res = await call('knitter', 'post', '/releases/1.0/errata').send({ round: 14, size: 'M', body: 'After round 14 I have 68 stitches, not 69.' });
    expect(res.status).toBe(201);
    expect(res.body.comment).toMatchObject({ kind: 'erratum', round: 14, size: 'M', revision: 1, author: { id: cast.people.knitter.id }, resolved: false });
    expect(res.body.delivered).toBe(true);
    const comments = await call('owner', 'get', '/revisions/1/comments');
    expect(comments.body.comments.some((c: { id: number; kind: string }) => c.id === res.body.comment.id && c.kind === 'erratum')).toBe(true);
    const mail = h.smtp.list().filter((m) => m.to.includes(cast.people.owner.email) && m.subject.startsWith('Erratum reported'));
    expect(mail).toHaveLength(1);
    expect(mail[0]!.subject).toContain('round 14 (size M)');
    expect(mail[0]!.text).toContain('After round 14 I have 68 stitches, not 69.');
    // The designer answers it like any thread.
    const reply = await call('owner', 'post', `/comments/${res.body.comment.id}/replies`).send({ body: 'Thank you; fixed in 1.1.' });
    expect(reply.body.comment.parentId).toBe(res.body.comment.id);
  });

  it('refuses rounds past the end, unknown sizes, empty reports, the owner, and strangers', async () => {
    const rounds = roundsBySize.get('S')!;
    expect((await call('testKnitter', 'post', '/releases/1.1/errata').send({ round: rounds + 1, size: 'S', body: 'x' })).body.error.code).toBe('round-out-of-range');
    expect((await call('testKnitter', 'post', '/releases/1.1/errata').send({ round: 2, size: 'XXL', body: 'x' })).body.error.code).toBe('unknown-size');
    expect((await call('testKnitter', 'post', '/releases/1.1/errata').send({ round: 2, body: '  ' })).status).toBe(400);
    expect((await call('owner', 'post', '/releases/1.1/errata').send({ round: 2, body: 'x' })).status).toBe(403);
    expect((await call('stranger', 'post', '/releases/1.1/errata').send({ round: 2, body: 'x' })).status).toBe(404);
    const ok = await call('testKnitter', 'post', '/releases/1.1/errata').send({ round: 2, body: 'Rib reads k2, p2 in the chart but k1, p1 in the text.' });
    expect(ok.status).toBe(201);
    expect(ok.body.comment.size).toBeNull();
  });
});
