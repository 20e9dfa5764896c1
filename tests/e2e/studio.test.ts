/**
 * Browser tests of the studio's main flows, in Debian's Chromium against the
 * real app and database:
 * - sign in as the demo designer, open a pattern, break a round's count and
 *   see the problem with the right round and size, fix it and see it clear,
 *   save, reload and see the revision;
 * - a stale save from a second tab meets a 409, shows the newer revision
 *   beside the designer's text, and "keep mine" saves on top of it.
 *
 * Stitch arithmetic of the test pattern (common practice, e.g. published
 * abbreviation lists): k and p use one stitch and make one; m1 makes one
 * from none. So (k4, m1) worked 21/24/27 times uses 84/96/108 stitches and
 * leaves 105/120/135.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { compile } from '../../shared/index.ts';
import { DESIGNER, replaceEditorLine, shot, signIn, startHarness, type Harness } from './harness.ts';

const SOURCE = [
  'title "Tidepool Cowl"',
  'designer "Maren Tolley"',
  'sizes S M L',
  'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Sea lavender" #6a5397',
  'yarn B "Foam" #eeeae0',
  'work in the round',
  'cast on 84/96/108 in A',
  'rounds 1-4: (k1, p1) to end',
  'round 5: (k4, m1) 21/24/27 times',
  'round 6: k to end',
  'rounds 7-10: (k3 in A, k2 in B) to end',
  '',
].join('\n');
const ROUND5_LINE = 10;

/**
 * A flat panel with two yarns of nearly the same grey and a 10- and a
 * 20-stitch run of one colour: at 22 sts per 10 cm (2.2 per cm) 10 sts are
 * about 4.5 cm, longer than the 1 in (2.54 cm) float limit (common practice:
 * catch floats longer than about an inch).
 */
const TOTE = [
  'title "Quarry Tote panel"', 'sizes One', 'gauge 22 sts and 30 rows per 10 cm',
  'yarn A "Slate" #5a6470', 'yarn B "Shale" #5e6873', 'yarn C "Sand" #d9c7a0', 'work flat', 'cast on 30 in A',
  'rows 1-2: (k3 in A, k2 in B) to end', 'row 3: k10 in C, k20 in A', '',
].join('\n');

let h: Harness;
let token: string;

/** A fresh pattern for one test, owned by the demo designer. */
async function newPattern(title: string, source = SOURCE): Promise<number> {
  const res = await h.api<{ pattern: { id: number } }>(token, 'POST', '/api/patterns', { title, source });
  expect(res.status).toBe(201);
  return res.body.pattern.id;
}

/** Opens a pattern's workspace (signing in first if the browser has no session) and waits for its first check. */
async function openPattern(page: Page, id: number, status: RegExp = /Adds up/): Promise<void> {
  await page.goto(`${h.baseUrl}/patterns/${id}`);
  if (page.url().includes('/sign-in') || (await page.getByRole('button', { name: 'Sign in' }).count()) > 0) {
    await page.getByLabel('E-mail').fill(DESIGNER.email);
    await page.getByLabel('Password').fill(DESIGNER.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
  }
  await page.locator('.cm-content').waitFor();
  await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 15_000 }).toMatch(status);
}

beforeAll(async () => {
  h = await startHarness();
  token = await h.apiToken(DESIGNER.email, DESIGNER.password);
}, 180_000);

afterAll(async () => {
  await h?.stop();
});

describe('the studio in Chromium', () => {
  it('finds a broken round in the right size, clears it when fixed, saves and shows the revision after a reload', async () => {
    const title = `Tidepool Cowl ${Date.now()}`;
    const id = await newPattern(title);
    const page = await h.context.newPage();
    await signIn(page, h.baseUrl);
    await shot(page, '01-library');

    await page.getByRole('link', { name: title }).click();
    await page.waitForURL(new RegExp(`/patterns/${id}$`));
    await page.locator('.cm-content').waitFor();
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 15_000 }).toContain('Adds up in 3 sizes');
    // The counts pane shows the count after round 5 for every size: 105/120/135.
    const round5 = page.getByRole('row', { name: /^Round 5/ });
    await expect.poll(() => round5.textContent()).toMatch(/105.*120.*135/);
    await shot(page, '02-workspace-clean');

    // Size L now works 26 × 4 = 104 of its 108 stitches.
    await replaceEditorLine(page, ROUND5_LINE, 'round 5: (k4, m1) 21/24/26 times');
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 10_000 }).toMatch(/error/);
    await page.getByRole('tab', { name: /Problems/ }).click();
    const problems = page.getByRole('list', { name: 'Problems' }).getByRole('listitem');
    await expect.poll(() => problems.count()).toBeGreaterThan(0);
    const first = problems.first();
    const problemText = (await first.textContent()) ?? '';
    expect(problemText).toContain('round 5');
    expect(problemText).toContain('104');
    expect(problemText).toContain('108');
    expect(problemText).toContain('size L');
    // Sizes S and M still add up: no problem names them.
    const all = (await problems.allTextContents()).join('\n');
    expect(all).not.toMatch(/size [SM]\b/);
    await expect.poll(() => page.locator('.lw-lint-marker-error').count()).toBeGreaterThan(0);
    expect(await page.locator('.cm-lintRange-error').first().textContent()).toBeTruthy();
    await shot(page, '03-workspace-problem');

    // Clicking the problem moves the cursor to round 5's line.
    await first.getByRole('button').first().click();
    const activeLine = await page.locator('.cm-activeLine').textContent();
    expect(activeLine).toContain('round 5');

    await replaceEditorLine(page, ROUND5_LINE, 'round 5: (k4, m1) 21/24/27 times  # even increases');
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 10_000 }).toContain('Adds up');
    await expect.poll(() => problems.count()).toBe(0);
    expect(await page.getByTestId('unsaved').isVisible()).toBe(true);

    // The chart follows the text: round 6 of size M has 120 stitches; worked
    // in yarn B (#eeeae0) they are drawn in B's colour.
    await page.keyboard.press('Alt+3');
    const chart = page.getByTestId('chart');
    await page.getByRole('group', { name: 'Size' }).getByRole('button', { name: 'M', exact: true }).click();
    await expect.poll(() => chart.locator('svg title').textContent(), { timeout: 10_000 }).toContain('size M');
    const round6 = chart.locator('g[data-round="6"] > [data-stitch]');
    await expect.poll(() => round6.count()).toBe(120);
    expect(await chart.locator('g[data-round="6"] > [fill="#eeeae0"]').count()).toBe(0);
    await replaceEditorLine(page, 11, 'round 6: k to end in B');
    await expect.poll(() => chart.locator('g[data-round="6"] > [fill="#eeeae0"]').count(), { timeout: 10_000 }).toBe(120);
    // The cursor is on round 6's line: its stitches are outlined.
    await expect.poll(() => chart.locator('g[data-round="6"] > .lw-here').count()).toBe(120);
    await shot(page, '03b-chart');
    // Clicking a stitch of round 6 moves the editor to its line.
    await page.locator('.cm-content').click();
    await page.keyboard.press('Control+Home');
    await round6.first().click();
    expect(await page.locator('.cm-activeLine').textContent()).toContain('round 6: k to end in B');

    // The written instructions of size M follow too: 24 repeats on round 5,
    // 96 + 24 = 120 sts after it, round 6 worked with B.
    await page.keyboard.press('Alt+4');
    const instructions = page.getByTestId('instructions');
    await page.getByRole('group', { name: 'Size' }).getByRole('button', { name: 'M', exact: true }).click();
    await expect.poll(() => instructions.textContent(), { timeout: 10_000 }).toContain('Size M');
    const text = (await instructions.textContent()) ?? '';
    expect(text).toContain('Cast on 96 sts');
    expect(text).toMatch(/Rnd 5:.*24 times.*\(120 sts\)/);
    expect(text).toMatch(/Rnd 6:.*with B/);
    await shot(page, '03c-instructions');

    await page.keyboard.press('Control+s');
    const dialog = page.getByRole('dialog', { name: 'Save a revision' });
    await dialog.getByLabel('What changed?').fill('Note on the even increases');
    await dialog.getByRole('button', { name: 'Save revision' }).click();
    await page.getByText('Saved as revision #2.').waitFor();
    expect(await page.getByTestId('unsaved').count()).toBe(0);

    await page.reload();
    await page.locator('.cm-content').waitFor();
    await expect.poll(() => page.getByTestId('revision-line').textContent()).toContain('Revision #2 by Maren Tolley');
    expect(await page.getByTestId('revision-line').textContent()).toContain('Note on the even increases');
    expect(await page.locator('.cm-content').textContent()).toContain('# even increases');
    expect(await page.getByTestId('unsaved').count()).toBe(0);

    const revisions = await h.api<{ revisions: { number: number }[] }>(token, 'GET', `/api/patterns/${id}/revisions`);
    expect(revisions.body.revisions.map((r) => r.number).sort()).toEqual([1, 2]);
    await page.close();
  }, 120_000);

  it('meets a save from a second tab with a comparison, and keeps the designer’s text on top of the newer revision', async () => {
    const id = await newPattern(`Lantern Mitts ${Date.now()}`);
    const first = await h.context.newPage();
    await openPattern(first, id);
    const second = await h.context.newPage();
    await openPattern(second, id);

    await replaceEditorLine(second, ROUND5_LINE, 'round 5: (k4, m1) 21/24/27 times  # from the second tab');
    await second.getByRole('button', { name: 'Save…' }).click();
    await second.getByRole('dialog', { name: 'Save a revision' }).getByLabel('What changed?').fill('Second tab');
    await second.getByRole('button', { name: 'Save revision' }).click();
    await second.getByText('Saved as revision #2.').waitFor();

    await first.bringToFront();
    await replaceEditorLine(first, 11, 'round 6: k to end  # from the first tab');
    await first.getByRole('button', { name: 'Save…' }).click();
    await first.getByRole('dialog', { name: 'Save a revision' }).getByLabel('What changed?').fill('First tab');
    await first.getByRole('button', { name: 'Save revision' }).click();

    const conflict = first.getByRole('dialog', { name: /Revision #2 was saved while you were editing/ });
    await conflict.waitFor();
    expect(await conflict.getByRole('region', { name: 'Your version' }).textContent()).toContain('# from the first tab');
    expect(await conflict.getByRole('region', { name: 'Revision 2' }).textContent()).toContain('# from the second tab');
    await shot(first, '04-conflict');

    await conflict.getByRole('button', { name: /Keep mine and save on top of #2/ }).click();
    await first.getByText('Saved as revision #3.').waitFor();

    const latest = await h.api<{ latestRevision: { number: number; source: string } }>(token, 'GET', `/api/patterns/${id}`);
    expect(latest.body.latestRevision.number).toBe(3);
    expect(latest.body.latestRevision.source).toContain('# from the first tab');
    const two = await h.api<{ revision: { source: string } }>(token, 'GET', `/api/patterns/${id}/revisions/2`);
    expect(two.body.revision.source).toContain('# from the second tab');
    await first.close();
    await second.close();
  }, 120_000);

  it('shows the same problems in the browser as the compiler reports on the server, long floats and too-alike colours included', async () => {
    const id = await newPattern(`Quarry Tote panel ${Date.now()}`, TOTE);
    const page = await h.context.newPage();
    await openPattern(page, id, /warning/);
    await page.keyboard.press('Alt+2');
    const items = page.getByRole('list', { name: 'Problems' }).getByRole('listitem');
    const expected = compile(TOTE).diagnostics;
    expect(expected.map((d) => d.code).sort()).toEqual(['LW501', 'LW501', 'LW502']);
    await expect.poll(() => items.count()).toBe(expected.length);
    const shown = (await items.allTextContents()).join('\n');
    for (const d of expected) {
      const message = d.size ? d.message.replace(` (size ${d.size})`, '') : d.message;
      expect(shown).toContain(message);
      expect(shown).toContain(d.code);
    }
    // The counts pane flags the 20-stitch float of row 3 (size One).
    await page.keyboard.press('Alt+1');
    const row3 = page.getByRole('row', { name: /^Row 3/ });
    await expect.poll(() => row3.textContent()).toContain('20 C');
    await shot(page, '05-floats-and-colours');
    await page.close();
  }, 120_000);

  it('imports a .loop file from the library, keeps unsaved text across a reload and warns before leaving', async () => {
    const page = await h.context.newPage();
    await page.goto(`${h.baseUrl}/patterns`);
    await page.getByRole('button', { name: 'Import .loop file' }).waitFor();
    await page.locator('input[type="file"]').setInputFiles({ name: 'quarry-tote-panel.loop', mimeType: 'text/plain', buffer: Buffer.from(TOTE) });
    await page.waitForURL(/\/patterns\/\d+$/);
    const id = Number(page.url().split('/').pop());
    await page.locator('.cm-content').waitFor();
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 15_000 }).toMatch(/warning/);

    await replaceEditorLine(page, 10, 'row 3: k10 in C, k10 in A, k10 in C');
    await expect.poll(() => page.evaluate((key) => localStorage.getItem(key), `loopwright:draft:${id}`)).toContain('k10 in A, k10 in C');

    const dialogs: string[] = [];
    page.on('dialog', (d) => { dialogs.push(d.type()); void d.accept(); });
    await page.reload();
    await page.locator('.cm-content').waitFor();
    expect(dialogs).toContain('beforeunload');
    await page.getByText('Restored your unsaved changes').waitFor();
    expect(await page.locator('.cm-content').textContent()).toContain('row 3: k10 in C, k10 in A, k10 in C');
    expect(await page.getByTestId('unsaved').isVisible()).toBe(true);
    await shot(page, '08-restored-draft');

    // The server still has only the imported revision.
    const latest = await h.api<{ latestRevision: { number: number; source: string } }>(token, 'GET', `/api/patterns/${id}`);
    expect(latest.body.latestRevision.number).toBe(1);
    expect(latest.body.latestRevision.source).not.toContain('k10 in A, k10 in C');
    await page.close();
  }, 120_000);

  it('fixes long floats with the backing-stitch planner from the summary pane', async () => {
    // 12 sts of A between the B stitches: at 28 sts per 10 cm that is about
    // 4.3 cm, over the 1 in (2.54 cm) limit (common practice: catch floats
    // longer than about an inch).
    const FLOATS = [
      'title "Tidepool Cowl"', 'sizes S M L', 'gauge 28 sts and 32 rounds per 10 cm', 'yarn A "Sea lavender" #6a5397', 'yarn B "Foam" #eeeae0',
      'work in the round', 'cast on 84/98/112 in A', 'rounds 1-4: (k1, p1) to end', 'rounds 5-12: (k12 in A, k2 in B) to end', 'rounds 13-14: k to end in A', '',
    ].join('\n');
    const id = await newPattern(`Tidepool Cowl floats ${Date.now()}`, FLOATS);
    const page = await h.context.newPage();
    await openPattern(page, id, /3 warnings/);
    await page.keyboard.press('Alt+5');
    const summary = page.getByTestId('summary');
    await expect.poll(() => summary.textContent(), { timeout: 15_000 }).toContain('over the limit');
    await summary.getByLabel('First round').fill('5');
    await summary.getByLabel('Last round').fill('13');
    await summary.getByRole('button', { name: 'Propose columns' }).click();
    await summary.getByText('every float in the range is within the limit').waitFor({ timeout: 15_000 });
    await shot(page, '09-planner');
    await summary.getByRole('button', { name: 'Insert into the source' }).click();
    await expect.poll(() => page.locator('.cm-content').textContent()).toContain('ladder B columns');
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 10_000 }).toContain('Adds up in 3 sizes');
    await page.close();
  }, 120_000);

  it('offers a quick fix where the compiler names the exact word, and applying it clears the problem', async () => {
    const TYPO = [
      'title "Lantern Mitts"', 'sizes S M L', 'gauge 32 sts and 36 rounds per 10 cm', 'yarn A "Lamp Black" #2b2622', 'yarn Gold "Lantern Gold" #e0a526',
      'work in the round', 'cast on 56/64/72 in A', 'rounds 1-4: (k2, p2) to end', 'round 5: k to end in Gild', '',
    ].join('\n');
    const id = await newPattern(`Lantern Mitts typo ${Date.now()}`, TYPO);
    const page = await h.context.newPage();
    await openPattern(page, id, /error/);
    await page.keyboard.press('Alt+2');
    const problem = page.getByRole('list', { name: 'Problems' }).getByRole('listitem').filter({ hasText: 'LW202' });
    expect(await problem.textContent()).toContain('Gild');
    await problem.getByRole('button', { name: /Fix: Replace “Gild” with “Gold”/ }).click();
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 10_000 }).toContain('Adds up in 3 sizes');
    expect(await page.locator('.cm-content').textContent()).toContain('round 5: k to end in Gold');

    // Plain typing: Enter starts a line, Backspace deletes, and the new round is checked.
    await page.locator('.cm-content').click();
    await page.keyboard.press('Control+End');
    await page.keyboard.type('round 6: k to endd');
    await page.keyboard.press('Escape');
    await page.keyboard.press('Backspace');
    await page.keyboard.press('Enter');
    await page.keyboard.type('round 7: k to end');
    await page.keyboard.press('Escape');
    await expect.poll(() => page.locator('.cm-line').filter({ hasText: /^round [67]: k to end$/ }).count(), { timeout: 10_000 }).toBe(2);
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 10_000 }).toContain('Adds up in 3 sizes');
    await page.keyboard.press('Alt+1');
    await expect.poll(() => page.getByRole('row', { name: /^Round 7/ }).count()).toBe(1);
    await page.close();
  }, 120_000);

  it('takes the newer revision on a conflict without losing the designer’s text, which can be brought back', async () => {
    const id = await newPattern(`Lantern Mitts conflict ${Date.now()}`);
    const mine = await h.context.newPage();
    await openPattern(mine, id);
    const theirs = await h.context.newPage();
    await openPattern(theirs, id);
    await replaceEditorLine(theirs, 11, 'round 6: k to end  # theirs');
    await theirs.keyboard.press('Control+s');
    await theirs.getByRole('dialog', { name: 'Save a revision' }).getByLabel('What changed?').fill('Theirs');
    await theirs.getByRole('button', { name: 'Save revision' }).click();
    await theirs.getByText('Saved as revision #2.').waitFor();

    await mine.bringToFront();
    await replaceEditorLine(mine, 11, 'round 6: k to end  # mine');
    await mine.keyboard.press('Control+s');
    await mine.getByRole('dialog', { name: 'Save a revision' }).getByLabel('What changed?').fill('Mine');
    await mine.getByRole('button', { name: 'Save revision' }).click();
    const conflict = mine.getByRole('dialog', { name: /Revision #2 was saved while you were editing/ });
    await conflict.getByRole('button', { name: /Take revision #2/ }).click();
    await expect.poll(() => mine.locator('.cm-content').textContent()).toContain('# theirs');
    expect(await mine.getByTestId('revision-line').textContent()).toContain('Revision #2');
    expect(await mine.getByTestId('unsaved').count()).toBe(0);
    expect(await mine.evaluate((key) => localStorage.getItem(key), `loopwright:set-aside:${id}`)).toContain('# mine');

    await mine.getByRole('button', { name: 'Bring my version back' }).click();
    await expect.poll(() => mine.locator('.cm-content').textContent()).toContain('# mine');
    expect(await mine.getByTestId('unsaved').isVisible()).toBe(true);
    await mine.close();
    await theirs.close();
  }, 120_000);
});
