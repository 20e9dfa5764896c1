/**
 * Lengths, gauge normalisation and float limits.
 *
 * Conventions (see README.md):
 * - 1 in = 2.54 cm exactly (the international inch).
 * - A gauge declared "per 4 in" is measured over 10.16 cm, NOT 10 cm. We convert
 *   exactly; we never treat "per 4 in" and "per 10 cm" as the same thing.
 * - Gauge is stitches (or rows) per unit length; a run of n stitches is n stitch
 *   widths long, so its length is n / (stitches per unit).
 *
 * Pure functions, no I/O. Functions whose inputs come from a user return data
 * (`MeasureOutcome`); functions documented as requiring validated input throw
 * `RangeError` on programmer errors only.
 */

/** Centimetres in one inch, exactly (international inch). */
export const CM_PER_INCH = 2.54;

/** A unit of length used in patterns. */
export type LengthUnit = 'in' | 'cm';

/** A length with its unit, e.g. a float limit `{ value: 1, unit: 'in' }`. */
export interface Length {
  readonly value: number;
  readonly unit: LengthUnit;
}

/** A length given in both units; invariant: `in * 2.54 === cm` (to float precision). */
export interface DualLength {
  readonly cm: number;
  readonly in: number;
}

/** The basis a gauge is declared over: stitches and rows per 10 cm or per 4 in. */
export type GaugeBasis = '10cm' | '4in';

/** The length of each gauge basis in centimetres: 4 in is 10.16 cm, exactly. */
export const GAUGE_BASIS_CM: Readonly<Record<GaugeBasis, number>> = { '10cm': 10, '4in': 4 * CM_PER_INCH };

/** A gauge as a pattern header declares it (same shape as `PatternHeader.gauge`). */
export interface GaugeDeclaration {
  /** Stitches over the basis length; > 0. */
  readonly stitches: number;
  /** Rows (or rounds) over the basis length; > 0. */
  readonly rows: number;
  readonly per: GaugeBasis;
}

/**
 * A gauge in every form the product needs. Invariants: all values > 0 and
 * finite; `stitchesPerInch === stitchesPerCm * 2.54`; `stitchesPer4In ===
 * stitchesPerInch * 4`; `stitchesPer10Cm === stitchesPerCm * 10` (likewise rows).
 */
export interface Gauge {
  readonly stitchesPerCm: number;
  readonly rowsPerCm: number;
  readonly stitchesPerInch: number;
  readonly rowsPerInch: number;
  readonly stitchesPer10Cm: number;
  readonly rowsPer10Cm: number;
  readonly stitchesPer4In: number;
  readonly rowsPer4In: number;
  /** The declaration this gauge was normalised from. */
  readonly declared: GaugeDeclaration;
}

/** A problem with user-supplied measurements: a stable code and a sentence. */
export interface MeasureProblem {
  readonly code: string;
  readonly message: string;
}

/** Either a value or a problem; user errors never throw. */
export type MeasureOutcome<T> = { readonly ok: true; readonly value: T } | { readonly ok: false; readonly problem: MeasureProblem };

/** The default float limit of a pattern (notation.md): 1 in, about 2.5 cm. Common practice. */
export const DEFAULT_FLOAT_LIMIT: Length = { value: 1, unit: 'in' };

/** True when `n` is a finite number greater than zero. */
export function isPositiveFinite(n: number): boolean {
  return typeof n === 'number' && Number.isFinite(n) && n > 0;
}

/** Converts a length to centimetres. */
export function toCm(length: Length): number {
  return length.unit === 'cm' ? length.value : length.value * CM_PER_INCH;
}

/** Converts a length to inches. */
export function toInches(length: Length): number {
  return length.unit === 'in' ? length.value : length.value / CM_PER_INCH;
}

/** Converts a length to the given unit. */
export function convertLength(length: Length, unit: LengthUnit): Length {
  return { value: unit === 'cm' ? toCm(length) : toInches(length), unit };
}

/** A length in both units. */
export function dualLength(length: Length): DualLength {
  return { cm: toCm(length), in: toInches(length) };
}

/**
 * Lists what is wrong with a gauge declaration (empty when it is usable):
 * stitches and rows must be finite numbers greater than zero and `per` one of
 * '10cm' | '4in'.
 */
export function gaugeProblems(declaration: GaugeDeclaration): MeasureProblem[] {
  const problems: MeasureProblem[] = [];
  if (!isPositiveFinite(declaration.stitches)) {
    problems.push({ code: 'gauge-stitches', message: `gauge stitches must be a number greater than 0 (got ${String(declaration.stitches)})` });
  }
  if (!isPositiveFinite(declaration.rows)) {
    problems.push({ code: 'gauge-rows', message: `gauge rows must be a number greater than 0 (got ${String(declaration.rows)})` });
  }
  if (declaration.per !== '10cm' && declaration.per !== '4in') {
    problems.push({ code: 'gauge-basis', message: `gauge must be given per 10 cm or per 4 in (got "${String(declaration.per)}")` });
  }
  return problems;
}

/**
 * Normalises a declared gauge exactly: per 10 cm divides by 10 cm, per 4 in by
 * 10.16 cm (= 4 in). Returns a problem (never throws) when the declaration is
 * unusable.
 */
export function tryNormalizeGauge(declaration: GaugeDeclaration): MeasureOutcome<Gauge> {
  const problems = gaugeProblems(declaration);
  if (problems.length > 0) return { ok: false, problem: problems[0] };
  const basisCm = GAUGE_BASIS_CM[declaration.per];
  const stitchesPerCm = declaration.stitches / basisCm;
  const rowsPerCm = declaration.rows / basisCm;
  // Per-inch values are computed from the declared basis directly when it is
  // inches, so "22 sts per 4 in" gives exactly 5.5 sts/in with no rounding drift.
  const stitchesPerInch = declaration.per === '4in' ? declaration.stitches / 4 : stitchesPerCm * CM_PER_INCH;
  const rowsPerInch = declaration.per === '4in' ? declaration.rows / 4 : rowsPerCm * CM_PER_INCH;
  return {
    ok: true,
    value: {
      stitchesPerCm,
      rowsPerCm,
      stitchesPerInch,
      rowsPerInch,
      stitchesPer10Cm: declaration.per === '10cm' ? declaration.stitches : stitchesPerCm * 10,
      rowsPer10Cm: declaration.per === '10cm' ? declaration.rows : rowsPerCm * 10,
      stitchesPer4In: declaration.per === '4in' ? declaration.stitches : stitchesPerInch * 4,
      rowsPer4In: declaration.per === '4in' ? declaration.rows : rowsPerInch * 4,
      declared: { stitches: declaration.stitches, rows: declaration.rows, per: declaration.per },
    },
  };
}

/**
 * Like `tryNormalizeGauge` for a declaration already validated (e.g. by the
 * checker). Throws `RangeError` on an invalid declaration: a programmer error.
 */
export function normalizeGauge(declaration: GaugeDeclaration): Gauge {
  const outcome = tryNormalizeGauge(declaration);
  if (!outcome.ok) throw new RangeError(outcome.problem.message);
  return outcome.value;
}

/** A gauge from stitches and rows per inch (e.g. for tests or the studio's sliders). */
export function gaugeFromPerInch(stitchesPerInch: number, rowsPerInch: number): Gauge {
  return normalizeGauge({ stitches: stitchesPerInch * 4, rows: rowsPerInch * 4, per: '4in' });
}

/** The width of `stitches` stitch columns at the gauge (n stitches = n / sts per unit). */
export function stitchesToLength(stitches: number, gauge: Gauge): DualLength {
  return { cm: stitches / gauge.stitchesPerCm, in: stitches / gauge.stitchesPerInch };
}

/** The height of `rows` rows (or rounds) at the gauge. */
export function rowsToLength(rows: number, gauge: Gauge): DualLength {
  return { cm: rows / gauge.rowsPerCm, in: rows / gauge.rowsPerInch };
}

/** How stitch or row counts computed from a length are rounded. */
export type CountRounding = 'exact' | 'nearest' | 'down' | 'up';

// Counts derived from lengths are products of decimals (2.54, 10.16), so an
// exact whole number can come out as 6.999999999999999; snap within this.
const COUNT_EPSILON = 1e-9;

function roundCount(raw: number, rounding: CountRounding): number {
  const snapped = Math.abs(raw - Math.round(raw)) < COUNT_EPSILON ? Math.round(raw) : raw;
  switch (rounding) {
    case 'exact':
      return snapped;
    case 'nearest':
      return Math.round(snapped);
    case 'down':
      return Math.floor(snapped);
    case 'up':
      return Math.ceil(snapped);
  }
}

/**
 * The number of stitches that fill a length at the gauge. Default 'exact'
 * returns the fractional count (snapped to a whole number when within 1e-9).
 */
export function lengthToStitches(length: Length, gauge: Gauge, rounding: CountRounding = 'exact'): number {
  return roundCount(toCm(length) * gauge.stitchesPerCm, rounding);
}

/** The number of rows that fill a length at the gauge (see `lengthToStitches`). */
export function lengthToRows(length: Length, gauge: Gauge, rounding: CountRounding = 'exact'): number {
  return roundCount(toCm(length) * gauge.rowsPerCm, rounding);
}

/**
 * The longest float, in stitches, whose length stays within the limit
 * (length <= limit): floor(limit x stitches per unit). A float behind n
 * stitches is n stitch widths long. Example: 1 in at 7 sts/in -> 7 stitches
 * (exactly 1 in); 6 stitches are about 0.86 in. Returns 0 when even one stitch
 * is longer than the limit; an infinite limit gives Infinity (no limit).
 * Requires a limit value >= 0 (RangeError on a negative or NaN limit).
 */
export function floatLimitInStitches(limit: Length, gauge: Gauge): number {
  if (!(limit.value >= 0)) {
    throw new RangeError(`a float limit must be a length >= 0 (got ${String(limit.value)} ${limit.unit})`);
  }
  if (limit.value === Number.POSITIVE_INFINITY) return Number.POSITIVE_INFINITY;
  const raw = limit.unit === 'in' ? limit.value * gauge.stitchesPerInch : limit.value * gauge.stitchesPerCm;
  return roundCount(raw, 'down');
}

/** True when a float behind `stitches` stitches is no longer than the limit. */
export function isFloatWithinLimit(stitches: number, limit: Length, gauge: Gauge): boolean {
  return stitches <= floatLimitInStitches(limit, gauge);
}

/** Options of `formatLength`. */
export interface FormatLengthOptions {
  /** Which unit(s) to print; default 'both' ("25.4 cm (10 in)"). */
  readonly unit?: LengthUnit | 'both';
  /** Decimals for centimetres; default 1. */
  readonly cmDigits?: number;
  /** Decimals for inches; default 1. */
  readonly inDigits?: number;
  /** Which unit comes first when printing both; default 'cm'. */
  readonly primary?: LengthUnit;
}

function formatNumber(value: number, digits: number): string {
  const fixed = value.toFixed(digits);
  // Trim trailing zeros ("10.0" -> "10") and avoid printing "-0".
  const trimmed = fixed.includes('.') ? fixed.replace(/\.?0+$/, '') : fixed;
  return trimmed === '-0' ? '0' : trimmed;
}

/**
 * Formats a length for people: "25.4 cm (10 in)", "10 in", "25.4 cm".
 * Rounds half away from zero as `toFixed` does, trims trailing zeros.
 */
export function formatLength(length: DualLength | Length, options: FormatLengthOptions = {}): string {
  const dual = 'unit' in length ? dualLength(length) : length;
  const cm = `${formatNumber(dual.cm, options.cmDigits ?? 1)} cm`;
  const inches = `${formatNumber(dual.in, options.inDigits ?? 1)} in`;
  const unit = options.unit ?? 'both';
  if (unit === 'cm') return cm;
  if (unit === 'in') return inches;
  return (options.primary ?? 'cm') === 'cm' ? `${cm} (${inches})` : `${inches} (${cm})`;
}

/** Formats a gauge: "22 sts and 30 rows per 10 cm (5.59 sts and 7.62 rows per in)";
 * numbers to at most 2 decimals. */
export function formatGauge(gauge: Gauge): string {
  const d = gauge.declared;
  const basis = d.per === '10cm' ? '10 cm' : '4 in';
  const perIn = `${formatNumber(gauge.stitchesPerInch, 2)} sts and ${formatNumber(gauge.rowsPerInch, 2)} rows per in`;
  return `${formatNumber(d.stitches, 2)} sts and ${formatNumber(d.rows, 2)} rows per ${basis} (${perIn})`;
}
