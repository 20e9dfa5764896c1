/**
 * Yarn colours: parsing, perceived difference (CIEDE2000) and symbol ink.
 *
 * Colour maths comes from culori (parse, differenceCiede2000, wcagContrast);
 * this module only decides which inputs a pattern may use and what "too alike"
 * means for a chart.
 */
import {
  colorsNamed,
  differenceCiede2000,
  filterDeficiencyDeuter,
  filterDeficiencyProt,
  filterDeficiencyTrit,
  formatHex,
  parse,
  wcagContrast,
} from 'culori';
import type { MeasureOutcome } from './units';

/** A parsed yarn colour. Invariant: `hex` is lower-case "#rrggbb"; r, g, b are integers 0-255. */
export interface YarnColour {
  /** What the source said, trimmed. */
  readonly input: string;
  readonly hex: string;
  readonly rgb: { readonly r: number; readonly g: number; readonly b: number };
  /** The CSS colour name when the input was a name (lower case). */
  readonly name?: string;
}

/** A colour as the functions below accept it: a parsed colour or a string they parse. */
export type ColourInput = YarnColour | string;

const HEX_PATTERN = /^#(?:[0-9a-f]{3}|[0-9a-f]{6})$/i;
const NAMED: Readonly<Record<string, number>> = colorsNamed;
const NAMES = Object.keys(NAMED);

// Edit distance counting a swap of two neighbouring letters as one edit
// (optimal string alignment), since "tael" for "teal" is the usual slip.
function editDistance(a: string, b: string): number {
  const d: number[][] = Array.from({ length: a.length + 1 }, (_, i) =>
    Array.from({ length: b.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)),
  );
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}

/**
 * The CSS colour name closest to a misspelt one (edit distance, a swap of
 * neighbouring letters counting as one edit, at most 2, or 3 for inputs longer
 * than 8 letters), for a "did you mean" hint; null if none. Ties go to the
 * first name alphabetically.
 */
export function suggestColourName(input: string): string | null {
  const word = input.trim().toLowerCase();
  if (word === '') return null;
  let best: string | null = null;
  let bestDistance = word.length > 8 ? 3 : 2;
  for (const name of NAMES) {
    const d = editDistance(word, name);
    if (d < bestDistance || (d === bestDistance && best === null)) {
      best = name;
      bestDistance = d;
    }
  }
  return best;
}

/**
 * Parses a yarn colour written as #rgb, #rrggbb or a CSS colour name (any
 * case). Other CSS forms (rgb(), hsl(), alpha) are refused on purpose: a yarn
 * is opaque and the notation keeps one way to write a colour. Never throws.
 */
export function parseYarnColour(input: string): MeasureOutcome<YarnColour> {
  const text = typeof input === 'string' ? input.trim() : '';
  const lower = text.toLowerCase();
  let hexSource: string | null = null;
  let name: string | undefined;
  if (HEX_PATTERN.test(text)) {
    hexSource = lower;
  } else if (Object.hasOwn(NAMED, lower)) {
    hexSource = `#${NAMED[lower].toString(16).padStart(6, '0')}`;
    name = lower;
  }
  const parsed = hexSource === null ? undefined : parse(hexSource);
  if (hexSource === null || parsed === undefined) {
    const suggestion = suggestColourName(text);
    const hint = suggestion ? ` (did you mean "${suggestion}"?)` : '';
    return {
      ok: false,
      problem: {
        code: 'colour-unknown',
        message: `"${text}" is not a colour: write #rgb, #rrggbb or a CSS colour name${hint}`,
      },
    };
  }
  const hex = formatHex(parsed);
  const value = Number.parseInt(hex.slice(1), 16);
  const rgb = { r: (value >> 16) & 0xff, g: (value >> 8) & 0xff, b: value & 0xff };
  return { ok: true, value: name === undefined ? { input: text, hex, rgb } : { input: text, hex, rgb, name } };
}

function resolve(colour: ColourInput): YarnColour {
  if (typeof colour !== 'string') return colour;
  const outcome = parseYarnColour(colour);
  // Callers pass colours they have parsed or validated: a bad one is a programmer error.
  if (!outcome.ok) throw new RangeError(outcome.problem.message);
  return outcome.value;
}

const ciede2000 = differenceCiede2000();

/**
 * CIEDE2000 colour difference ΔE00 (kL = kC = kH = 1) between two colours, via
 * culori (CIELAB with the D65 white point). 0 means identical; about 1 is a
 * just-noticeable difference side by side; symmetric. Throws RangeError on
 * an unparsable string (validate with `parseYarnColour` first).
 */
export function colourDifference(a: ColourInput, b: ColourInput): number {
  return ciede2000(resolve(a).hex, resolve(b).hex);
}

/**
 * Default ΔE00 threshold under which two yarn colours count as too alike to
 * tell apart in a chart. Our choice, not a standard: ΔE00 of 1-2 is the
 * usual "just noticeable" range for large patches side by side, but chart
 * cells are small (a few millimetres on paper, a few pixels on a phone), seen
 * next to other colours and often printed or in poor light, where small-field
 * colour discrimination is much worse; below about 10 two yarns become hard
 * to tell apart at cell size. Designers can change it per pattern.
 */
export const DEFAULT_ALIKE_THRESHOLD = 10;

/** True when the colours' ΔE00 is below the threshold (default `DEFAULT_ALIKE_THRESHOLD`). */
export function coloursTooAlike(a: ColourInput, b: ColourInput, threshold: number = DEFAULT_ALIKE_THRESHOLD): boolean {
  return colourDifference(a, b) < threshold;
}

/**
 * Colour vision to compare colours under: typical trichromatic vision, or a
 * full dichromacy (red-green: protanopia, deuteranopia; blue-yellow:
 * tritanopia), simulated with culori's deficiency filters at severity 1.
 */
export type Vision = 'typical' | 'protanopia' | 'deuteranopia' | 'tritanopia';

/** Every vision we simulate, typical first. */
export const VISIONS: readonly Vision[] = ['typical', 'protanopia', 'deuteranopia', 'tritanopia'];

const FILTERS = {
  protanopia: filterDeficiencyProt(1),
  deuteranopia: filterDeficiencyDeuter(1),
  tritanopia: filterDeficiencyTrit(1),
} as const;

/** How a colour appears under a colour vision (as an sRGB hex colour); typical vision returns it unchanged. */
export function simulateVision(colour: ColourInput, vision: Vision): string {
  const hex = resolve(colour).hex;
  if (vision === 'typical') return hex;
  const seen = parse(hex);
  // A hex colour always parses; the guard keeps the types honest.
  return seen === undefined ? hex : formatHex(FILTERS[vision](seen));
}

/** ΔE00 between two colours as they appear under a colour vision. */
export function colourDifferenceFor(a: ColourInput, b: ColourInput, vision: Vision): number {
  return ciede2000(simulateVision(a, vision), simulateVision(b, vision));
}

/** Two yarns whose colours are too alike, with their ΔE00 under the vision where they are most alike. */
export interface AlikePair {
  readonly first: string;
  readonly second: string;
  readonly deltaE: number;
  readonly vision: Vision;
}

/**
 * Every pair of yarns (in input order, first before second) whose colours are
 * too alike under any of the given visions (default: typical vision only);
 * each pair once, with the vision where it is most alike. Yarns whose colour
 * does not parse are skipped (the caller reports those). Sorted by ΔE00, most
 * alike first.
 */
export function findAlikeColours(
  yarns: readonly { readonly name: string; readonly colour: string }[],
  threshold: number = DEFAULT_ALIKE_THRESHOLD,
  visions: readonly Vision[] = ['typical'],
): AlikePair[] {
  const parsed = yarns.map((y) => ({ name: y.name, outcome: parseYarnColour(y.colour) }));
  const pairs: AlikePair[] = [];
  for (let i = 0; i < parsed.length; i++) {
    const a = parsed[i].outcome;
    if (!a.ok) continue;
    for (let j = i + 1; j < parsed.length; j++) {
      const b = parsed[j].outcome;
      if (!b.ok) continue;
      let worst: { deltaE: number; vision: Vision } | null = null;
      for (const vision of visions) {
        const deltaE = colourDifferenceFor(a.value, b.value, vision);
        if (worst === null || deltaE < worst.deltaE) worst = { deltaE, vision };
      }
      if (worst !== null && worst.deltaE < threshold) pairs.push({ first: parsed[i].name, second: parsed[j].name, ...worst });
    }
  }
  return pairs.sort((p, q) => p.deltaE - q.deltaE);
}

/**
 * WCAG 2 contrast ratio (L1 + 0.05) / (L2 + 0.05) between two colours, via
 * culori; from 1 (same luminance) to 21 (black on white); symmetric.
 */
export function contrastRatio(a: ColourInput, b: ColourInput): number {
  return wcagContrast(resolve(a).hex, resolve(b).hex);
}

/** The ink for symbols drawn on a coloured chart cell. */
export interface SymbolInk {
  readonly ink: 'black' | 'white';
  readonly hex: '#000000' | '#ffffff';
  /** WCAG contrast ratio of the chosen ink on the cell colour (>= 4.58 always). */
  readonly contrast: number;
}

/**
 * Black or white symbol ink for a cell of the given yarn colour: whichever has
 * the higher WCAG contrast ratio (ties go to black). Because black and white
 * together span the full range, the winner always reaches at least
 * sqrt(21) ≈ 4.58.
 */
export function symbolInk(cell: ColourInput): SymbolInk {
  const onBlack = contrastRatio(cell, '#000000');
  const onWhite = contrastRatio(cell, '#ffffff');
  return onBlack >= onWhite
    ? { ink: 'black', hex: '#000000', contrast: onBlack }
    : { ink: 'white', hex: '#ffffff', contrast: onWhite };
}
