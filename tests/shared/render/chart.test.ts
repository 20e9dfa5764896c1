import { describe, expect, it } from 'vitest';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { hex as wcagHex } from 'wcag-contrast';
import { buildChart, renderBackSvg, renderChartSvg, escapeXml, type ChartModel } from '../../../shared/render/index.ts';
import { compiled, demo, HEADER } from './helpers.ts';

function cellsOf(model: ChartModel) {
  return model.rows.flatMap((r) => r.cells.filter((c) => c !== null));
}

describe('chart model', () => {
  it('every row is as wide as the chart and holds exactly the stitches on the needle (plus bind-offs)', () => {
    for (const file of ['tidepool-cowl.loop', 'lantern-mitts.loop', 'quarry-tote-panel.loop']) {
      const { result } = demo(file);
      for (const size of result.sizes) {
        const model = buildChart(result, size.name)!;
        model.rows.forEach((row, i) => {
          const rec = size.stitches.rounds[i];
          expect(row.cells.length).toBe(model.width);
          const stitches = row.cells.filter((c) => c && !c.isBoundOff);
          expect(stitches.length, `${file} ${size.name} round ${row.number}`).toBe(rec.count);
          const seen = new Set(stitches.map((c) => c!.stitch));
          expect(seen.size).toBe(rec.count);
          const bound = row.cells.filter((c) => c?.isBoundOff).length;
          expect(bound).toBe(Math.max(0, rec.start - consumedBy(rec.offset, rec.count, size.stitches)));
        });
      }
    }
  });

  it('a decrease leaves a no-stitch cell above it and columns stay aligned', () => {
    const { result } = compiled(`${HEADER}\ncast on 8 in A\nround 1: k to end\nround 2: (k2, k2tog) to end\nround 3: k to end`);
    const model = buildChart(result)!;
    expect(model.width).toBe(8);
    expect(model.rows[1].cells.filter((c) => c === null).length).toBe(2);
    expect(model.rows[1].cells.filter((c) => c?.symbol === 'k2tog').length).toBe(2);
    // Round 3's stitches sit exactly above round 2's.
    model.rows[2].cells.forEach((c, x) => expect(c === null).toBe(model.rows[1].cells[x] === null));
    expect(model.legend).toContain('no-stitch');
  });

  it('an increase opens a new column with no-stitch cells below it', () => {
    const { result } = compiled(`${HEADER}\ncast on 6 in A\nround 1: k to end\nround 2: k3, m1l, k to end\nround 3: k to end`);
    const model = buildChart(result)!;
    expect(model.width).toBe(7);
    expect(model.rows[0].cells.filter((c) => c === null).length).toBe(1);
    const x = model.rows[1].cells.findIndex((c) => c?.symbol === 'm1l');
    expect(model.rows[0].cells[x]).toBeNull();
    expect(model.rows[2].cells[x]?.symbol).toBe('knit');
  });

  it('the legend lists only the symbols used', () => {
    const { result } = compiled(`${HEADER}\ncast on 8 in A\nround 1: (k1, p1) to end\nround 2: k to end`);
    expect(buildChart(result)!.legend).toEqual(['knit', 'purl']);
  });

  it('every stitch cell keeps the span of the source that produced it', () => {
    const { source, result } = demo('lantern-mitts.loop');
    const model = buildChart(result, 'M')!;
    for (const c of cellsOf(model)) {
      expect(c.span).not.toBeNull();
      expect(c.span!.to).toBeGreaterThan(c.span!.from);
      expect(c.span!.to).toBeLessThanOrEqual(source.length);
    }
    // A cell worked from the lantern chart points into the chart block.
    const texts = model.rows[13].cells.filter((c) => c && !c.isBacking).map((c) => source.slice(c!.span!.from, c!.span!.to));
    expect(texts.some((t) => /^\|[.x ]+\|$/.test(t))).toBe(true);
    expect(texts.some((t) => t === 'k1 in B')).toBe(true);
  });

  it('symbol ink is the one of black and white that contrasts more with the yarn (checked with wcag-contrast)', () => {
    const { result } = demo('tidepool-cowl.loop');
    for (const c of cellsOf(buildChart(result, 'S')!)) {
      const onBlack = wcagHex(c.colour, '#000000'), onWhite = wcagHex(c.colour, '#ffffff');
      expect(c.ink).toBe(onBlack >= onWhite ? '#000000' : '#ffffff');
      expect(Math.max(onBlack, onWhite)).toBeGreaterThanOrEqual(4.5);
    }
  });

  it('floats over the limit are flagged in the back view (checker agrees)', () => {
    const { result } = compiled(`${HEADER}\ncast on 40 in A\nrounds 1-2: (k 9 in A, k 1 in B) to end`);
    const model = buildChart(result)!;
    const over = model.rows.flatMap((r) => r.floats.filter((f) => f.isOverLimit));
    expect(over.length).toBe(8);
    expect(over.every((f) => f.yarn === 'B' && f.stitches === 9)).toBe(true);
    expect(result.diagnostics.some((d) => d.code === 'LW501')).toBe(true);
    const svg = renderBackSvg(model);
    expect(svg.match(/class="float over-limit"/g)?.length).toBe(8);
  });
});

describe('chart SVG', () => {
  it('is well-formed for every demo size, front and back (fast-xml-parser)', () => {
    for (const file of ['tidepool-cowl.loop', 'lantern-mitts.loop', 'quarry-tote-panel.loop']) {
      const { result } = demo(file);
      for (const s of result.sizes) {
        const model = buildChart(result, s.name)!;
        expect(XMLValidator.validate(renderChartSvg(model))).toBe(true);
        expect(XMLValidator.validate(renderBackSvg(model))).toBe(true);
      }
    }
  });

  it('escapes text from the source (title, yarn labels)', () => {
    const src = 'title "Fish & <Chips> \\"quoted\\" it\'s"\ngauge 28 sts and 32 rounds per 10 cm\nyarn A "Salt & <Pepper>" #1d3557\ncast on 4 in A\nround 1: k to end';
    const { result } = compiled(src);
    const svg = renderChartSvg(buildChart(result)!);
    expect(XMLValidator.validate(svg)).toBe(true);
    const parsed = new XMLParser({ ignoreAttributes: false }).parse(svg);
    expect(String(parsed.svg.title)).toContain('<Chips>');
    expect(svg).toContain('Salt &amp; &lt;Pepper&gt;');
    expect(escapeXml('a\u0001b')).toBe('ab');
  });

  it('carries data-from/data-to on every stitch cell and data-round on each row', () => {
    const { result } = demo('tidepool-cowl.loop');
    const model = buildChart(result, 'S')!;
    const svg = renderChartSvg(model);
    const cells = cellsOf(model).filter((c) => !c.isBoundOff).length;
    expect(svg.match(/data-stitch="/g)?.length).toBe(cells);
    expect(svg.match(/data-from="\d+" data-to="\d+"/g)?.length).toBeGreaterThanOrEqual(cells);
    expect(svg.match(/<g class="row" data-round="/g)?.length).toBe(model.rows.length);
  });
});

/** Input stitches the stored outputs of a round consumed (STITCHES consumes per operation worked). */
function consumedBy(offset: number, count: number, level: ReturnType<typeof demo>['result']['sizes'][number]['stitches']): number {
  let total = 0;
  for (let i = offset; i < offset + count;) {
    const info = level.ops[level.store.op[i]];
    let group = 1;
    while (info.produces > 1 && group < info.produces && i + group < offset + count && level.store.op[i + group] === level.store.op[i] && level.store.src[i + group] === level.store.src[i]) group++;
    total += info.consumes;
    i += group;
  }
  return total;
}

describe('property: chart of any valid generated pattern', () => {
  it('rows hold exactly the stitches on the needle, columns are shared, the SVG is well-formed', async () => {
    const fc = (await import('fast-check')).default;
    const { buildSource, patternGen } = await import('./gen.ts');
    const { compile } = await import('../../../shared/index.ts');
    let checked = 0;
    fc.assert(fc.property(patternGen, (p) => {
      const result = compile(buildSource(p));
      if (!result.ok) return true;
      checked++;
      const size = result.sizes[0];
      const model = buildChart(result)!;
      model.rows.forEach((row, i) => {
        expect(row.cells.length).toBe(model.width);
        expect(row.cells.filter((c) => c && !c.isBoundOff).length).toBe(size.stitches.rounds[i].count);
      });
      // A column with no stitch in any round can only be a cast-on stitch taken by a decrease in round 1.
      const empty = Array.from({ length: model.width }, (_, x) => x).filter((x) => model.rows.every((r) => r.cells[x] === null)).length;
      expect(empty).toBeLessThanOrEqual(size.castOn);
      expect(XMLValidator.validate(renderChartSvg(model))).toBe(true);
      expect(XMLValidator.validate(renderBackSvg(model))).toBe(true);
      return true;
    }), { numRuns: 60, seed: 7 });
    expect(checked).toBeGreaterThan(30);
  });
});
