import { describe, expect, it } from 'vitest';
import { compile } from '../../../shared/index.ts';
import { formatSummaryText, summarize } from '../../../shared/render/index.ts';
import { demo } from './helpers.ts';

describe('summary', () => {
  it('lists every size with its per-round counts as the checker has them', () => {
    const { result } = demo('lantern-mitts.loop');
    const sum = summarize(result);
    expect(sum.sizes.map((s) => s.name)).toEqual(['S', 'M', 'L']);
    sum.sizes.forEach((s, i) => expect(s.rounds).toEqual(result.sizes[i].rounds.map(({ number, side, front, backing, total }) => ({ number, side, front, backing, total }))));
  });

  it('estimates yarn per colour, labelled an estimate with its assumption, and a swatch recalibrates it', () => {
    const { result } = demo('tidepool-cowl.loop');
    const plain = summarize(result);
    const s = plain.sizes[0].yarn!;
    expect(s.isEstimate).toBe(true);
    expect(s.amounts.map((a) => a.yarn)).toEqual(['A', 'B']);
    // Every stitch put on the needle is a loop in its yarn: the cast-on plus every round's stitches (rounds may share store slices).
    const size = result.sizes[0];
    expect(s.amounts.reduce((n, a) => n + a.stitches, 0)).toBe(size.castOn + size.rounds.reduce((n, r) => n + r.total, 0));
    expect(plain.yarnAssumption).toMatch(/per stitch/);
    // A swatch using twice the modelled yarn per stitch doubles the loop part of the estimate.
    const per = s.model.cmPerStitch;
    const calibrated = summarize(result, { swatch: { stitches: 1000, yarnLength: { value: 2 * per * 1000, unit: 'cm' } } });
    const a0 = s.amounts[0], a1 = calibrated.sizes[0].yarn!.amounts[0];
    expect(a1.metres).toBeGreaterThan(a0.metres * 1.5);
    expect(formatSummaryText(plain)).toContain('Yarn estimate: an estimate, not a measurement.');
  });

  it('compares with body measurements only when told what the item is, and says so otherwise', () => {
    const { source, result } = demo('lantern-mitts.loop');
    // The demo says `item mitts`; without that line there is no comparison.
    const bare = compile(source.replace('item mitts\n', ''));
    expect(summarize(bare).sizes[0].body).toBeNull();
    expect(summarize(bare).gaps.join(' ')).toMatch(/does not say what the item is/);
    const withItem = summarize(result);
    // 64 sts at 32 sts per 10 cm = 20 cm = 7.87 in: inside the man's 7.5-9 in range, negative ease at the middle.
    const m = withItem.sizes.find((s) => s.name === 'M')!;
    expect(m.body!.comparisons.map((c) => c.body.wearer)).toEqual(['child', 'woman', 'man']);
    expect(m.body!.suits).toContain('man');
  });

  it('states the cautions of the trade as general guidance deferring to local rules', () => {
    const sum = summarize(demo('quarry-tote-panel.loop').result);
    expect(sum.cautions.join(' ')).toMatch(/fibre content/);
    expect(sum.cautions.join(' ')).toMatch(/baby or a toddler/);
    expect(sum.cautions.join(' ')).toMatch(/local rules/);
  });

  it('without a gauge gives counts but no lengths, estimate or float lengths', () => {
    const sum = summarize(compile('yarn A "Harbour" #1d3557\ncast on 10 in A\nround 1: k to end'));
    expect(sum.gauge).toBeNull();
    expect(sum.sizes[0].finished).toBeNull();
    expect(sum.sizes[0].yarn).toBeNull();
    expect(sum.sizes[0].rounds).toHaveLength(1);
    expect(sum.gaps[0]).toMatch(/No usable gauge/);
  });
});
