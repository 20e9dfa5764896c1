// Edge cases and properties of shared/measure/colour.ts.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_ALIKE_THRESHOLD,
  colourDifference,
  VISIONS,
  colourDifferenceFor,
  coloursTooAlike,
  contrastRatio,
  findAlikeColours,
  parseYarnColour,
  simulateVision,
  suggestColourName,
  symbolInk,
} from '../../../shared/measure';

const hexColour = fc.integer({ min: 0, max: 0xffffff }).map((n) => `#${n.toString(16).padStart(6, '0')}`);

describe('parseYarnColour', () => {
  it.each([
    ['#abc', '#aabbcc'],
    ['#ABCDEF', '#abcdef'],
    ['  #2f6f73 ', '#2f6f73'],
    ['Navy', '#000080'],
    ['rebeccapurple', '#663399'],
  ])('reads %s as %s', (input, hex) => {
    const outcome = parseYarnColour(input);
    expect(outcome.ok && outcome.value.hex).toBe(hex);
  });

  it('keeps the name and the RGB channels', () => {
    const outcome = parseYarnColour('teal');
    expect(outcome.ok && outcome.value).toEqual({ input: 'teal', hex: '#008080', rgb: { r: 0, g: 128, b: 128 }, name: 'teal' });
  });

  it.each(['', 'rgb(0, 0, 0)', 'hsl(10 20% 30%)', '#abcd', '#12345', '#gggggg', 'transparent', 'toString', '__proto__'])(
    'refuses %j with a message naming the accepted forms',
    (input) => {
      const outcome = parseYarnColour(input);
      expect(outcome.ok).toBe(false);
      if (!outcome.ok) {
        expect(outcome.problem.code).toBe('colour-unknown');
        expect(outcome.problem.message).toContain('#rrggbb');
      }
    },
  );

  it('suggests the nearest colour name for a typo', () => {
    const outcome = parseYarnColour('tael');
    expect(!outcome.ok && outcome.problem.message).toContain('did you mean "teal"?');
    expect(suggestColourName('lightgoldenrodyelow')).toBe('lightgoldenrodyellow');
    expect(suggestColourName('qqqqqq')).toBeNull();
  });

  it('never throws on any string (property)', () => {
    fc.assert(fc.property(fc.string(), (s) => void parseYarnColour(s)));
  });
});

describe('colour difference and "too alike"', () => {
  it('is zero for a colour and itself and symmetric (property)', () => {
    fc.assert(
      fc.property(hexColour, hexColour, (a, b) => {
        expect(colourDifference(a, a)).toBeCloseTo(0, 9);
        expect(colourDifference(a, b)).toBeCloseTo(colourDifference(b, a), 6);
        expect(colourDifference(a, b)).toBeGreaterThanOrEqual(0);
      }),
    );
  });

  it('uses a strict "below the threshold" test', () => {
    const d = colourDifference('#2f6f73', '#3a7d6e');
    expect(coloursTooAlike('#2f6f73', '#3a7d6e', d)).toBe(false);
    expect(coloursTooAlike('#2f6f73', '#3a7d6e', d + 1e-6)).toBe(true);
  });

  it('flags near-identical yarns with the default threshold of 10 and passes a clear contrast', () => {
    expect(DEFAULT_ALIKE_THRESHOLD).toBe(10);
    expect(coloursTooAlike('#f4efe6', '#efe8d8')).toBe(true);
    expect(coloursTooAlike('#f4efe6', '#1f3a5f')).toBe(false);
  });

  it('throws on an unparsable colour string (callers validate first)', () => {
    expect(() => colourDifference('nope', '#000')).toThrow(RangeError);
  });

  it('lists alike pairs most alike first and skips bad colours', () => {
    const pairs = findAlikeColours([
      { name: 'A', colour: '#f4efe6' },
      { name: 'B', colour: '#efe8d8' },
      { name: 'C', colour: '#1f3a5f' },
      { name: 'D', colour: 'not-a-colour' },
      { name: 'E', colour: '#f4efe6' },
    ]);
    expect(pairs.map((p) => `${p.first}${p.second}`)).toEqual(['AE', 'AB', 'BE']);
    expect(pairs[0].deltaE).toBeCloseTo(0, 9);
  });
});

describe('colour vision', () => {
  it('brown and olive green are clear to typical vision but too alike to a red-green colour-blind knitter', () => {
    expect(colourDifferenceFor('saddlebrown', 'darkolivegreen', 'typical')).toBeGreaterThan(DEFAULT_ALIKE_THRESHOLD);
    expect(colourDifferenceFor('saddlebrown', 'darkolivegreen', 'deuteranopia')).toBeLessThan(DEFAULT_ALIKE_THRESHOLD);
    const yarns = [
      { name: 'Bark', colour: 'saddlebrown' },
      { name: 'Moss', colour: 'darkolivegreen' },
    ];
    expect(findAlikeColours(yarns)).toEqual([]);
    const pairs = findAlikeColours(yarns, DEFAULT_ALIKE_THRESHOLD, VISIONS);
    expect(pairs).toHaveLength(1);
    expect(pairs[0].vision).toBe('deuteranopia');
    expect(pairs[0].deltaE).toBeCloseTo(colourDifferenceFor('saddlebrown', 'darkolivegreen', 'deuteranopia'), 9);
  });

  it('typical vision leaves a colour as it is; greys stay grey under every simulation (property)', () => {
    fc.assert(
      fc.property(hexColour, fc.integer({ min: 0, max: 255 }), (c, level) => {
        expect(simulateVision(c, 'typical')).toBe(c);
        const grey = `#${level.toString(16).padStart(2, '0').repeat(3)}`;
        for (const vision of VISIONS) expect(colourDifferenceFor(grey, simulateVision(grey, vision), 'typical')).toBeLessThan(1);
      }),
    );
  });
});

describe('contrast and symbol ink', () => {
  it('contrast is symmetric and between 1 and 21 (property)', () => {
    fc.assert(
      fc.property(hexColour, hexColour, (a, b) => {
        const c = contrastRatio(a, b);
        expect(c).toBeCloseTo(contrastRatio(b, a), 9);
        expect(c).toBeGreaterThanOrEqual(1 - 1e-9);
        expect(c).toBeLessThanOrEqual(21 + 1e-9);
      }),
    );
  });

  it('the chosen ink always reaches sqrt(21) and beats the other ink (property)', () => {
    fc.assert(
      fc.property(hexColour, (cell) => {
        const ink = symbolInk(cell);
        const other = contrastRatio(cell, ink.ink === 'black' ? '#ffffff' : '#000000');
        expect(ink.contrast).toBeGreaterThanOrEqual(Math.sqrt(21) - 1e-9);
        expect(ink.contrast).toBeGreaterThanOrEqual(other);
      }),
    );
  });

  it('white ink on navy, black on gold', () => {
    expect(symbolInk('navy').ink).toBe('white');
    expect(symbolInk('gold').hex).toBe('#000000');
  });
});
