/**
 * Numbers of the renderers against outside sources:
 * - the counts in the written instructions agree with the checker's round
 *   list as the command line prints it (notation.md "The command line");
 * - worked examples of even shaping (references.md "Spacing shaping
 *   evenly") come out with the published counts in the instructions;
 * - finished sizes and float lengths: hand calculation from gauge, checked
 *   against the general-purpose units library convert-units (1 in = 2.54 cm,
 *   references.md "Standards: Unit definition");
 * - the yarn weight category of each demo gauge (Craft Yarn Council,
 *   Standard Yarn Weight System, references.md).
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import { compile, toCheckJson } from '../../shared/index.ts';
import { formatInstructionsText, summarize, writeInstructions } from '../../shared/render/index.ts';
import { parseInstructionCounts } from '../shared/render/parse-back.ts';

const read = (f: string) => readFileSync(join(import.meta.dirname, '../../examples', f), 'utf8');
const DEMOS = ['tidepool-cowl.loop', 'lantern-mitts.loop', 'quarry-tote-panel.loop'];

// convert-units goes through a 3.28084 ft/m ratio: it agrees with the exact inch to about 1e-7 relative.
const close = (a: number, b: number) => expect(Math.abs(a - b)).toBeLessThanOrEqual(Math.abs(b) * 1e-6 + 1e-12);

describe('instructions counts agree with the checker (notation.md, the CLI round list)', () => {
  for (const f of DEMOS) {
    it(`${f}, every size`, () => {
      const source = read(f);
      const result = compile(source);
      const json = toCheckJson(result);
      for (const s of json.sizes) {
        const parsed = parseInstructionCounts(formatInstructionsText(writeInstructions(source, result, s.name)!));
        expect(parsed.rounds).toEqual(s.rounds.map((r) => ({ number: r.number, front: r.front, backing: r.backing, total: r.total })));
      }
    });
  }
});

describe('even shaping worked examples (references.md "Spacing shaping evenly")', () => {
  const head = 'gauge 28 sts and 32 rounds per 10 cm\n';
  it('80 sts: k3, k2tog, (k6, k2tog) 9 times, k3 = 70 sts', () => {
    const src = `${head}cast on 80\nround 1: k3, k2tog, (k6, k2tog) 9 times, k3`;
    expect(formatInstructionsText(writeInstructions(src, compile(src))!)).toContain('Rnd 1: K3, k2tog, [k6, k2tog] 9 times, k3. (70 sts)');
  });
  it('74 sts: p2, [p2tog three times, p1] 10 times, p2 = 44 sts', () => {
    const src = `${head}cast on 74\nround 1: p2, ((p2tog) 3 times, p1) 10 times, p2`;
    expect(formatInstructionsText(writeInstructions(src, compile(src))!)).toMatch(/Rnd 1: P2, \[\[p2tog\] 3 times, p1\] 10 times, p2\. \(44 sts\)/);
  });
});

describe('finished sizes from gauge (hand calculation; convert-units as oracle)', () => {
  it('Tidepool Cowl S: 168 sts at 28 sts per 10 cm is 60 cm around; 44 rounds at 32 per 10 cm is 13.75 cm', () => {
    const sum = summarize(compile(read('tidepool-cowl.loop')));
    const s = sum.sizes.find((x) => x.name === 'S')!;
    expect(s.mainFrontStitches).toBe(168);
    close(s.finished!.width.cm, (168 / 28) * 10);
    close(s.finished!.width.in, convert((168 / 28) * 10).from('cm').to('in'));
    expect(s.roundsWorked).toBe(44);
    close(s.finished!.length.cm, (44 / 32) * 10);
    close(s.finished!.length.in, convert((44 / 32) * 10).from('cm').to('in'));
  });

  it('Quarry Tote panel: 40 sts at 20 sts per 4 in is 8 in wide', () => {
    const s = summarize(compile(read('quarry-tote-panel.loop'))).sizes[0];
    expect(s.finished!.widthKind).toBe('width');
    close(s.finished!.width.in, 8);
    close(s.finished!.width.cm, convert(8).from('in').to('cm'));
  });

  it('float lengths: stitches over stitches per cm, in cm and in', () => {
    const src = 'gauge 28 sts and 32 rounds per 10 cm\nyarn A "Harbour" #1d3557\nyarn B "Sea Foam" #cfe8e0\ncast on 40 in A\nround 1: (k 9 in A, k 1 in B) to end';
    const sum = summarize(compile(src));
    const f = sum.sizes[0].floats.find((x) => x.yarn === 'B')!;
    expect(f.stitches).toBe(9);
    close(f.length!.cm, 9 / 2.8);
    close(f.length!.in, convert(9 / 2.8).from('cm').to('in'));
    // 1 in limit at 7.11 sts/in is 7 sts (references.md: catch floats longer than about 1 in; common practice).
    expect(sum.floatLimitStitches).toBe(7);
    expect(f.isOverLimit).toBe(true);
  });
});

describe('yarn weight of the demo gauges (Craft Yarn Council Standard Yarn Weight System)', () => {
  it('28 sts per 10 cm = 28.45 per 4 in: 1 Super Fine (27–32)', () => {
    const w = summarize(compile(read('tidepool-cowl.loop'))).yarnWeight!;
    expect(w.matches.map((m) => m.category.number)).toEqual([1]);
    close(w.stitchesPer4In, 28 * 1.016);
  });
  it('20 sts per 4 in: 4 Medium (16–20)', () => {
    const w = summarize(compile(read('quarry-tote-panel.loop'))).yarnWeight!;
    expect(w.matches.map((m) => m.category.number)).toEqual([4]);
  });
  it('32 sts per 10 cm = 32.51 per 4 in: between 1 Super Fine (to 32) and 0 Lace (from 33)', () => {
    const w = summarize(compile(read('lantern-mitts.loop'))).yarnWeight!;
    expect(w.isOutsideAllRanges).toBe(true);
    expect(w.neighbours.map((n) => n.category.number).sort()).toEqual([0, 1]);
  });
});
