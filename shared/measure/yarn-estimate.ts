/**
 * Yarn amounts per colour: an ESTIMATE from stitch counts and gauge.
 *
 * Model (stated in README.md and in every report): each stitch made in a yarn
 * uses one loop of yarn of length ℓ; floats use their width. Without a swatch,
 * ℓ comes from the relaxed plain-knit geometry of textile science (loop length
 * × stitches per cm ≈ 3.8 and loop length × rows per cm ≈ 5.0, so
 * ℓ = √(19 / (stitches per cm × rows per cm)) cm; constants from memory of the
 * textile literature, for stockinette, not a standard). A swatch calibrates ℓ
 * directly: its yarn length (or weight and the yarn's metres per 100 g) divided
 * by its stitch count.
 */
import { isPositiveFinite, toCm, type Gauge, type Length, type MeasureOutcome } from './units';

/** Metres in one yard, exactly (international yard: 36 in of 2.54 cm). */
export const METRES_PER_YARD = 0.9144;

/** Loop length × stitches per cm for relaxed plain knit (from memory; see module comment). */
export const LOOP_WALE_CONSTANT = 3.8;
/** Loop length × rows per cm for relaxed plain knit (from memory; see module comment). */
export const LOOP_COURSE_CONSTANT = 5.0;

/** Default allowance added for joins, weaving in, cast-on tails and gauge drift: 10 % (common practice, our choice). */
export const DEFAULT_YARN_ALLOWANCE = 0.1;

/** How much yarn one stitch uses, and where that figure came from. */
export interface StitchLengthModel {
  readonly basis: 'model' | 'swatch';
  /** Centimetres of yarn per stitch; finite and > 0. */
  readonly cmPerStitch: number;
  /** One sentence stating the assumption, for the summary. */
  readonly assumption: string;
}

/**
 * ℓ from the gauge alone: the geometric mean of the loop lengths implied by the
 * stitch gauge (3.8 / sts per cm) and the row gauge (5.0 / rows per cm).
 */
export function modelStitchLength(gauge: Gauge): StitchLengthModel {
  const fromStitches = LOOP_WALE_CONSTANT / gauge.stitchesPerCm;
  const fromRows = LOOP_COURSE_CONSTANT / gauge.rowsPerCm;
  const cmPerStitch = Math.sqrt(fromStitches * fromRows);
  return {
    basis: 'model',
    cmPerStitch,
    assumption:
      `Estimate: about ${cmPerStitch.toFixed(2)} cm of yarn per stitch, from the gauge by the plain-knit loop-length rule ` +
      '(stockinette, relaxed); floats add their width. Knit a swatch to calibrate.',
  };
}

/** A swatch that calibrates the stitch length: its total stitch count and the yarn it used. */
export type SwatchMeasurement =
  | { readonly stitches: number; readonly yarnLength: Length }
  | { readonly stitches: number; readonly weightGrams: number; readonly metresPer100g: number };

/**
 * ℓ from a swatch: yarn length (measured, or weight × metres per gram from the
 * ball band) ÷ stitches. Returns a problem (never throws) for numbers that are
 * not > 0.
 */
export function calibrateFromSwatch(swatch: SwatchMeasurement): MeasureOutcome<StitchLengthModel> {
  if (!(Number.isInteger(swatch.stitches) && swatch.stitches > 0)) {
    return { ok: false, problem: { code: 'swatch-stitches', message: `the swatch stitch count must be a whole number above 0 (got ${String(swatch.stitches)})` } };
  }
  let cm: number;
  let how: string;
  if ('yarnLength' in swatch) {
    if (!isPositiveFinite(swatch.yarnLength.value)) {
      return { ok: false, problem: { code: 'swatch-length', message: `the swatch yarn length must be above 0 (got ${String(swatch.yarnLength.value)})` } };
    }
    cm = toCm(swatch.yarnLength);
    how = `${swatch.yarnLength.value} ${swatch.yarnLength.unit} of yarn`;
  } else {
    if (!isPositiveFinite(swatch.weightGrams) || !isPositiveFinite(swatch.metresPer100g)) {
      return {
        ok: false,
        problem: { code: 'swatch-weight', message: 'the swatch weight and the yarn\'s metres per 100 g must both be above 0' },
      };
    }
    cm = ((swatch.weightGrams * swatch.metresPer100g) / 100) * 100;
    how = `${swatch.weightGrams} g of yarn at ${swatch.metresPer100g} m per 100 g`;
  }
  const cmPerStitch = cm / swatch.stitches;
  return {
    ok: true,
    value: {
      basis: 'swatch',
      cmPerStitch,
      assumption: `Estimate: ${cmPerStitch.toFixed(2)} cm of yarn per stitch, measured on a swatch of ${swatch.stitches} stitches (${how}); floats add their width.`,
    },
  };
}

/** What one yarn does in the pattern (for one size). */
export interface YarnUsage {
  readonly yarn: string;
  /** New loops made in this yarn (front and backing stitches; a k2tog makes one). Whole number >= 0. */
  readonly stitches: number;
  /** Total stitch widths this yarn floats behind; default 0. */
  readonly floatStitches?: number;
  /** From the ball band, to give grams; optional. */
  readonly metresPer100g?: number;
}

/** The estimate for one yarn. Invariant: `withAllowance = raw × (1 + allowance)`. */
export interface YarnAmount {
  readonly yarn: string;
  readonly stitches: number;
  readonly floatStitches: number;
  readonly metres: number;
  readonly yards: number;
  readonly metresWithAllowance: number;
  readonly yardsWithAllowance: number;
  /** Present when the usage gave metres per 100 g. */
  readonly gramsWithAllowance?: number;
}

/** Yarn estimate per colour; always labelled an estimate, with its assumption. */
export interface YarnEstimate {
  readonly isEstimate: true;
  readonly model: StitchLengthModel;
  readonly allowance: number;
  readonly amounts: readonly YarnAmount[];
  readonly totalMetresWithAllowance: number;
}

/** Options of `estimateYarn`. */
export interface EstimateYarnOptions {
  /** A calibrated stitch length (from `calibrateFromSwatch`); default: the gauge model. */
  readonly stitchLength?: StitchLengthModel;
  /** Fraction added on top, >= 0; default `DEFAULT_YARN_ALLOWANCE` (10 %). */
  readonly allowance?: number;
}

/**
 * Estimates yarn per colour: stitches × ℓ + float stitches × stitch width
 * (1 / stitches per cm), plus the allowance. Metres and yards; grams when the
 * usage gives metres per 100 g. Returns a problem (never throws) for negative
 * or fractional counts or a negative allowance.
 */
export function estimateYarn(usages: readonly YarnUsage[], gauge: Gauge, options: EstimateYarnOptions = {}): MeasureOutcome<YarnEstimate> {
  const model = options.stitchLength ?? modelStitchLength(gauge);
  const allowance = options.allowance ?? DEFAULT_YARN_ALLOWANCE;
  if (!(Number.isFinite(allowance) && allowance >= 0)) {
    return { ok: false, problem: { code: 'yarn-allowance', message: `the allowance must be 0 or more (got ${String(allowance)})` } };
  }
  const amounts: YarnAmount[] = [];
  for (const usage of usages) {
    const floats = usage.floatStitches ?? 0;
    if (!(Number.isInteger(usage.stitches) && usage.stitches >= 0 && Number.isInteger(floats) && floats >= 0)) {
      return {
        ok: false,
        problem: { code: 'yarn-counts', message: `stitch and float counts for yarn ${usage.yarn} must be whole numbers, 0 or more` },
      };
    }
    const cm = usage.stitches * model.cmPerStitch + floats / gauge.stitchesPerCm;
    const metres = cm / 100;
    const metresWithAllowance = metres * (1 + allowance);
    const grams = usage.metresPer100g !== undefined && isPositiveFinite(usage.metresPer100g)
      ? { gramsWithAllowance: (metresWithAllowance / usage.metresPer100g) * 100 }
      : {};
    amounts.push({
      yarn: usage.yarn,
      stitches: usage.stitches,
      floatStitches: floats,
      metres,
      yards: metres / METRES_PER_YARD,
      metresWithAllowance,
      yardsWithAllowance: metresWithAllowance / METRES_PER_YARD,
      ...grams,
    });
  }
  return {
    ok: true,
    value: {
      isEstimate: true,
      model,
      allowance,
      amounts,
      totalMetresWithAllowance: amounts.reduce((sum, a) => sum + a.metresWithAllowance, 0),
    },
  };
}
