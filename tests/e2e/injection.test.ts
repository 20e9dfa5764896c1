/**
 * Script and SVG injection in the browser (issue 8, security): a pattern
 * whose title, designer, yarn name, round note, revision message and review
 * comment are markup that would run code if a view put it into the page as
 * HTML. The designer opens it in the library, every pane of the studio
 * (counts, problems, chart front and back, instructions, summary), the
 * review page (the revision message) and the comparison page (the comment).
 * No view may turn the markup into elements (the test looks for the
 * elements each payload would make), nothing may run (every payload sets
 * `window.__lwInjected` when it executes; dialogs are watched too), and the
 * texts must still be shown, as text. (Payload forms are the usual ones of
 * the OWASP XSS Filter Evasion Cheat Sheet, from memory: script elements,
 * event-handler attributes on img and svg, javascript: URLs, and breaking
 * out of an SVG text element.)
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESIGNER, shot, signIn, startHarness, type Harness } from './harness.ts';

const RUN = "window.__lwInjected=(window.__lwInjected||0)+1";
const HOSTILE = {
  title: `<img src=x onerror='${RUN}'>Harbour hat`,
  designer: `<script>${RUN}</script>`,
  yarnLabel: `</text><script>${RUN}</script><text>Foam`,
  note: `<svg onload='${RUN}'></svg> & <a href='javascript:${RUN}'>check</a>`,
  comment: `<img src=x onerror='${RUN}'> round 2 reads oddly`,
  message: `<script>${RUN}</script>second look`,
};

const SOURCE = [
  `title "${HOSTILE.title}"`,
  `designer "${HOSTILE.designer}"`,
  'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Harbour" #1d3557',
  `yarn B "${HOSTILE.yarnLabel}" #cfe8e0`,
  'work in the round',
  'cast on 16 in A',
  'ladder B every 4 from round 2 to 4 close ssk',
  'chart dots:',
  '  key "." A',
  '  key "x" B',
  '  |.x..|',
  `round 1: k to end note "${HOSTILE.note}"`,
  'rounds 2-4: chart dots',
  '',
].join('\n');

let h: Harness;
let token: string;

beforeAll(async () => {
  h = await startHarness();
  token = await h.apiToken(DESIGNER.email, DESIGNER.password);
}, 180_000);

afterAll(async () => {
  await h?.stop();
});

describe('markup in titles, notes, yarn names and comments', () => {
  it('is shown as text in the library, every studio pane and the review page, and never runs', async () => {
    const created = await h.api<{ pattern: { id: number } }>(token, 'POST', '/api/patterns', { title: HOSTILE.title, source: SOURCE });
    expect(created.status).toBe(201);
    const id = created.body.pattern.id;
    // A second revision whose message is markup too, and a comment on it.
    const second = await h.api(token, 'POST', `/api/patterns/${id}/revisions`, { source: `${SOURCE}# second look\n`, baseRevision: 1, message: HOSTILE.message });
    expect(second.status).toBe(201);
    const comment = await h.api(token, 'POST', `/api/patterns/${id}/revisions/2/comments`, { body: HOSTILE.comment });
    expect(comment.status).toBe(201);

    const page = await h.context.newPage();
    const dialogs: string[] = [];
    page.on('dialog', (d) => { dialogs.push(d.message()); void d.dismiss(); });
    const ran = () => page.evaluate(() => (window as unknown as { __lwInjected?: number }).__lwInjected ?? 0);
    // Elements the payloads would make if a view put them into the page as HTML (or SVG).
    const made = () => page.evaluate(() => document.querySelectorAll(
      'img[src="x"], [onerror], [onload], a[href^="javascript:"], iframe, foreignObject',
    ).length + [...document.scripts].filter((s) => s.textContent?.includes('__lwInjected')).length);
    const inert = async (where: string) => {
      expect(await made(), `${where}: elements made from the markup`).toBe(0);
      expect(await ran(), `${where}: payloads that ran`).toBe(0);
    };

    await signIn(page, h.baseUrl);
    // The library lists the title as text, markup and all.
    await page.getByText(HOSTILE.title).first().waitFor();
    await inert('library');

    await page.goto(`${h.baseUrl}/patterns/${id}`);
    await page.locator('.cm-content').waitFor();
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 15_000 }).toMatch(/\w/);
    for (const key of ['Alt+1', 'Alt+2', 'Alt+3', 'Alt+4', 'Alt+5']) {
      await page.keyboard.press(key);
      await page.waitForTimeout(500);
      await inert(`studio pane ${key}`);
    }
    // The chart (front, then back) is drawn; the yarn's label is in it as text.
    await page.keyboard.press('Alt+3');
    const chart = page.getByTestId('chart');
    await expect.poll(() => chart.locator('svg').count(), { timeout: 15_000 }).toBeGreaterThan(0);
    const back = chart.getByRole('button', { name: /back/i });
    if (await back.count()) {
      await back.first().click();
      await page.waitForTimeout(500);
    }
    await page.keyboard.press('Alt+4');
    await expect.poll(() => page.getByText(/check/).count(), { timeout: 15_000 }).toBeGreaterThan(0);
    await shot(page, '12-injection-studio');
    await inert('studio chart and instructions');

    // The review page: the revision history shows the message as text.
    await page.goto(`${h.baseUrl}/patterns/${id}/review`);
    await page.getByText(HOSTILE.message).first().waitFor({ timeout: 15_000 });
    await inert('review page');
    // The comparison of the two revisions: the comment thread shows the comment as text.
    await page.goto(`${h.baseUrl}/patterns/${id}/review/diff?from=1&to=2`);
    await page.getByText(HOSTILE.comment).first().waitFor({ timeout: 15_000 });
    await shot(page, '13-injection-review');

    await inert('comparison page');
    expect(dialogs).toEqual([]);

    // Control: the same markup put into the page as HTML is found by the check above, so it
    // can fail. It still does not run: the app's Content-Security-Policy (helmet's defaults,
    // server/app.ts) forbids inline handlers and scripts, a second line of defence.
    await page.evaluate((html) => { const d = document.createElement('div'); d.innerHTML = html; document.body.append(d); }, HOSTILE.title);
    expect(await made()).toBe(1);
    await page.waitForTimeout(500);
    expect(await ran()).toBe(0);
    await page.close();
  }, 120_000);
});
