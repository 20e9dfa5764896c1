/**
 * Shaping arithmetic: spacing increases or decreases evenly across a round or
 * row, and spreading shapings evenly over a length of rows.
 *
 * Worked examples these follow are in ../shared/references.md, "Spacing
 * shaping evenly" (checked in tests/reference/spacing.test.ts).
 */
import type { MeasureOutcome } from './units';

/** A stitch that shapes: what it takes off the left needle and puts on the right. */
export interface ShapingStitch {
  readonly name: string;
  /** Stitches consumed from the left needle (k2tog: 2, m1: 0, kfb: 1). */
  readonly consumes: number;
  /** Stitches produced on the right needle (k2tog: 1, m1: 1, kfb: 2). */
  readonly produces: number;
}

/** k2tog: 2 stitches become 1 (net −1; trade abbreviation lists). */
export const K2TOG: ShapingStitch = { name: 'k2tog', consumes: 2, produces: 1 };
/** m1: a new stitch from the strand between stitches (net +1; trade abbreviation lists). */
export const M1: ShapingStitch = { name: 'm1', consumes: 0, produces: 1 };

/**
 * Where the shapings sit.
 * - 'round': worked in the round; n shapings divide the round into n equal
 *   intervals, each ending in a shaping ("increase after sts 13, 26, 39, 51").
 * - 'flat': worked flat, starting half an interval in, so the edges get half
 *   an interval each ("after sts 6, 19, 32, 45"; "k3, k2tog, ..., k3").
 * - 'flat-sections': worked flat with the shapings only between sections:
 *   n shapings make n + 1 equal sections (40 sts, 4 increases: 5 sections of 8).
 */
export type ShapingLayout = 'round' | 'flat' | 'flat-sections';

/** One piece of an evenly shaped round or row; repeats nest. */
export type ShapingSegment =
  | { readonly kind: 'work'; readonly stitch: string; readonly count: number }
  | { readonly kind: 'shape'; readonly stitch: ShapingStitch }
  | { readonly kind: 'repeat'; readonly times: number; readonly body: readonly ShapingSegment[] };

/** A request to space shapings evenly. */
export interface SpaceEvenlyRequest {
  /** Stitches on the needle before the round or row; a whole number >= 0. */
  readonly stitches: number;
  /** How many shaping stitches to work; a whole number >= 1. */
  readonly shapings: number;
  readonly layout: ShapingLayout;
  /** The shaping stitch; default `K2TOG` when `kind` is 'decrease', `M1` when 'increase'. */
  readonly stitch?: ShapingStitch;
  /** Used only to pick the default stitch; default 'decrease'. */
  readonly kind?: 'increase' | 'decrease';
  /** The plain stitch between shapings; default 'k'. */
  readonly plain?: string;
}

/**
 * An evenly shaped round or row. Invariants: `segments` consume exactly
 * `before` stitches and produce `after`; `positions` is strictly
 * non-decreasing, one entry per shaping; `gaps` sum to the plain stitches.
 */
export interface EvenShaping {
  readonly before: number;
  readonly after: number;
  readonly segments: readonly ShapingSegment[];
  /** The segments in the trade's words: "k3, k2tog, [k6, k2tog] 9 times, k3". */
  readonly text: string;
  /** For each shaping, how many stitches of the old count are worked before it. */
  readonly positions: readonly number[];
  /** Plain stitches before each shaping, then the plain stitches after the last one. */
  readonly gaps: readonly number[];
}

/** Upper bound on stitches per request: beyond any real pattern, keeps the work small. */
export const MAX_SHAPING_STITCHES = 100_000;

function problem<T>(code: string, message: string): MeasureOutcome<T> {
  return { ok: false, problem: { code, message } };
}

function isCount(n: number, min: number): boolean {
  return Number.isInteger(n) && n >= min && n <= MAX_SHAPING_STITCHES;
}

/**
 * Plain stitches before each shaping and after the last one, in exact integer
 * arithmetic. Invariant: they sum to `plainTotal`.
 */
function layoutGaps(layout: ShapingLayout, plainTotal: number, shapings: number): number[] {
  const gaps: number[] = [];
  let previous = 0;
  const push = (cum: number) => {
    gaps.push(cum - previous);
    previous = cum;
  };
  if (layout === 'round') {
    // ceil(k·P/n): the longer intervals come first, matching "after sts 13, 26, 39, 51".
    for (let k = 1; k <= shapings; k++) push(Math.floor((k * plainTotal + shapings - 1) / shapings));
  } else if (layout === 'flat-sections') {
    // ceil(k·P/(n+1)): n + 1 sections, shapings only between them.
    for (let k = 1; k <= shapings; k++) push(Math.floor((k * plainTotal + shapings) / (shapings + 1)));
  } else {
    // The round layout with the shorter intervals first, floor(k·P/n), whose
    // first (shortest) interval is split between the two edges: the row
    // starts half an interval in ("after sts 6, 19, 32, 45"; "k3, k2tog, ... k3").
    const first = Math.floor(plainTotal / shapings);
    const head = Math.floor(first / 2);
    gaps.push(head);
    previous = first;
    for (let k = 2; k <= shapings; k++) push(Math.floor((k * plainTotal) / shapings));
    gaps.push(first - head);
    return gaps;
  }
  gaps.push(plainTotal - previous);
  return gaps;
}

/**
 * Spaces `shapings` shaping stitches evenly over `stitches`. Returns a problem
 * (never throws) for counts that are not whole numbers in range or when there
 * are too few stitches for the decreases.
 */
export function spaceShapingEvenly(request: SpaceEvenlyRequest): MeasureOutcome<EvenShaping> {
  const { stitches, shapings, layout } = request;
  const stitch = request.stitch ?? (request.kind === 'increase' ? M1 : K2TOG);
  const plain = request.plain ?? 'k';
  if (!isCount(stitches, 0)) {
    return problem('shaping-stitches', `the stitch count must be a whole number from 0 to ${MAX_SHAPING_STITCHES} (got ${String(stitches)})`);
  }
  if (!isCount(shapings, 1)) {
    return problem('shaping-count', `the number of shapings must be a whole number from 1 to ${MAX_SHAPING_STITCHES} (got ${String(shapings)})`);
  }
  if (!(Number.isInteger(stitch.consumes) && stitch.consumes >= 0 && Number.isInteger(stitch.produces) && stitch.produces >= 0)) {
    return problem('shaping-stitch', `${stitch.name} must consume and produce whole numbers of stitches`);
  }
  if (layout !== 'round' && layout !== 'flat' && layout !== 'flat-sections') {
    return problem('shaping-layout', `the layout must be round, flat or flat-sections (got "${String(layout)}")`);
  }
  const plainTotal = stitches - shapings * stitch.consumes;
  if (plainTotal < 0) {
    return problem(
      'shaping-too-few-stitches',
      `${shapings} × ${stitch.name} need ${shapings * stitch.consumes} stitches but only ${stitches} are on the needle`,
    );
  }
  const gaps = layoutGaps(layout, plainTotal, shapings);
  const positions: number[] = [];
  let worked = 0;
  for (let k = 0; k < shapings; k++) {
    worked += gaps[k];
    positions.push(worked + k * stitch.consumes);
  }
  const tail = gaps[shapings];
  const segments = compressUnits(gaps.slice(0, -1), plain, stitch);
  const all: ShapingSegment[] = tail > 0 ? [...segments, { kind: 'work', stitch: plain, count: tail }] : segments;
  return {
    ok: true,
    value: {
      before: stitches,
      after: stitches + shapings * (stitch.produces - stitch.consumes),
      segments: all,
      text: formatSegments(all),
      positions,
      gaps,
    },
  };
}

/** The longest block of units a repeat may span; longer periods are written out. */
const MAX_BLOCK = 40;

function unitSegments(gap: number, plain: string, stitch: ShapingStitch): ShapingSegment[] {
  const shape: ShapingSegment = { kind: 'shape', stitch };
  return gap > 0 ? [{ kind: 'work', stitch: plain, count: gap }, shape] : [shape];
}

/**
 * Writes a sequence of units ("k g, shape") with repeats: greedily, at each
 * unit, the block that repeats over the most units (ties: the shortest block),
 * nested inside repeated blocks. Cost is O(n · MAX_BLOCK) amortised.
 */
function compressUnits(gaps: readonly number[], plain: string, stitch: ShapingStitch): ShapingSegment[] {
  const out: ShapingSegment[] = [];
  let i = 0;
  while (i < gaps.length) {
    let bestLength = 1;
    let bestTimes = 1;
    const maxLength = Math.min(MAX_BLOCK, Math.floor((gaps.length - i) / 2));
    for (let length = 1; length <= maxLength; length++) {
      let times = 1;
      while (i + (times + 1) * length <= gaps.length && sameBlock(gaps, i, i + times * length, length)) times++;
      if (times >= 2 && times * length > bestTimes * bestLength) {
        bestLength = length;
        bestTimes = times;
      }
    }
    if (bestTimes >= 2) {
      const body = compressUnits(gaps.slice(i, i + bestLength), plain, stitch);
      out.push({ kind: 'repeat', times: bestTimes, body });
    } else {
      out.push(...unitSegments(gaps[i], plain, stitch));
    }
    i += bestTimes * bestLength;
  }
  return out;
}

function sameBlock(gaps: readonly number[], a: number, b: number, length: number): boolean {
  for (let j = 0; j < length; j++) if (gaps[a + j] !== gaps[b + j]) return false;
  return true;
}

/** Writes segments in the trade's words: "k3, k2tog, [k6, k2tog] 9 times, k3". */
export function formatSegments(segments: readonly ShapingSegment[]): string {
  return segments
    .map((s) => {
      switch (s.kind) {
        case 'work':
          return `${s.stitch}${s.count}`;
        case 'shape':
          return s.stitch.name;
        case 'repeat':
          return `[${formatSegments(s.body)}] ${s.times} times`;
      }
    })
    .join(', ');
}

/** Stitches a sequence of segments consumes and produces (plain stitches: 1 and 1). */
export function countSegments(segments: readonly ShapingSegment[]): { consumed: number; produced: number; shapings: number } {
  let consumed = 0;
  let produced = 0;
  let shapings = 0;
  for (const s of segments) {
    if (s.kind === 'work') {
      consumed += s.count;
      produced += s.count;
    } else if (s.kind === 'shape') {
      consumed += s.stitch.consumes;
      produced += s.stitch.produces;
      shapings += 1;
    } else {
      const inner = countSegments(s.body);
      consumed += inner.consumed * s.times;
      produced += inner.produced * s.times;
      shapings += inner.shapings * s.times;
    }
  }
  return { consumed, produced, shapings };
}

/** A run of shapings at one interval: "every 3rd row 4 times". */
export interface ShapingInterval {
  /** Rows from one shaping row to the next (the first counts from the start). */
  readonly every: number;
  readonly times: number;
}

/**
 * Shapings spread over a length. Invariants: `intervals` (at most two, the
 * more frequent first, `every` values differing by `rowStep`) have `times`
 * summing to the shapings and `every × times` summing to `rowsUsed`;
 * `rowsUsed + plainRowsAfter = rows`; `shapingRows` lists the rows (1-based)
 * on which a shaping falls.
 */
export interface ShapingOverLength {
  readonly rows: number;
  readonly shapings: number;
  readonly intervals: readonly ShapingInterval[];
  readonly rowsUsed: number;
  readonly plainRowsAfter: number;
  readonly shapingRows: readonly number[];
  /** "every 3rd row 4 times, then every 4th row 32 times". */
  readonly text: string;
}

/** A request to spread shapings over a length of rows or rounds. */
export interface ShapingOverLengthRequest {
  /** Rows (or rounds) available; whole number >= 1. */
  readonly rows: number;
  /** Shaping rows wanted; whole number >= 1. */
  readonly shapings: number;
  /** Shape only on every `rowStep`-th row (2: right-side rows only); default 1. */
  readonly rowStep?: number;
  /** The word for the text; default 'row'. */
  readonly unit?: 'row' | 'round';
}

/** "1st", "2nd", "3rd", "4th", "11th", "22nd". */
export function ordinal(n: number): string {
  const tens = n % 100;
  if (tens >= 11 && tens <= 13) return `${n}th`;
  const suffix = ['th', 'st', 'nd', 'rd'][n % 10] ?? 'th';
  return `${n}${suffix}`;
}

/**
 * Spreads `shapings` over `rows`: rows = shapings × a + r, so shape every
 * a-th row (shapings − r) times and every (a+1)-th row r times (140 rows, 36
 * shapings: every 3rd row 4 times and every 4th row 32 times). With a
 * `rowStep`, intervals are multiples of it and leftover rows are worked plain
 * at the end. Returns a problem (never throws) when there are more shapings
 * than usable rows or the counts are not whole numbers.
 */
export function spreadShapingOverLength(request: ShapingOverLengthRequest): MeasureOutcome<ShapingOverLength> {
  const { rows, shapings } = request;
  const step = request.rowStep ?? 1;
  const word = request.unit ?? 'row';
  if (!isCount(rows, 1)) return problem('length-rows', `the number of ${word}s must be a whole number from 1 to ${MAX_SHAPING_STITCHES} (got ${String(rows)})`);
  if (!isCount(shapings, 1)) return problem('length-shapings', `the number of shapings must be a whole number from 1 to ${MAX_SHAPING_STITCHES} (got ${String(shapings)})`);
  if (!(Number.isInteger(step) && step >= 1)) return problem('length-step', `the ${word} step must be a whole number >= 1 (got ${String(step)})`);
  const units = Math.floor(rows / step);
  if (units < shapings) {
    const every = step === 1 ? `one every ${word}` : `one every ${ordinal(step)} ${word}`;
    return problem('length-too-short', `${shapings} shapings need at least ${shapings * step} ${word}s (${every}); there are ${rows}`);
  }
  const base = Math.floor(units / shapings);
  const longer = units % shapings;
  const intervals: ShapingInterval[] = [
    { every: base * step, times: shapings - longer },
    { every: (base + 1) * step, times: longer },
  ].filter((i) => i.times > 0);
  const shapingRows: number[] = [];
  let row = 0;
  for (const interval of intervals) {
    for (let t = 0; t < interval.times; t++) {
      row += interval.every;
      shapingRows.push(row);
    }
  }
  const rowsUsed = units * step;
  const phrase = (i: ShapingInterval) => `every ${i.every === 1 ? '' : `${ordinal(i.every)} `}${word} ${i.times} ${i.times === 1 ? 'time' : 'times'}`;
  const plainAfter = rows - rowsUsed;
  const tail = plainAfter > 0 ? `, then work ${plainAfter} ${word}${plainAfter === 1 ? '' : 's'} plain` : '';
  return {
    ok: true,
    value: {
      rows,
      shapings,
      intervals,
      rowsUsed,
      plainRowsAfter: plainAfter,
      shapingRows,
      text: `${intervals.map(phrase).join(', then ')}${tail}`,
    },
  };
}
