/**
 * The renderers never throw on user input: demo sources cut, duplicated and
 * garbled at random still compile to some result, and every renderer turns
 * that result into output (charts stay well-formed).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { XMLValidator } from 'fast-xml-parser';
import { compile } from '../../../shared/index.ts';
import { buildChart, formatInstructionsText, formatSummaryText, planBacking, renderBackSvg, renderChartSvg, summarize, writeInstructions } from '../../../shared/render/index.ts';
import { demo } from './helpers.ts';

const sources = ['tidepool-cowl.loop', 'lantern-mitts.loop', 'quarry-tote-panel.loop'].map((f) => demo(f).source);

const mutated = fc.record({
  which: fc.integer({ min: 0, max: sources.length - 1 }),
  at: fc.nat(),
  cut: fc.integer({ min: 0, max: 400 }),
  insert: fc.constantFrom('', 'k2tog, ', 'raise B, ', 'close, ', 'bo 3, ', '(k1, yo) to end', '\nround 3: k 500', 'mark x, ', 'catch B, ', '&<"\'>', '\u0001'),
});

describe('renderers on damaged sources', () => {
  it('never throw and keep the SVG well-formed', () => {
    fc.assert(fc.property(mutated, ({ which, at, cut, insert }) => {
      const src = sources[which];
      const pos = at % (src.length + 1);
      const source = src.slice(0, pos) + insert + src.slice(pos + cut);
      const result = compile(source);
      for (const s of result.sizes.slice(0, 1)) {
        const model = buildChart(result, s.name);
        expect(model).not.toBeNull();
        expect(XMLValidator.validate(renderChartSvg(model!))).toBe(true);
        expect(XMLValidator.validate(renderBackSvg(model!))).toBe(true);
        expect(formatInstructionsText(writeInstructions(source, result, s.name)!)).toContain('Key');
      }
      expect(formatSummaryText(summarize(result))).toContain('Cautions');
      expect(typeof planBacking({ source, first: 2, last: 4 }).ok).toBe('boolean');
      return true;
    }), { numRuns: 12, seed: 11 });
  });
});
