/**
 * The `item` header line: the summary compares the finished size with body
 * measurements when the pattern says what it makes. Body ranges from
 * ../shared/references.md ("Sizing": hand circumference around the knuckles,
 * woman 6–7.5 in, man 7.5–9 in, child 5.5–6 in; a size guide following the
 * Craft Yarn Council's body measurements).
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';
import { summarize } from '../../shared/render/index.ts';

const root = path.resolve(import.meta.dirname, '..', '..');
const mitts = readFileSync(path.join(root, 'examples', 'lantern-mitts.loop'), 'utf8');

describe('item line', () => {
  it('item mitts makes the header a hand item and the summary compares against hand circumferences', () => {
    const result = compile(mitts, { size: 'S' });
    expect(result.header.item).toBe('hand');
    const summary = summarize(result);
    const body = summary.sizes[0].body;
    expect(body?.item).toBe('hand');
    // Size S: 56 sts at 32 sts per 10 cm = 17.5 cm = 6.89 in, inside the woman range 6–7.5 in (references.md).
    const woman = body?.comparisons.find((c) => c.body.wearer === 'woman');
    expect(woman?.body.minIn).toBe(6);
    expect(woman?.body.maxIn).toBe(7.5);
    expect(woman?.finished.in).toBeCloseTo(17.5 / 2.54, 2);
    expect(body?.suits).toContain('woman');
    expect(summary.gaps.join(' ')).not.toContain('does not say what the item is');
  });

  it('without an item line there is no comparison, and the summary says how to add one', () => {
    const result = compile(mitts.replace('item mitts\n', ''), { size: 'S' });
    expect(result.header.item).toBeNull();
    const summary = summarize(result);
    expect(summary.sizes[0].body).toBeNull();
    expect(summary.gaps.join(' ')).toContain('item hat');
  });

  it('hat words are hats; other words are LW214 and no item', () => {
    expect(compile('item beanie\ncast on 10\nround 1: k to end\n').header.item).toBe('hat');
    const cowl = compile('item cowl\ncast on 10\nround 1: k to end\n');
    expect(cowl.header.item).toBeNull();
    expect(cowl.diagnostics.map((d) => d.code)).toContain('LW214');
  });
});
