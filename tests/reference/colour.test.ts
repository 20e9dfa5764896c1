// Reference checks for shared/measure/colour.ts. CIEDE2000 is cross-checked
// against color-diff (an independent implementation listed in references.md,
// "General-purpose oracles"); WCAG contrast against wcag-contrast (same list).
import { diff as ciede2000, rgbaToLab } from 'color-diff';
import { hex as wcagHex } from 'wcag-contrast';
import { differenceCiede2000 } from 'culori';
import { describe, expect, it } from 'vitest';
import { colourDifference, contrastRatio, parseYarnColour, symbolInk } from '../../shared/measure';

function rgbOf(hex: string) {
  const parsed = parseYarnColour(hex);
  if (!parsed.ok) throw new Error(parsed.problem.message);
  return { R: parsed.value.rgb.r, G: parsed.value.rgb.g, B: parsed.value.rgb.b };
}

const PAIRS: [string, string][] = [
  ['#ff0000', '#fe0000'],
  ['#1f4e79', '#2e75b6'],
  ['#000080', '#000000'],
  ['#e0e0e0', '#ffffff'],
  ['#ffd700', '#ffa500'],
  ['#808000', '#6b8e23'],
  ['#2f6f73', '#3a7d6e'],
  ['#f4efe6', '#efe8d8'],
];

describe('CIEDE2000 (references.md oracles: color-diff)', () => {
  it.each(PAIRS)('ΔE00(%s, %s) agrees with color-diff to 0.01', (a, b) => {
    const oracle = ciede2000(rgbaToLab(rgbOf(a)), rgbaToLab(rgbOf(b)));
    expect(colourDifference(a, b)).toBeCloseTo(oracle, 2);
  });

  it('CSS names resolve to the same colour as their hex (navy = #000080, CSS Color 4 named colours)', () => {
    const oracle = ciede2000(rgbaToLab(rgbOf('#000080')), rgbaToLab(rgbOf('#000000')));
    expect(colourDifference('navy', 'black')).toBeCloseTo(oracle, 2);
  });
});

describe('the colour library we build on computes CIEDE2000 itself (not CIE76)', () => {
  // CIELAB pairs and ΔE00 from the CIEDE2000 supplementary test data (Sharma,
  // Wu and Dalal, 2005), pairs 1-3 — values from memory, so both culori (which
  // colour.ts calls) and color-diff (independent) are checked against them.
  it.each([
    [[50, 2.6772, -79.7751], [50, 0, -82.7485], 2.0425],
    [[50, 3.1571, -77.2803], [50, 0, -82.7485], 2.8615],
    [[50, 2.8361, -74.02], [50, 0, -82.7485], 3.4412],
  ])('Lab %j vs %j: ΔE00 %s', (p, q, expected) => {
    const culori = differenceCiede2000()({ mode: 'lab65', l: p[0], a: p[1], b: p[2] }, { mode: 'lab65', l: q[0], a: q[1], b: q[2] });
    expect(culori).toBeCloseTo(expected, 3);
    expect(ciede2000({ L: p[0], a: p[1], b: p[2] }, { L: q[0], a: q[1], b: q[2] })).toBeCloseTo(expected, 3);
  });
});

describe('WCAG 2 contrast ratio (references.md oracles: wcag-contrast)', () => {
  it('black on white is 21:1, the top of the WCAG scale (WCAG 2 definition, from memory; oracle agrees)', () => {
    expect(contrastRatio('#000000', '#ffffff')).toBeCloseTo(21, 6);
    expect(wcagHex('#000000', '#ffffff')).toBeCloseTo(21, 6);
  });

  it.each([...PAIRS, ['#777777', '#ffffff'] as [string, string]])('contrast(%s, %s) agrees with wcag-contrast to 0.01', (a, b) => {
    expect(contrastRatio(a, b)).toBeCloseTo(wcagHex(a, b), 2);
  });

  it.each(['#000080', '#ffd700', '#2f6f73', '#f4efe6', '#777777', '#c0392b', '#7f7f7f'])(
    'symbol ink on %s is the one wcag-contrast rates higher',
    (cell) => {
      const chosen = symbolInk(cell);
      const black = wcagHex(cell, '#000000');
      const white = wcagHex(cell, '#ffffff');
      expect(chosen.ink).toBe(black >= white ? 'black' : 'white');
      expect(chosen.contrast).toBeCloseTo(Math.max(black, white), 2);
    },
  );
});
