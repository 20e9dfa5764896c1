/**
 * Finished sizes from counts and gauge, compared with body measurements.
 *
 * Sources (../shared/references.md, "Sizing (for finished-size checks;
 * guidance, not standards)"):
 * - hat circumference and hand circumference: a size guide that states it
 *   follows the Craft Yarn Council's body measurements;
 * - "knitted hats are usually worn 5–10 % smaller than the head" (negative ease);
 * - garment ease categories: a yarn maker's fit chart.
 */
import { CM_PER_INCH, rowsToLength, stitchesToLength, toInches, type DualLength, type Gauge, type Length } from './units';

/** What a finished piece measures. */
export interface FinishedSize {
  /** Around (in the round) or across (flat). */
  readonly widthKind: 'circumference' | 'width';
  readonly width: DualLength;
  readonly length: DualLength;
}

/**
 * Finished circumference (in the round) or width (flat) from the FRONT stitch
 * count (backing stitches sit behind the fabric and take no width), and
 * length from the rows or rounds worked. Counts >= 0; fractional counts are
 * allowed (averages).
 */
export function finishedSize(
  counts: { readonly frontStitches: number; readonly rows: number; readonly construction: 'round' | 'flat' },
  gauge: Gauge,
): FinishedSize {
  return {
    widthKind: counts.construction === 'round' ? 'circumference' : 'width',
    width: stitchesToLength(counts.frontStitches, gauge),
    length: rowsToLength(counts.rows, gauge),
  };
}

/** An item with body-measurement guidance. */
export type BodyItem = 'hat' | 'hand';
/** Who wears it; hats: adult, child, toddler, baby; hands: woman, man, child. */
export type Wearer = 'adult' | 'child' | 'toddler' | 'baby' | 'woman' | 'man';

/** A body measurement range in inches, inclusive. */
export interface BodyMeasurement {
  readonly item: BodyItem;
  readonly wearer: Wearer;
  /** What is measured. */
  readonly measured: string;
  readonly minIn: number;
  readonly maxIn: number;
}

/** Body measurements (references.md, Sizing; size guide following the Craft Yarn Council's body measurements). */
export const BODY_MEASUREMENTS: readonly BodyMeasurement[] = [
  { item: 'hat', wearer: 'adult', measured: 'head circumference', minIn: 21, maxIn: 23 },
  { item: 'hat', wearer: 'child', measured: 'head circumference', minIn: 18, maxIn: 21 },
  { item: 'hat', wearer: 'toddler', measured: 'head circumference', minIn: 16, maxIn: 18 },
  { item: 'hat', wearer: 'baby', measured: 'head circumference', minIn: 13, maxIn: 16 },
  { item: 'hand', wearer: 'woman', measured: 'hand circumference around the knuckles, without the thumb', minIn: 6, maxIn: 7.5 },
  { item: 'hand', wearer: 'man', measured: 'hand circumference around the knuckles, without the thumb', minIn: 7.5, maxIn: 9 },
  { item: 'hand', wearer: 'child', measured: 'hand circumference around the knuckles, without the thumb', minIn: 5.5, maxIn: 6 },
];

/** Knitted hats are usually worn 5–10 % smaller than the head (references.md, Sizing). */
export const HAT_NEGATIVE_EASE = { minFraction: 0.05, maxFraction: 0.1 } as const;

/** Ease categories (references.md, Sizing: a yarn maker's fit chart), plus 'negative'. */
export type EaseCategory = 'negative' | 'very-close' | 'close' | 'standard' | 'loose' | 'oversized';

/**
 * Ease category boundaries in inches, each category [from, to): very close 0,
 * close +1–2, standard +2–4, loose +4–6, oversized +6 and more. The chart gives
 * shared ends (2, 4, 6); we put each shared end in the looser category, so
 * "+6 and more" holds, and we call 0 to under 1 "very close". Below 0 is
 * negative ease (not in the chart).
 */
export const EASE_CATEGORIES: readonly { readonly category: EaseCategory; readonly fromIn: number; readonly toIn: number }[] = [
  { category: 'negative', fromIn: Number.NEGATIVE_INFINITY, toIn: 0 },
  { category: 'very-close', fromIn: 0, toIn: 1 },
  { category: 'close', fromIn: 1, toIn: 2 },
  { category: 'standard', fromIn: 2, toIn: 4 },
  { category: 'loose', fromIn: 4, toIn: 6 },
  { category: 'oversized', fromIn: 6, toIn: Number.POSITIVE_INFINITY },
];

// Ease is a difference of decimals (cm -> in): snap tiny float noise to the boundary.
const EASE_EPSILON = 1e-9;

/** The category of an ease in inches (finished minus body). */
export function easeCategory(easeInches: number): EaseCategory {
  const e = Math.abs(easeInches - Math.round(easeInches)) < EASE_EPSILON ? Math.round(easeInches) : easeInches;
  const found = EASE_CATEGORIES.find((c) => e >= c.fromIn && e < c.toIn);
  return found ? found.category : 'oversized';
}

/** A finished circumference compared with one body measurement range. */
export interface BodyComparison {
  readonly body: BodyMeasurement;
  readonly finished: DualLength;
  /** Finished minus body, for the middle and the two ends of the body range. */
  readonly ease: {
    readonly atMiddle: DualLength;
    /** Against the smallest body in the range (the most ease). */
    readonly atMin: DualLength;
    /** Against the largest body in the range (the least ease). */
    readonly atMax: DualLength;
  };
  /** Ease at the middle as a fraction of the body (−0.05 = 5 % smaller). */
  readonly easeFractionAtMiddle: number;
  readonly category: EaseCategory;
  /**
   * Hats only: whether the hat is 5–10 % smaller than some head in the range
   * (negative ease as hats are usually worn); null for other items.
   */
  readonly isWithinHatGuidance: boolean | null;
  readonly message: string;
}

function inchesToDual(inches: number): DualLength {
  return { in: inches, cm: inches * CM_PER_INCH };
}

function fmt(n: number): string {
  return String(Math.round(n * 10) / 10);
}

/**
 * Compares a finished circumference with the body measurement for an item and
 * wearer. Returns null when there is no guidance for that pair (e.g. a hand
 * for a toddler).
 */
export function compareToBody(finished: Length | DualLength, item: BodyItem, wearer: Wearer): BodyComparison | null {
  const body = BODY_MEASUREMENTS.find((b) => b.item === item && b.wearer === wearer);
  if (!body) return null;
  const finishedIn = 'unit' in finished ? toInches(finished) : finished.in;
  const middle = (body.minIn + body.maxIn) / 2;
  const easeMiddle = finishedIn - middle;
  const category = easeCategory(easeMiddle);
  let isWithinHatGuidance: boolean | null = null;
  if (item === 'hat') {
    // The hat fits some head in the range when finished / head lies in [0.90, 0.95].
    const smallestHead = finishedIn / (1 - HAT_NEGATIVE_EASE.minFraction);
    const largestHead = finishedIn / (1 - HAT_NEGATIVE_EASE.maxFraction);
    isWithinHatGuidance = largestHead >= body.minIn - EASE_EPSILON && smallestHead <= body.maxIn + EASE_EPSILON;
  }
  const percent = Math.round((easeMiddle / middle) * 1000) / 10;
  const guidance =
    isWithinHatGuidance === null ? '' : isWithinHatGuidance ? '; within the usual 5–10 % negative ease for hats' : '; outside the usual 5–10 % negative ease for hats';
  const message =
    `${fmt(finishedIn)} in finished against a ${body.wearer} ${body.measured} of ${fmt(body.minIn)}–${fmt(body.maxIn)} in: ` +
    `${easeMiddle >= 0 ? '+' : ''}${fmt(easeMiddle)} in of ease at the middle (${percent >= 0 ? '+' : ''}${percent} %), ${category.replace('-', ' ')}${guidance}.`;
  return {
    body,
    finished: inchesToDual(finishedIn),
    ease: {
      atMiddle: inchesToDual(easeMiddle),
      atMin: inchesToDual(finishedIn - body.minIn),
      atMax: inchesToDual(finishedIn - body.maxIn),
    },
    easeFractionAtMiddle: easeMiddle / middle,
    category,
    isWithinHatGuidance,
    message,
  };
}

/**
 * The wearers whose body range a finished circumference suits: for hats, those
 * with a head 5–10 % larger than the hat; for hands, those whose hand range
 * holds the circumference (zero ease: the references give no ease figure for
 * mitts, so we claim none). Ordered as BODY_MEASUREMENTS.
 */
export function suitableWearers(finished: Length | DualLength, item: BodyItem): Wearer[] {
  const finishedIn = 'unit' in finished ? toInches(finished) : finished.in;
  return BODY_MEASUREMENTS.filter((b) => b.item === item)
    .filter((b) => {
      if (item === 'hat') return compareToBody({ value: finishedIn, unit: 'in' }, 'hat', b.wearer)?.isWithinHatGuidance === true;
      return finishedIn >= b.minIn - EASE_EPSILON && finishedIn <= b.maxIn + EASE_EPSILON;
    })
    .map((b) => b.wearer);
}
