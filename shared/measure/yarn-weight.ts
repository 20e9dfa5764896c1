/**
 * Yarn weight categories from a declared gauge.
 *
 * Source: Craft Yarn Council, Standard Yarn Weight System (knit gauge ranges in
 * stockinette over 4 in and needle sizes; the revision that added 7 Jumbo), as
 * listed in ../shared/references.md, "Standards".
 */
import { normalizeGauge, type Gauge, type GaugeDeclaration } from './units';

/** A category number of the Standard Yarn Weight System, 0 (Lace) to 7 (Jumbo). */
export type YarnWeightNumber = 0 | 1 | 2 | 3 | 4 | 5 | 6 | 7;

/** One category of the system. Ranges are inclusive; stitches per 4 in of stockinette. */
export interface YarnWeightCategory {
  readonly number: YarnWeightNumber;
  readonly name: string;
  /** Fewest stitches per 4 in (0 for Jumbo, "6 and fewer"). */
  readonly minStitchesPer4In: number;
  readonly maxStitchesPer4In: number;
  /** Recommended needle size range in mm (Jumbo: 12.75 mm and larger, so no maximum). */
  readonly needleMm: { readonly min: number; readonly max: number | null };
  /** True for Lace: the standard says its range is hard to determine, "guidelines only". */
  readonly isGuidelinesOnly: boolean;
}

/**
 * The Standard Yarn Weight System (Craft Yarn Council), knit gauge per 4 in.
 * Note the overlap of 2 Fine (23–26) and 3 Light (21–24) at 23–24 sts and the
 * gaps between whole-number ranges (e.g. 11–12, 15–16).
 */
export const YARN_WEIGHTS: readonly YarnWeightCategory[] = [
  { number: 0, name: 'Lace', minStitchesPer4In: 33, maxStitchesPer4In: 40, needleMm: { min: 1.5, max: 2.25 }, isGuidelinesOnly: true },
  { number: 1, name: 'Super Fine', minStitchesPer4In: 27, maxStitchesPer4In: 32, needleMm: { min: 2.25, max: 3.25 }, isGuidelinesOnly: false },
  { number: 2, name: 'Fine', minStitchesPer4In: 23, maxStitchesPer4In: 26, needleMm: { min: 3.25, max: 3.75 }, isGuidelinesOnly: false },
  { number: 3, name: 'Light', minStitchesPer4In: 21, maxStitchesPer4In: 24, needleMm: { min: 3.75, max: 4.5 }, isGuidelinesOnly: false },
  { number: 4, name: 'Medium', minStitchesPer4In: 16, maxStitchesPer4In: 20, needleMm: { min: 4.5, max: 5.5 }, isGuidelinesOnly: false },
  { number: 5, name: 'Bulky', minStitchesPer4In: 12, maxStitchesPer4In: 15, needleMm: { min: 5.5, max: 8 }, isGuidelinesOnly: false },
  { number: 6, name: 'Super Bulky', minStitchesPer4In: 7, maxStitchesPer4In: 11, needleMm: { min: 8, max: 12.75 }, isGuidelinesOnly: false },
  { number: 7, name: 'Jumbo', minStitchesPer4In: 0, maxStitchesPer4In: 6, needleMm: { min: 12.75, max: null }, isGuidelinesOnly: false },
];

/** A category the gauge falls in, with how far it is from the middle of the range. */
export interface YarnWeightMatch {
  readonly category: YarnWeightCategory;
  /** |gauge − range middle| in stitches per 4 in. */
  readonly distanceFromMiddle: number;
}

/** The neighbouring category when a gauge falls outside every range. */
export interface YarnWeightNeighbour {
  readonly category: YarnWeightCategory;
  /** Stitches per 4 in between the gauge and the nearest end of this range (> 0). */
  readonly distance: number;
}

/**
 * What a gauge says about the yarn weight.
 * - `matches`: every category whose range holds the gauge, best (closest to
 *   the range middle) first; ties go to the finer yarn (lower number). Empty
 *   when the gauge is outside all ranges.
 * - `neighbours`: when there is no match, the nearest category on each side
 *   (one for a gauge finer than Lace), nearest first; empty otherwise.
 * - `isGuidelinesOnly`: the best match (or nearest neighbour) is Lace, whose
 *   range the standard gives as guidelines only.
 * - `message`: one sentence for the summary.
 */
export interface YarnWeightClassification {
  readonly stitchesPer4In: number;
  readonly matches: readonly YarnWeightMatch[];
  readonly neighbours: readonly YarnWeightNeighbour[];
  readonly isOutsideAllRanges: boolean;
  readonly isGuidelinesOnly: boolean;
  readonly message: string;
}

function middle(c: YarnWeightCategory): number {
  return (c.minStitchesPer4In + c.maxStitchesPer4In) / 2;
}

function label(c: YarnWeightCategory): string {
  const range = c.number === 7 ? `${c.maxStitchesPer4In} and fewer` : `${c.minStitchesPer4In}–${c.maxStitchesPer4In}`;
  return `${c.number} ${c.name} (${range} sts per 4 in${c.isGuidelinesOnly ? ', guidelines only' : ''})`;
}

function formatCount(n: number): string {
  return String(Math.round(n * 100) / 100);
}

/**
 * Classifies a gauge given as stitches per 4 in of stockinette. Requires a
 * finite number > 0 (RangeError otherwise: validate the gauge first).
 */
export function classifyStitchesPer4In(stitchesPer4In: number): YarnWeightClassification {
  if (!(Number.isFinite(stitchesPer4In) && stitchesPer4In > 0)) {
    throw new RangeError(`stitches per 4 in must be a finite number > 0 (got ${String(stitchesPer4In)})`);
  }
  const g = stitchesPer4In;
  const matches = YARN_WEIGHTS.filter((c) => g >= c.minStitchesPer4In && g <= c.maxStitchesPer4In)
    .map((category) => ({ category, distanceFromMiddle: Math.abs(g - middle(category)) }))
    .sort((a, b) => a.distanceFromMiddle - b.distanceFromMiddle || a.category.number - b.category.number);
  const shown = formatCount(g);
  if (matches.length > 0) {
    const [best, ...others] = matches;
    const also = others.length > 0 ? `; also within ${others.map((m) => label(m.category)).join(', ')}` : '';
    return {
      stitchesPer4In: g,
      matches,
      neighbours: [],
      isOutsideAllRanges: false,
      isGuidelinesOnly: best.category.isGuidelinesOnly,
      message: `${shown} sts per 4 in is ${label(best.category)}${also}.`,
    };
  }
  // Outside every range: a gap between two whole-number ranges, or finer than Lace.
  const neighbours = YARN_WEIGHTS.map((category) => ({
    category,
    distance: g > category.maxStitchesPer4In ? g - category.maxStitchesPer4In : category.minStitchesPer4In - g,
  }));
  const finer = neighbours.filter((n) => n.category.minStitchesPer4In > g).sort((a, b) => a.distance - b.distance)[0];
  const thicker = neighbours.filter((n) => n.category.maxStitchesPer4In < g).sort((a, b) => a.distance - b.distance)[0];
  const sides = [finer, thicker].filter((n): n is YarnWeightNeighbour => n !== undefined).sort((a, b) => a.distance - b.distance);
  const where = finer && thicker
    ? `between ${label(thicker.category)} and ${label(finer.category)}`
    : `finer than ${label(thicker.category)}`;
  return {
    stitchesPer4In: g,
    matches: [],
    neighbours: sides,
    isOutsideAllRanges: true,
    isGuidelinesOnly: sides[0].category.isGuidelinesOnly,
    message: `${shown} sts per 4 in is outside every yarn weight range: ${where}.`,
  };
}

/**
 * Classifies a declared or normalised gauge (per 10 cm is converted exactly to
 * per 4 in = 10.16 cm first). Requires a valid gauge.
 */
export function classifyYarnWeight(gauge: Gauge | GaugeDeclaration): YarnWeightClassification {
  const normalised = 'stitchesPer4In' in gauge ? gauge : normalizeGauge(gauge);
  return classifyStitchesPer4In(normalised.stitchesPer4In);
}

/**
 * The single category to suggest for a gauge: the best match, or else the
 * nearest neighbour. Never null for a valid gauge.
 */
export function suggestYarnWeight(gauge: Gauge | GaugeDeclaration): YarnWeightCategory {
  const c = classifyYarnWeight(gauge);
  return c.matches.length > 0 ? c.matches[0].category : c.neighbours[0].category;
}
