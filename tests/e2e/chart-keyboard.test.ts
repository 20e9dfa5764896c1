/**
 * The studio's chart by keyboard, in Chromium against the real app: the
 * chart is one tab stop (roving tabindex), a grid in the sense of the
 * WAI-ARIA Authoring Practices grid pattern (arrow keys, Home/End,
 * Ctrl+Home/Ctrl+End; Enter does what a click does) that states its size
 * with aria-rowcount/aria-colcount and each focused cell's place with
 * aria-rowindex/aria-colindex, each cell named by round, stitch, operation
 * and yarn, with a visible focus ring.
 *
 * Stitch arithmetic of the test pattern (common practice: rounds are read
 * from right to left, so stitch 1 is the rightmost cell; k2tog uses two
 * stitches and makes one): 12 stitches in size S; round 1 is (k1, p1), so
 * stitch 1 is k and stitch 2 is p; round 3 works stitches 1-2 in A and 3-4
 * in B; round 4 decreases to 9.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DESIGNER, shot, signIn, startHarness, type Harness } from './harness.ts';

const SOURCE = [
  'title "Tidepool Cowl swatch"',
  'sizes S M',
  'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Sea lavender" #6a5397',
  'yarn B "Foam" #eeeae0',
  'work in the round',
  'cast on 12/16 in A',
  'rounds 1-2: (k1, p1) to end',
  'round 3: (k2 in A, k2 in B) to end',
  'round 4: (k2tog, k2) 3/4 times',
  '',
].join('\n');

let h: Harness;

beforeAll(async () => {
  h = await startHarness();
}, 180_000);

afterAll(async () => {
  await h?.stop();
});

/** Accessible name of the focused element. */
const focusedName = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute('aria-label') ?? null);
const focusedRole = (page: Page) => page.evaluate(() => document.activeElement?.getAttribute('role') ?? null);

/** Tabs from the last chart control into the chart. */
async function tabIntoChart(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Zoom in' }).focus();
  await page.keyboard.press('Tab');
}

describe('chart cells by keyboard', () => {
  it('moves through the chart as a grid, names each cell, rings the focus and jumps to the source with Enter', async () => {
    const token = await h.apiToken(DESIGNER.email, DESIGNER.password);
    const created = await h.api<{ pattern: { id: number } }>(token, 'POST', '/api/patterns', { title: `Keyboard chart ${Date.now()}`, source: SOURCE });
    expect(created.status).toBe(201);
    const page = await h.context.newPage();
    await signIn(page, h.baseUrl);
    await page.goto(`${h.baseUrl}/patterns/${created.body.pattern.id}`);
    await page.locator('.cm-content').waitFor();
    await expect.poll(() => page.getByTestId('check-status').textContent(), { timeout: 15_000 }).toMatch(/Adds up/);
    await page.keyboard.press('Alt+3');
    const chart = page.getByTestId('chart');
    await expect.poll(() => chart.locator('svg title').textContent(), { timeout: 10_000 }).toContain('size S');

    // One grid, one tab stop in it.
    const grid = chart.getByRole('grid', { name: 'Chart of size S, front' });
    await grid.waitFor();
    expect(await chart.locator('[tabindex="0"]').count()).toBe(1);

    await tabIntoChart(page);
    expect(await focusedRole(page)).toBe('gridcell');
    // The full name comes with the grid's module (fetched once the chart is drawn and the page is idle).
    await expect.poll(() => focusedName(page)).toBe('Round 1, stitch 1: k, yarn A Sea lavender');
    // The grid gives its size (4 rounds x 12 columns) and the focused cell its place in it: row 1 is round 1,
    // columns count from the left, so stitch 1 (the rightmost, where rounds start) is column 12.
    expect(await grid.getAttribute('aria-rowcount')).toBe('4');
    expect(await grid.getAttribute('aria-colcount')).toBe('12');
    expect(await page.evaluate(() => [document.activeElement?.parentElement?.getAttribute('role'), document.activeElement?.parentElement?.getAttribute('aria-rowindex'), document.activeElement?.getAttribute('aria-colindex')]))
      .toEqual(['row', '1', '12']);

    // Left on screen is the next stitch of the round (read from the right).
    await page.keyboard.press('ArrowLeft');
    expect(await focusedName(page)).toBe('Round 1, stitch 2: p, yarn A Sea lavender');
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('ArrowUp');
    expect(await focusedName(page)).toBe('Round 3, stitch 2: k, yarn A Sea lavender');
    await page.keyboard.press('ArrowLeft');
    expect(await focusedName(page)).toBe('Round 3, stitch 3: k, yarn B Foam');
    // The description says what the symbol means and what Enter does.
    expect(await page.evaluate(() => document.activeElement?.getAttribute('aria-description'))).toMatch(/Enter: go to its line/);

    // The ring is drawn around the focused cell.
    const ring = await chart.getByTestId('chart-focus').boundingBox();
    const cell = await page.locator(':focus').boundingBox();
    expect(ring && cell).toBeTruthy();
    expect(ring!.x).toBeLessThanOrEqual(cell!.x);
    expect(ring!.y).toBeLessThanOrEqual(cell!.y);
    expect(ring!.x + ring!.width).toBeGreaterThanOrEqual(cell!.x + cell!.width);
    expect(ring!.y + ring!.height).toBeGreaterThanOrEqual(cell!.y + cell!.height);
    await shot(page, '03c-chart-keyboard');

    // Edges: Up stops at the top round; End and Home go to the ends of the row.
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('ArrowUp');
    expect(await focusedName(page)).toMatch(/^Round 4, /);
    await page.keyboard.press('End');
    const rightmost = await focusedName(page);
    await page.keyboard.press('ArrowRight');
    expect(await focusedName(page)).toBe(rightmost);
    await page.keyboard.press('Home');
    expect(await focusedName(page)).toMatch(/^Round 4, /);
    expect(await focusedName(page)).not.toBe(rightmost);
    await page.keyboard.press('Control+End');
    expect(await focusedName(page)).toBe('Round 1, stitch 1: k, yarn A Sea lavender');
    await page.keyboard.press('Control+Home');
    expect(await focusedName(page)).toMatch(/^Round 4, /);
    expect(await chart.locator('[tabindex="0"]').count()).toBe(1);

    // Enter does what a click does: the editor goes to the line that made the stitch.
    await page.keyboard.press('Control+End');
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('ArrowUp');
    await page.keyboard.press('Enter');
    await expect.poll(() => page.locator('.cm-activeLine').first().textContent()).toContain('round 3: (k2 in A, k2 in B)');
    expect(await page.evaluate(() => document.activeElement?.closest('.cm-editor') !== null)).toBe(true);

    // Coming back by Tab lands on the same cell (the tab stop stays where it was).
    await tabIntoChart(page);
    expect(await focusedName(page)).toBe('Round 3, stitch 1: k, yarn A Sea lavender');
    // Space works like Enter.
    await page.keyboard.press('ArrowDown');
    await page.keyboard.press(' ');
    await expect.poll(() => page.locator('.cm-activeLine').first().textContent()).toContain('rounds 1-2: (k1, p1)');

    // A click moves the tab stop too.
    await chart.locator('g[data-round="4"] > [data-stitch="1"]').click();
    await tabIntoChart(page);
    expect(await focusedName(page)).toMatch(/^Round 4, stitch 1: /);
    await page.close();
  }, 90_000);
});
