/**
 * The review workflow over HTTP against the real database: each step by
 * the role allowed to take it and refused for the others (403, or 404 for
 * those who cannot see the pattern), the mails each step sends (review
 * requested to the editor; changes requested and approved to the
 * designer; released to every member), the review log, releases with
 * version labels (validated, unique, newer than the last) that freeze the
 * revision, and comment threads (replies, resolving).
 */
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Membership, Release } from '../../server/models/index.ts';
import { startHarness, type ApiHarness } from './helpers.ts';
import { as, makeReviewCast, saveRevision, type ReviewCast, type Who } from './review-fixture.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let cast: ReviewCast;
let base: string;

beforeAll(async () => {
  h = await startHarness();
  cast = await makeReviewCast(h.app, 'rv');
  base = `/api/patterns/${cast.patternId}`;
});
afterAll(async () => h.close());

const step = (who: Who | 'anon', path: string, body: object = {}) => as(h.app, who === 'anon' ? null : cast.people[who], 'post', `${base}${path}`).send(body);
const mailsTo = (email: string, subject: RegExp) => h.smtp.list().filter((m) => m.to.includes(email) && subject.test(m.subject));

describe('review steps, roles and mails', () => {
  it('the designer asks an invited editor for a review; others may not; the editor gets a mail', async () => {
    expect((await step('editor', '/review/request')).status).toBe(403);
    // Knitters cannot see an unreleased pattern at all.
    expect((await step('knitter', '/review/request')).status).toBe(404);
    expect((await step('testKnitter', '/review/request')).status).toBe(404);
    expect((await step('stranger', '/review/request')).status).toBe(404);
    expect((await step('anon', '/review/request')).status).toBe(401);
    expect((await step('owner', '/review/request', { editorId: cast.people.knitter.id })).body.error.code).toBe('not-an-editor');

    const res = await step('owner', '/review/request', { editorId: cast.people.editor.id, message: 'Gusset rounds reworked.' });
    expect(res.status).toBe(200);
    expect(res.body.pattern.status).toBe('in-review');
    expect(res.body.event).toMatchObject({ event: 'submit', from: 'draft', to: 'in-review', revision: 1, editor: { id: cast.people.editor.id } });
    expect(res.body.delivered).toBe(true);
    const mail = mailsTo(cast.people.editor.email, /Review requested/);
    expect(mail).toHaveLength(1);
    expect(mail[0]!.text).toContain('Gusset rounds reworked.');
    expect(mail[0]!.links.some((l) => l.endsWith(`/patterns/${cast.patternId}`))).toBe(true);
    // Asking again while in review is a wrong move, not a permission matter.
    expect((await step('owner', '/review/request')).body.error.code).toBe('invalid-status-change');
  });

  it('only the editor approves, a revision that exists; the designer gets a mail', async () => {
    expect((await step('owner', '/review/approve')).status).toBe(403);
    expect((await step('testKnitter', '/review/approve')).status).toBe(404);
    expect((await step('editor', '/review/approve', { revision: 99 })).status).toBe(404);
    expect((await step('editor', '/review/approve', { revision: 0 })).status).toBe(400);
    const res = await step('editor', '/review/approve', { revision: 1, message: 'Counts check out in all three sizes.' });
    expect(res.status).toBe(200);
    expect(res.body.pattern).toMatchObject({ status: 'approved', approvedRevision: 1 });
    const mail = mailsTo(cast.people.owner.email, /^Approved/);
    expect(mail).toHaveLength(1);
    expect(mail[0]!.text).toContain('Counts check out in all three sizes.');
    expect((await step('editor', '/review/request-changes', { message: 'late' })).status).toBe(400);
  });

  it('asking again clears the approval; the editor asks for changes with a message, mailed to the designer', async () => {
    const again = await step('owner', '/review/request');
    expect(again.body.pattern).toMatchObject({ status: 'in-review', approvedRevision: null });
    expect((await step('editor', '/review/request-changes', {})).status).toBe(400); // message required
    expect((await step('owner', '/review/request-changes', { message: 'x' })).status).toBe(403);
    const res = await step('editor', '/review/request-changes', { message: 'Round 14 reads two stitches short in size S.' });
    expect(res.status).toBe(200);
    expect(res.body.pattern.status).toBe('changes-requested');
    const mail = mailsTo(cast.people.owner.email, /^Changes requested/);
    expect(mail).toHaveLength(1);
    expect(mail[0]!.text).toContain('Round 14 reads two stitches short in size S.');
    // No release without an approval.
    expect((await step('owner', '/releases', { label: '1.0' })).body.error.code).toBe('invalid-status-change');
  });

  it('the designer withdraws a request only while in review', async () => {
    expect((await step('owner', '/review/withdraw')).status).toBe(400);
    expect((await step('owner', '/review/request')).status).toBe(200);
    expect((await step('editor', '/review/withdraw')).status).toBe(403);
    const res = await step('owner', '/review/withdraw');
    expect(res.body.pattern.status).toBe('draft');
  });

  it('the designer releases the approved revision under a valid label; every member gets a mail', async () => {
    await step('owner', '/review/request');
    await step('editor', '/review/approve', { revision: 1 });
    for (const bad of ['v1', '1.', '01', '1.0.0.0', '', '1.a']) {
      const r = await step('owner', '/releases', { label: bad });
      expect(r.status, `label ${JSON.stringify(bad)}`).toBe(400);
    }
    expect((await step('editor', '/releases', { label: '1.0' })).status).toBe(403);
    expect((await step('owner', '/releases', { label: '1.0', revision: 2 })).body.error.code).toBe('not-approved');
    const res = await step('owner', '/releases', { label: '1.0', notes: 'First release.' });
    expect(res.status).toBe(201);
    expect(res.body.release).toMatchObject({ label: '1.0', revision: 1, notes: 'First release.', releasedBy: { id: cast.people.owner.id } });
    expect(res.body.pattern).toMatchObject({ status: 'released', releasedRevision: 1, approvedRevision: null });
    for (const who of ['editor', 'testKnitter', 'knitter'] as const) {
      const mail = mailsTo(cast.people[who].email, /^Released/);
      expect(mail, who).toHaveLength(1);
      expect(mail[0]!.subject).toContain('1.0');
    }
    expect(mailsTo(cast.people.stranger.email, /^Released/)).toHaveLength(0);
    // A new release needs a new approval.
    expect((await step('owner', '/releases', { label: '1.1' })).body.error.code).toBe('invalid-status-change');
  });

  it('an erratum release: labels must be new and newer; a released revision cannot be approved again', async () => {
    const second = await saveRevision(h.app, cast, sampleSource('erratum: round 14 note'), 'Erratum for round 14');
    await step('owner', '/review/request');
    expect((await step('editor', '/review/approve', { revision: 1 })).body.error.code).toBe('already-released');
    expect((await step('editor', '/review/approve', { revision: second })).status).toBe(200);
    expect((await step('owner', '/releases', { label: '1.0' })).body.error.code).toBe('label-taken');
    expect((await step('owner', '/releases', { label: '0.9' })).body.error.code).toBe('label-not-newer');
    const res = await step('owner', '/releases', { label: '1.1' });
    expect(res.status).toBe(201);
    expect(res.body.release).toMatchObject({ label: '1.1', revision: second });
    const list = await as(h.app, cast.people.knitter, 'get', `${base}/releases`);
    expect(list.body.releases.map((r: { label: string }) => r.label)).toEqual(['1.1', '1.0']);
  });

  it('released revisions are frozen: release rows refuse updates and deletes, in the model and in the database', async () => {
    const row = (await Release.findOne({ where: { patternId: cast.patternId, label: '1.0' } }))!;
    row.label = '9.9';
    await expect(row.save()).rejects.toThrow(/frozen/);
    await expect(row.destroy()).rejects.toThrow(/frozen/);
    await expect(h.sequelize.query('UPDATE releases SET revisionNumber = 2 WHERE id = ?', { replacements: [row.id] })).rejects.toThrow(/frozen/);
    await expect(h.sequelize.query('DELETE FROM releases WHERE id = ?', { replacements: [row.id] })).rejects.toThrow(/frozen/);
    await expect(h.sequelize.query('UPDATE revisions SET source = ? WHERE patternId = ? AND number = 1', { replacements: ['changed', cast.patternId] })).rejects.toThrow(/immutable/);
    const [kept] = await h.sequelize.query<{ label: string; revisionNumber: number }>('SELECT label, revisionNumber FROM releases WHERE id = ?', { replacements: [row.id], type: QueryTypes.SELECT });
    expect(kept).toEqual({ label: '1.0', revisionNumber: 1 });
  });

  it('the review log lists every step in order for the owner and editor only', async () => {
    const log = await as(h.app, cast.people.editor, 'get', `${base}/review`);
    expect(log.status).toBe(200);
    const events = log.body.events as { event: string; from: string; to: string }[];
    expect(events.map((e) => e.event)).toEqual([
      'submit', 'approve', 'submit', 'request-changes', 'submit', 'withdraw', 'submit', 'approve', 'release', 'submit', 'approve', 'release',
    ]);
    // Each step starts where the one before ended.
    for (let i = 1; i < events.length; i++) expect(events[i]!.from).toBe(events[i - 1]!.to);
    expect(log.body.editors).toEqual([{ id: cast.people.editor.id, name: cast.people.editor.name }]);
    expect((await as(h.app, cast.people.knitter, 'get', `${base}/review`)).status).toBe(403);
    expect((await as(h.app, cast.people.stranger, 'get', `${base}/review`)).status).toBe(404);
  });

  it('POST /status uses the same machine: an editor\'s "draft" asks for changes, a release without a label gets the next one', async () => {
    await step('owner', '/status', { status: 'in-review' });
    const changes = await step('editor', '/status', { status: 'draft', message: 'One more look at the thumb.' });
    expect(changes.body.pattern.status).toBe('changes-requested');
    await step('owner', '/status', { status: 'in-review' });
    await step('editor', '/status', { status: 'approved', revision: 2 });
    // Revision 2 is released as 1.1 already; approve a fresh one.
    const third = await saveRevision(h.app, cast, sampleSource('third'), 'third');
    await step('owner', '/status', { status: 'in-review' });
    await step('editor', '/status', { status: 'approved', revision: third });
    const released = await step('owner', '/status', { status: 'released' });
    expect(released.status).toBe(200);
    expect(released.body.release).toMatchObject({ label: '1.2', revision: third });
    expect((await step('editor', '/status', { status: 'released' })).status).toBe(403);
  });
});

describe('races and mail texts', () => {
  it('two releases at once: the pattern row lock lets exactly one through', async () => {
    const n = await saveRevision(h.app, cast, sampleSource('race'), 'race');
    await step('owner', '/review/request');
    await step('editor', '/review/approve', { revision: n });
    const [a, b] = await Promise.all([step('owner', '/releases', { label: '2.0' }), step('owner', '/releases', { label: '2.1' })]);
    expect([a.status, b.status].sort()).toEqual([201, 400]);
    expect(await Release.count({ where: { patternId: cast.patternId, revisionNumber: n } })).toBe(1);
  });

  it('escapes the pattern title and messages in the HTML of review mails', async () => {
    const created = await as(h.app, cast.people.owner, 'post', '/api/patterns').send({ title: 'Cowl <b>bold</b> & "quotes"', source: sampleSource() });
    const id = created.body.pattern.id as number;
    await Membership.create({ patternId: id, userId: cast.people.editor.id, role: 'editor' });
    await as(h.app, cast.people.owner, 'post', `/api/patterns/${id}/review/request`).send({ message: '<script>alert(1)</script>' });
    const mail = h.smtp.list().find((m) => m.to.includes(cast.people.editor.email) && m.subject.includes('<b>bold</b>'));
    expect(mail).toBeDefined();
    expect(mail!.html).not.toContain('<b>bold</b>');
    expect(mail!.html).toContain('&lt;b&gt;bold&lt;/b&gt; &amp; &quot;quotes&quot;');
    expect(mail!.html).not.toContain('<script>');
  });
});

describe('comment threads', () => {
  it('comments on a round are answered and resolved by the owner and editor; knitters may not', async () => {
    const c = await step('editor', '/revisions/2/comments', { body: 'Round 14: the count after the set-up looks off.', round: 14 });
    expect(c.status).toBe(201);
    expect(c.body.comment).toMatchObject({ round: 14, parentId: null, kind: 'comment', resolved: false });
    const root = c.body.comment.id as number;
    const reply = await step('owner', `/comments/${root}/replies`, { body: 'Fixed in the next revision.' });
    expect(reply.status).toBe(201);
    expect(reply.body.comment).toMatchObject({ parentId: root, round: 14, revision: 2, author: { id: cast.people.owner.id } });
    const nested = await step('editor', `/comments/${reply.body.comment.id}/replies`, { body: 'Thanks.' });
    expect(nested.body.comment.parentId).toBe(root); // threads are one level deep
    expect((await step('owner', `/comments/${root}/replies`, { body: '   ' })).status).toBe(400);
    expect((await step('knitter', `/comments/${root}/replies`, { body: 'me too' })).status).toBe(403);
    expect((await step('owner', '/comments/999999999/replies', { body: 'x' })).status).toBe(404);

    // Resolving through a reply resolves its thread.
    const resolved = await as(h.app, cast.people.owner, 'patch', `${base}/comments/${nested.body.comment.id}`).send({ resolved: true });
    expect(resolved.body.comment).toMatchObject({ id: root, resolved: true });
    const list = await as(h.app, cast.people.editor, 'get', `${base}/revisions/2/comments`);
    const thread = (list.body.comments as { id: number; parentId: number | null; resolved: boolean }[]).filter((x) => x.id === root || x.parentId === root);
    expect(thread).toHaveLength(3);
    expect(thread.find((x) => x.id === root)!.resolved).toBe(true);
  });

  it('a comment on a line span of a revision keeps its lines in replies', async () => {
    const c = await step('editor', '/revisions/1/comments', { body: 'Wording of these lines.', fromLine: 3, toLine: 5 });
    const reply = await step('owner', `/comments/${c.body.comment.id}/replies`, { body: 'Reworded.' });
    expect(reply.body.comment).toMatchObject({ fromLine: 3, toLine: 5, revision: 1 });
  });
});
