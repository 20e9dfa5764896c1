/**
 * Browser test of review, release and the knitter's side, in Debian's
 * Chromium against the real app and database:
 * - the technical editor opens the changes of revision 2, sees round 6
 *   changed with its chart cells marked and round 11 added with its counts,
 *   comments on round 6 and approves;
 * - the designer answers the thread, resolves it and releases version 1.0;
 * - the knitter opens the release, picks a size, marks round 1 done (saved
 *   through the API) and exports a PDF (the download is a PDF file).
 *
 * Stitch arithmetic (common practice, e.g. published abbreviation lists):
 * k uses one stitch and makes one; k2tog uses two and makes one. Round 6
 * goes from all A to (k4 in A, k1 in B): 1 of every 5 stitches changes
 * yarn, so size S (105 sts) has 21 changed cells, exactly its B cells. Round 11, (k3, k2tog) over
 * 105/120/135, leaves 84/96/108.
 */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/db/seed.ts';
import { DESIGNER, shot, signIn, startHarness, type Harness } from './harness.ts';

const EDITOR = { email: 'editor@saltmarsh.example', password: DEMO_PASSWORD, name: 'Idris Penhale' };
const KNITTER = { email: 'knitter@saltmarsh.example', password: DEMO_PASSWORD, name: 'Sorrel Quayle' };

const HEAD = [
  'title "Tidepool Cowl"', 'designer "Maren Tolley"', 'sizes S M L', 'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Sea lavender" #6a5397', 'yarn B "Foam" #eeeae0', 'work in the round', 'cast on 84/96/108 in A',
  'rounds 1-4: (k1, p1) to end', 'round 5: (k4, m1) 21/24/27 times',
];
const REV1 = [...HEAD, 'round 6: k to end', 'rounds 7-10: (k3 in A, k2 in B) to end', ''].join('\n');
const REV2 = [...HEAD, 'round 6: (k4 in A, k1 in B) to end', 'rounds 7-10: (k3 in A, k2 in B) to end', 'round 11: (k3, k2tog) to end', ''].join('\n');

let h: Harness;
let designerToken: string;
let patternId: number;

/** Invites `email` to the pattern and accepts the mailed invitation (an existing account). */
async function invite(email: string, role: 'editor' | 'knitter'): Promise<void> {
  const res = await h.api<{ delivered: boolean }>(designerToken, 'POST', `/api/patterns/${patternId}/members`, { email, role });
  expect(res.status).toBe(201);
  const outbox = await h.api<{ messages: { to: string; links: string[] }[] }>(designerToken, 'GET', '/api/dev/outbox');
  const link = outbox.body.messages.find((m) => m.to.includes(email))?.links.find((l) => l.includes('/invitations/'));
  expect(link).toBeTruthy();
  const token = new URL(link as string).pathname.split('/').pop();
  const accepted = await h.api(designerToken, 'POST', `/api/invitations/${token}/accept`, {});
  expect(accepted.status).toBe(200);
}

/** A fresh page signed in as `who` (cookies of the previous person cleared). */
async function pageAs(who: { email: string; password: string; name: string }): Promise<Page> {
  await h.context.clearCookies();
  const page = await h.context.newPage();
  await signIn(page, h.baseUrl, who);
  return page;
}

beforeAll(async () => {
  h = await startHarness();
  designerToken = await h.apiToken(DESIGNER.email, DESIGNER.password);
  const created = await h.api<{ pattern: { id: number } }>(designerToken, 'POST', '/api/patterns', { title: `Tidepool Cowl review ${Date.now()}`, source: REV1 });
  expect(created.status).toBe(201);
  patternId = created.body.pattern.id;
  const saved = await h.api(designerToken, 'POST', `/api/patterns/${patternId}/revisions`, { source: REV2, baseRevision: 1, message: 'Wave starts on round 6; decrease round' });
  expect(saved.status).toBe(201);
  await invite(EDITOR.email, 'editor');
  await invite(KNITTER.email, 'knitter');
}, 180_000);

afterAll(async () => {
  await h?.stop();
});

describe('review, release and knitting in Chromium', () => {
  it('the editor comments on a changed round, the designer answers and releases, the knitter tracks and exports', async () => {
    // The designer asks for a review from the review page.
    const designer = await pageAs(DESIGNER);
    await designer.goto(`${h.baseUrl}/patterns/${patternId}/review`);
    await designer.getByLabel('Technical editor').selectOption({ label: EDITOR.name });
    await designer.getByRole('button', { name: 'Request review' }).click();
    await expect.poll(() => designer.getByTestId('review-status').textContent()).toMatch(/In review: revision #2 was sent to Idris Penhale/);
    await shot(designer, 'review-01-requested');
    await designer.close();

    // The editor opens the changes of revision 2.
    const editor = await pageAs(EDITOR);
    await editor.setViewportSize({ width: 1024, height: 768 }); // the narrowest width the studio supports
    await editor.goto(`${h.baseUrl}/patterns/${patternId}/review`);
    await editor.getByRole('link', { name: 'Changes in revision 2 since 1' }).click();
    await editor.waitForURL(/\/review\/diff\?from=1&to=2/);
    const rounds = editor.getByTestId('round-changes');
    const round6 = rounds.getByRole('row', { name: /^Round 6/ });
    await expect.poll(() => round6.textContent()).toContain('stitches');
    expect(await round6.textContent()).toContain('21 chart cells');
    // Round 11 is new: no old counts; new counts 84 front, 0 backing, 84 total in size S.
    const round11 = rounds.getByRole('row', { name: /^Round 11 added/ });
    expect(await round11.textContent()).toMatch(/—\s*84 · 0 · 84/);
    // The chart of revision 2 marks the 21 changed cells of round 6: the cells drawn in B (#eeeae0).
    const chart = editor.getByTestId('diff-chart');
    await expect.poll(() => chart.locator('.lw-diff-cell').count(), { timeout: 15_000 }).toBe(21);
    const marked = await chart.locator('.lw-diff-cell').evaluateAll((els) => els.map((e) => `${Number(e.getAttribute('x')) - 1},${Number(e.getAttribute('y')) - 1}`).sort());
    const inB = await chart.locator('g[data-round="6"] > [fill="#eeeae0"], g[data-round="6"] > g > use[fill="#eeeae0"]')
      .evaluateAll((els) => els.map((e) => `${e.getAttribute('x')},${e.getAttribute('y')}`).sort());
    expect(marked).toEqual(inB);
    // The line diff shows the changed source line on the new side.
    expect(await editor.getByTestId('text-diff').textContent()).toContain('round 6: (k4 in A, k1 in B) to end');

    await round6.getByRole('button', { name: 'Comment on round 6' }).click();
    const composer = editor.getByLabel('Comment on round 6 of revision #2');
    await expect.poll(() => composer.evaluate((el) => el === document.activeElement)).toBe(true);
    await composer.fill('Round 6 starts the wave a round early; is that meant?');
    await editor.getByRole('button', { name: 'Add comment' }).click();
    const thread = editor.getByTestId('thread').filter({ hasText: 'starts the wave' });
    await thread.waitFor();
    expect(await thread.textContent()).toContain('Round 6');
    await shot(editor, 'review-02-editor-diff');

    // A line of the new source takes a comment too (line 13 is the added round 11).
    await editor.getByRole('button', { name: 'Comment on line 13 of revision 2' }).click();
    await editor.getByLabel('Comment on line 13 of revision #2').fill('Say in words that this round decreases to 84/96/108.');
    await editor.getByRole('button', { name: 'Add comment' }).click();
    await expect.poll(() => editor.getByTestId('thread').filter({ hasText: 'decreases to' }).textContent()).toContain('Line 13');
    // Revision 1 on its own: its source lines, no changes.
    await editor.goto(`${h.baseUrl}/patterns/${patternId}/review/diff?from=1&to=1`);
    await expect.poll(() => editor.getByTestId('text-diff').textContent()).toContain('round 6: k to end');
    await shot(editor, 'review-02c-revision-1');

    await editor.getByRole('link', { name: 'All revisions' }).click();
    await editor.getByRole('button', { name: 'Approve revision #2' }).click();
    await expect.poll(() => editor.getByTestId('review-status').textContent()).toMatch(/Approved: revision #2/);
    await shot(editor, 'review-03-approved');
    await editor.close();

    // The designer answers, resolves and releases 1.0.
    const back = await pageAs(DESIGNER);
    await back.goto(`${h.baseUrl}/patterns/${patternId}/review/diff?from=1&to=2`);
    const t = back.getByTestId('thread').filter({ hasText: 'starts the wave' });
    await t.getByLabel(/Reply to Idris Penhale/).fill('Yes: the wave now begins on round 6 in every size.');
    await t.getByRole('button', { name: 'Reply' }).click();
    await expect.poll(() => t.textContent()).toContain('begins on round 6');
    await t.getByRole('button', { name: 'Resolve' }).click();
    await expect.poll(() => t.textContent()).toContain('Resolved');
    await shot(back, 'review-04-designer-answered');
    await back.getByRole('link', { name: 'All revisions' }).click();
    await expect.poll(() => back.getByLabel('Version label').inputValue()).toBe('1.0');
    await back.getByRole('button', { name: 'Release version 1.0' }).click();
    await expect.poll(() => back.getByTestId('review-status').textContent()).toMatch(/Released as version 1.0 \(revision #2\)/);
    expect(await back.getByTestId('revision-2').textContent()).toContain('Released 1.0');
    await shot(back, 'review-05-released');
    await back.close();

    // The knitter opens the pattern: the released version, size M.
    const knitter = await pageAs(KNITTER);
    await knitter.goto(`${h.baseUrl}/patterns/${patternId}`);
    await knitter.waitForURL(/\/knit/);
    await knitter.getByRole('group', { name: 'Size' }).getByRole('button', { name: 'Size M' }).click();
    const current = knitter.getByTestId('current-round');
    await expect.poll(() => current.textContent(), { timeout: 15_000 }).toContain('Round 1');
    await expect.poll(() => knitter.getByTestId('current-counts').textContent()).toContain('96 sts');
    await knitter.getByRole('button', { name: /Mark round 1 done/ }).click();
    await expect.poll(() => current.textContent()).toContain('Round 2');
    const knitterToken = await h.apiToken(KNITTER.email, KNITTER.password);
    await expect.poll(async () => (await h.api<{ progress: { roundsDone: number[]; currentRound: number } }>(knitterToken, 'GET', `/api/patterns/${patternId}/releases/1.0/progress?size=M`)).body.progress)
      .toMatchObject({ roundsDone: [1], currentRound: 2 });
    expect(await knitter.locator('[data-testid="knit-chart"] .lw-current-row').count()).toBe(1);
    await shot(knitter, 'review-06-knitter');

    // Slow down the job's progress answers (as a long export on a busy server
    // would be) so the progress bar can be seen.
    await knitter.route(/\/api\/exports\/[^/]+$/, async (route) => { await new Promise((r) => setTimeout(r, 700)); await route.continue(); });
    const download = knitter.waitForEvent('download', { timeout: 60_000 });
    await knitter.getByRole('button', { name: /Export the whole pattern as PDF, size M/ }).click();
    await knitter.getByRole('progressbar', { name: 'PDF export' }).waitFor();
    await shot(knitter, 'review-06b-exporting');
    const file = await download;
    expect(file.suggestedFilename()).toMatch(/\.pdf$/);
    const bytes = readFileSync(await file.path());
    // Every PDF file starts with the "%PDF-" header (ISO 32000-1, 7.5.2).
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    await expect.poll(() => knitter.getByTestId('export-done').textContent()).toContain('.pdf');
    await shot(knitter, 'review-07-exported');

    // An erratum on the current round reaches the designer as a comment on the released revision.
    await current.getByRole('button', { name: 'Report a problem' }).click();
    await knitter.getByLabel('What is wrong?').fill('Round 2 says k1, p1 but my swatch shows 96 sts; fine, just checking the rib.');
    await knitter.getByRole('button', { name: 'Send report' }).click();
    await expect.poll(() => knitter.getByText('the designer has your report on round 2').count()).toBe(1);
    const comments = await h.api<{ comments: { kind: string; round: number; size: string | null }[] }>(designerToken, 'GET', `/api/patterns/${patternId}/revisions/2/comments`);
    expect(comments.body.comments).toContainEqual(expect.objectContaining({ kind: 'erratum', round: 2, size: 'M' }));
    await knitter.close();
  }, 240_000);
});
