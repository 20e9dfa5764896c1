import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { buildSource, patternGen } from './gen.ts';
import { compile } from '../../../shared/index.ts';
import { formatInstructionsText, writeInstructions } from '../../../shared/render/index.ts';
import { compiled, demo, HEADER } from './helpers.ts';
import { parseInstructionCounts } from './parse-back.ts';

function text(source: string, size?: string): string {
  const result = compile(source);
  return formatInstructionsText(writeInstructions(source, result, size)!);
}

describe('written instructions', () => {
  it('groups consecutive identical rounds and gives the count only where it changes', () => {
    const src = `${HEADER}\ncast on 40 in A\nrounds 1-6: (k2, p2) to end\nround 7: (k8, k2tog) to end\nrounds 8-12: k to end`;
    const t = text(src);
    expect(t).toContain('Rnds 1–6: *k2, p2; rep from * to end.\n');
    expect(t).toContain('Rnd 7: *k8, k2tog; rep from * to end. (36 sts)\n');
    expect(t).toContain('Rnds 8–12: K to end.\n');
  });

  it('writes repeats as the trade does: brackets with a count, asterisks to a place', () => {
    const src = `${HEADER}\ncast on 24 in A\nround 1: (k2, p2) 6 times\nround 2: k1, (k2tog, yo) to last 1, k1\nround 3: ((k1, p1) twice, k2) to end`;
    const t = text(src.replace('twice', '2 times'));
    expect(t).toContain('Rnd 1: [k2, p2] 6 times.');
    expect(t).toContain('Rnd 2: K1, *k2tog, yo; rep from * to last 1 st, k1.');
    expect(t).toContain('Rnd 3: *[k1, p1] twice, k2; rep from * to end.');
  });

  it('writes the backing stitches out: set-up with the front yarn forward, working, closing; counts front + backing', () => {
    const src = `${HEADER}\ncast on 24 in A\nround 1: k to end\nladder B every 6 from round 2 to 5\nrounds 2-5: k to end in A`;
    const t = text(src);
    expect(t).toMatch(/Rnd 2: .*set up bst in B.*bring the front yarn forward, work a lifted increase in B behind it, take the front yarn back\. \(28 sts: 24 \+ 4 backing\)/);
    expect(t).toContain('after the 3rd front st and then after every 6th front st, to the 21st (4 bst)');
    expect(t).toMatch(/Rnds 3–4: .*Work each bst as you reach it \(front yarn forward, k the bst with B, front yarn back\)/);
    expect(t).toMatch(/Rnd 5: .*Close each bst as you reach it: k2tog it together with the front st after it\. \(24 sts\)/);
    expect(t).toMatch(/\n {2}bst: backing stitch/);
  });

  it('writes consecutive chart rows as one range and a repeated block once ("Rep rows ...")', () => {
    const { source: cowl, result: cr } = demo('tidepool-cowl.loop');
    expect(formatInstructionsText(writeInstructions(cowl, cr, 'M')!)).toContain('Rnds 11–16: Work rows 1–6 of chart wave to end, repeating it across.');
    const { source: tote, result: tr } = demo('quarry-tote-panel.loop');
    const t = formatInstructionsText(writeInstructions(tote, tr)!);
    expect(t).toContain('Row 11 (RS): [k5, work bst] 7 times, k to end.\nRow 12 (WS): [p5, work bst] 7 times, p to end.\nRows 13–22: Rep rows 11–12 5 more times.');
  });

  it('keeps round notes and lists only the abbreviations used in the key', () => {
    const src = `${HEADER}\ncast on 8 in A\nround 1: k to end note "change to the larger needle"\nround 2: p to end`;
    const ins = writeInstructions(src, compile(src))!;
    expect(ins.entries[0].note).toBe('change to the larger needle');
    expect(ins.key.map((k) => k.abbreviation).sort()).toEqual(['k', 'p', 'rnd', 'sts'].sort());
  });

  it('numbers flat rows with their side', () => {
    const { source, result } = demo('quarry-tote-panel.loop');
    const t = formatInstructionsText(writeInstructions(source, result)!);
    expect(t).toContain('Row 8 (WS): Sl1 wyif, p to end.');
    expect(t).toContain('Row 1 is a right-side (RS) row.');
  });

  it('gives each entry the span of its source line', () => {
    const { source, result } = compiled(`${HEADER}\ncast on 8 in A\nround 1: k to end\nround 2: p to end`);
    const ins = writeInstructions(source, result)!;
    expect(source.slice(ins.entries[1].span.from, ins.entries[1].span.to)).toBe('round 2: p to end');
  });
});

// Property: for any valid generated pattern, the counts read back from the
// written instructions are the checker's counts round by round.
describe('property: instructions read back agree with the checker', () => {
  it('for generated valid patterns', () => {
    let checked = 0;
    fc.assert(fc.property(patternGen, (p) => {
      const source = buildSource(p);
      const result = compile(source);
      if (!result.ok) return true; // only valid patterns are in scope (e.g. a ladder over a shaping round)
      checked++;
      const size = result.sizes[0];
      const parsed = parseInstructionCounts(formatInstructionsText(writeInstructions(source, result)!));
      expect(parsed.castOn).toBe(size.castOn);
      expect(parsed.rounds).toEqual(size.rounds.map((r) => ({ number: r.number, front: r.front, backing: r.backing, total: r.total })));
      return true;
    }), { numRuns: 150, seed: 20261201 });
    expect(checked).toBeGreaterThan(75);
  });
});
