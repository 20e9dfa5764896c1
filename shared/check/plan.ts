/**
 * Expansion per size, step 1: which line gives each round its instructions.
 *
 * Rounds are worked from 1 to the highest round any line names. For each
 * round, the last whole-round line that covers it wins; lines with
 * "at SEGMENT" are collected per segment (again the last one wins). A round
 * with both kinds is LW211 (the whole-round line is worked); a round with
 * neither is LW209, once per run of such rounds (not reported when the text
 * had syntax errors: the missing round is most likely the line that could
 * not be read). Ladder lines are
 * attached to the rounds they set up (first), work and close (last).
 */
import type { LadderLine, PatternAst, RoundLine } from '../notation';
import { LIMITS, type SizeContext } from './context';

/**
 * What one round is made of. Round `i + 1` is `plan[i]` (its number is its
 * place; its side follows from it, see `sideOf`). Entries are shared: every
 * round a whole-round line gives alone, and every round of a gap, is the
 * same object (a run of 100,000 such rounds makes one entry), so an entry is
 * never changed once planned; a round with ladders gets its own.
 */
export interface PlannedRound {
  /** The whole-round line, or null for a segment round (or a missing round). */
  whole: RoundLine | null;
  /** Segment lines by segment name (an empty, shared map for a whole round). */
  segments: ReadonlyMap<string, RoundLine>;
  /** Ladders active on this round and their phase. */
  ladders: { ladder: LadderLine; phase: 'setup' | 'work' | 'close'; first: number }[];
}

/** The segments of a round with none (shared; never changed). */
const NO_SEGMENTS: ReadonlyMap<string, RoundLine> = new Map();
/** The ladders of a round with none (shared; planRounds gives a round its own entry before adding one). */
const NO_LADDERS: PlannedRound['ladders'] = [];

/** The side facing the knitter on round or row `n`: flat, even rows are WS. */
export function sideOf(n: number, flat: boolean): 'RS' | 'WS' {
  return flat && n % 2 === 0 ? 'WS' : 'RS';
}

/** A resolved range of a line for this size. */
export interface LineRange { first: number; last: number; step: number }

/** Resolves a line's range for the context's size (numbers below 1 are LW103). */
export function lineRange(ctx: SizeContext, line: RoundLine): LineRange | null {
  const first = ctx.graded(line.first);
  const last = line.last ? ctx.graded(line.last) : first;
  if (first < 1 || last < first) {
    ctx.reporter.report('LW103', line.last?.span ?? line.first.span, { what: 'a round range', need: 'from 1 upwards, first before last', value: `${first}-${last}` });
    return null;
  }
  return { first, last, step: line.every ?? 1 };
}

/**
 * Builds the round plan for one size; returns null (after LW901) when the
 * highest round number is past the bound.
 */
export function planRounds(ctx: SizeContext, ast: PatternAst, flat: boolean, quietGaps = false): { rounds: PlannedRound[]; ranges: Map<RoundLine, LineRange> } | null {
  const ranges = new Map<RoundLine, LineRange>();
  let max = 0;
  for (const line of ast.rounds) {
    const r = lineRange(ctx, line);
    if (!r) continue;
    ranges.set(line, r);
    if (r.last > max) max = r.last;
  }
  const wordOf = flat ? 'row' : 'round';
  if (max > LIMITS.rounds) {
    const worst = ast.rounds.find((l) => (ranges.get(l)?.last ?? 0) > LIMITS.rounds)!;
    ctx.report('LW901', worst.span, { detail: `${wordOf} ${max} is past the limit of ${LIMITS.rounds} ${wordOf}s`, word: wordOf });
    return null;
  }
  const whole = new Int32Array(max + 1).fill(-1);
  // Segment lines per round, made only for rounds that have some (most rounds of most patterns have none).
  const segs: (Map<string, RoundLine> | undefined)[] = new Array(max + 1);
  for (const line of ast.rounds) {
    const r = ranges.get(line);
    if (!r) continue;
    if ((line.word === 'row') !== flat) {
      ctx.reporter.report('LW213', line.headSpan, { construction: flat ? 'flat' : 'in the round', word: line.word, expected: flat ? 'row/rows' : 'round/rounds' });
    }
    for (let n = r.first; n <= r.last; n += r.step) {
      if (line.segment) (segs[n] ??= new Map()).set(line.segment.name, line);
      else whole[n] = line.index;
    }
  }
  const rounds: PlannedRound[] = new Array(max);
  // The entry of the rounds a line gives alone, by line index, and of the rounds no line gives.
  const alone: PlannedRound[] = [];
  const gap: PlannedRound = { whole: null, segments: NO_SEGMENTS, ladders: NO_LADDERS };
  for (let n = 1; n <= max; n++) {
    const w = whole[n] >= 0 ? ast.rounds[whole[n]] : null;
    const here = segs[n];
    if (w && here) {
      // The whole-round line is worked; the segment lines are ignored for this round.
      const [segName, segLine] = [...here][0];
      ctx.reporter.report('LW211', segLine.headSpan, { word: wordOf, round: n, segment: segName }, ctx.sizeLabel, String(n));
    }
    if (!w && !here && !quietGaps && (n === 1 || whole[n - 1] >= 0 || segs[n - 1])) {
      // One report per run of rounds without instructions: a gap of 40,000 rounds is one problem.
      let through = n;
      while (through < max && whole[through + 1] < 0 && !segs[through + 1]) through++;
      const near = ast.rounds.find((l) => (ranges.get(l)?.first ?? 0) > n) ?? ast.rounds[ast.rounds.length - 1];
      ctx.report('LW209', near.headSpan, { word: wordOf, round: n, through, last: max }, String(n));
    }
    rounds[n - 1] = w ? (alone[w.index] ??= { whole: w, segments: NO_SEGMENTS, ladders: NO_LADDERS })
      : here ? { whole: null, segments: here, ladders: NO_LADDERS } : gap;
  }
  for (const ladder of ast.ladders) {
    const first = ctx.graded(ladder.first);
    const last = ctx.graded(ladder.last);
    if (!(first >= 1 && last > first)) {
      ctx.reporter.report('LW212', ladder.span, { first, last });
      continue;
    }
    for (let n = first; n <= Math.min(last, max); n++) {
      let r = rounds[n - 1];
      // Entries without ladders are shared: the round gets its own before its first ladder.
      if (r.ladders === NO_LADDERS) r = rounds[n - 1] = { whole: r.whole, segments: r.segments, ladders: [] };
      r.ladders.push({ ladder, phase: n === first ? 'setup' : n === last ? 'close' : 'work', first });
    }
  }
  return { rounds, ranges };
}
