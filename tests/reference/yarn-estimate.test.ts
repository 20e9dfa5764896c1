// Checks for shared/measure/yarn-estimate.ts. references.md gives no yarn
// amounts, so the model itself is not a reference value: its constants (loop
// length x stitches per cm = 3.8, x rows per cm = 5.0, relaxed plain knit) are
// from memory of the textile literature and the output is labelled an
// estimate. What is checked against outside sources here: unit conversions
// (convert-units: m -> yd, cm -> in, g -> oz) and the swatch arithmetic.
import convert from 'convert-units';
import { describe, expect, it } from 'vitest';
import { METRES_PER_YARD, calibrateFromSwatch, estimateYarn, normalizeGauge } from '../../shared/measure';

const gauge = normalizeGauge({ stitches: 28, rows: 36, per: '10cm' });

function expectMatchesOracle(actual: number, oracle: number): void {
  // convert-units goes through a 3.28084 ft/m ratio: agreement to about 1e-6 relative.
  expect(Math.abs(actual - oracle)).toBeLessThanOrEqual(Math.abs(oracle) * 1e-6);
}

describe('yarn estimate units (convert-units oracle)', () => {
  it('1 yd = 0.9144 m exactly (international yard; convert-units agrees)', () => {
    expect(METRES_PER_YARD).toBe(0.9144);
    expectMatchesOracle(METRES_PER_YARD, convert(1).from('yd').to('m'));
  });

  it('yards reported agree with convert-units for each yarn', () => {
    const outcome = estimateYarn(
      [
        { yarn: 'A', stitches: 9000, floatStitches: 2500 },
        { yarn: 'B', stitches: 4200, floatStitches: 6100 },
      ],
      gauge,
    );
    if (!outcome.ok) throw new Error(outcome.problem.message);
    for (const a of outcome.value.amounts) {
      expectMatchesOracle(a.yards, convert(a.metres).from('m').to('yd'));
      expectMatchesOracle(a.yardsWithAllowance, convert(a.metresWithAllowance).from('m').to('yd'));
    }
  });

  it('a swatch measured in inches of yarn calibrates the same as in cm (convert-units)', () => {
    const inches = calibrateFromSwatch({ stitches: 600, yarnLength: { value: 400, unit: 'in' } });
    const cm = calibrateFromSwatch({ stitches: 600, yarnLength: { value: convert(400).from('in').to('cm'), unit: 'cm' } });
    if (!inches.ok || !cm.ok) throw new Error('calibration failed');
    expectMatchesOracle(inches.value.cmPerStitch, cm.value.cmPerStitch);
  });

  it('a swatch weighed in grams: 12 g of a 400 m per 100 g yarn is 48 m (ball-band arithmetic; oz by convert-units)', () => {
    const outcome = calibrateFromSwatch({ stitches: 2400, weightGrams: 12, metresPer100g: 400 });
    if (!outcome.ok) throw new Error(outcome.problem.message);
    expect(outcome.value.cmPerStitch * 2400).toBeCloseTo(4800, 9);
    // The same swatch weighed in ounces and converted back gives the same length.
    const ounces = convert(12).from('g').to('oz');
    const again = calibrateFromSwatch({ stitches: 2400, weightGrams: convert(ounces).from('oz').to('g'), metresPer100g: 400 });
    if (!again.ok) throw new Error(again.problem.message);
    expectMatchesOracle(again.value.cmPerStitch, outcome.value.cmPerStitch);
  });

  it('is always labelled an estimate and states its assumption', () => {
    const outcome = estimateYarn([{ yarn: 'A', stitches: 100 }], gauge);
    expect(outcome.ok && outcome.value.isEstimate).toBe(true);
    expect(outcome.ok && outcome.value.model.assumption).toMatch(/^Estimate: .* cm of yarn per stitch/);
  });
});
