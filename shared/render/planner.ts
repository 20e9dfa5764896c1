/**
 * Backing-stitch planner: for a range of rounds (optionally one segment),
 * proposes ladder columns so that no float is longer than the float limit,
 * with as few columns (so as few extra stitches) as possible, writes them
 * as a Loopwright `ladder` line, and proves the proposal by compiling the
 * patched source and checking the floats of every round in the range.
 *
 * (shared/check/plan.ts plans which line works which round; this module
 * builds on the checker's output instead: the stitch model and its floats.)
 *
 * ## The algorithm, per size and per yarn
 * Coordinates: the front stitches of a round, 0..N-1, in the working order
 * of the range's first round (flat rows on the other side are mirrored, so
 * a column is the same physical column on every row). A column at boundary
 * p sits after front stitch p-1, i.e. after p front stitches.
 * 1. For every round of the range, the floats of yarn y are the runs of
 *    front stitches not in y between two catches (a stitch in y or a
 *    backing stitch in y); in the round the first and last runs join.
 * 2. A run longer than the limit L needs a column in every window of L+1
 *    consecutive floated stitches: the window [s, s+L] is cut only by a
 *    column at a boundary p with s+1 <= p <= s+L. So each window is an
 *    interval of allowed boundaries; the columns must hit every interval.
 *    (Columns are the same on every round of the range, so the intervals
 *    of all rounds are pooled.)
 * 3. Hitting every interval with the fewest points is solved exactly by
 *    the greedy rule: sort the intervals by their right end; take the first
 *    interval not yet hit and put a point at the rightmost allowed boundary
 *    inside it; repeat. Why it is optimal (exchange argument): let I1 be
 *    the interval with the smallest right end and g1 the greedy's point,
 *    the rightmost allowed boundary of I1. An optimal set O must hit I1 at
 *    some allowed o1 <= g1. Any interval J that o1 hits has left end <= o1
 *    <= g1 and right end >= I1's right end >= g1, so J holds g1 as well:
 *    swapping o1 for g1 leaves O a valid set of the same size. The rest of
 *    O hits every interval g1 misses; by induction on those, the greedy
 *    needs no more points than O. Hence the greedy is optimal.
 * 4. In the round, a window can cross the start of the round (where no
 *    column can sit). Any solution has a point in the first crossing window
 *    W; for each allowed boundary c of W (at most L of them) we fix c, turn
 *    the circle into a line starting at c (every interval not holding c is
 *    then an ordinary interval) and run the greedy on the rest; the best of
 *    these is optimal, since an optimal set holds some c of W and the greedy
 *    is optimal for the rest.
 * The segment limits where columns may go (never at the segment's edges).
 */
import { compile, type CompileResult } from '../index';
import { parseSource } from '../notation';
import type { SizeModel } from '../check';
import { FLAG } from '../check';
import { floatLimitFromHeader } from './chart-model';

/** What to plan. */
export interface PlanRequest {
  source: string;
  /** First and last round (row) of the range, 1-based, inclusive. */
  first: number;
  last: number;
  /** Limit the columns to this segment (marker name, or "start"). */
  segment?: string;
}

/** The plan for one size. */
export interface SizePlan {
  size: string;
  /** Yarn to carry in the columns (null when no float is too long). */
  yarn: string | null;
  /** Columns after these front stitches, counted from the segment's (or round's) start in the first round's working order. */
  columns: number[];
  /** Backing stitches the columns add on each round (one per column). */
  extraStitches: number;
  /** Yarns that would need columns too (one ladder per segment can run at a time). */
  otherYarns: string[];
  /**
   * For the other yarns: where to catch them by hand (`catch YARN` before
   * the front stitch after `after` front stitches, counted as the columns
   * are), per round, the fewest catches per round by the same greedy.
   */
  catches: { yarn: string; round: number; after: number[] }[];
}

/** The planner's answer. */
export interface PlanResult {
  /** True when a proposal was made and the patched source has no float over the limit in the range and no new error. */
  ok: boolean;
  sizes: SizePlan[];
  /** Loopwright lines to insert (empty when nothing is needed or possible). */
  ladderSource: string;
  /** The source with the lines appended. */
  patchedSource: string;
  /** Floats over the limit in the range, before and after, per size ("M round 12: B 9 sts"). */
  before: string[];
  after: string[];
  /** Why something could not be done. */
  problems: string[];
}

interface RoundView { front: Uint8Array; backAt: number[][]; seg: [number, number]; number: number }

/** Plans ladder columns for the range. Never throws on user input. */
export function planBacking(req: PlanRequest): PlanResult {
  const problems: string[] = [];
  const result = compile(req.source);
  const out: PlanResult = { ok: false, sizes: [], ladderSource: '', patchedSource: req.source, before: [], after: [], problems };
  if (!result.ok) { problems.push('The pattern has errors; fix them first (the planner works on a pattern that adds up).'); return out; }
  const limit = floatLimitFromHeader(result);
  if (limit === null) { problems.push('The pattern declares no usable gauge, so floats cannot be measured against a limit.'); return out; }
  if (!(req.first >= 1 && req.last >= req.first)) { problems.push(`The range ${req.first}-${req.last} is not a range of rounds.`); return out; }
  out.before = overLimit(result, req.first, req.last, limit);
  for (const s of result.sizes) {
    const plan = planSize(s, result, req, limit, problems);
    if (plan) out.sizes.push(plan);
  }
  const needed = out.sizes.filter((p) => p.columns.length > 0);
  if (needed.length === 0) {
    if (out.before.length === 0) { out.ok = true; problems.push('No float in the range is longer than the limit: nothing to add.'); }
    return out;
  }
  const yarn = needed[0].yarn!;
  if (needed.some((p) => p.yarn !== yarn)) problems.push('The sizes need columns in different yarns; the proposal uses the first size\'s yarn.');
  const lines = ladderLines(out.sizes, yarn, result, req, problems);
  if (!lines) return out;
  const clash = existingLadder(req);
  if (clash) problems.push(`A ladder line already runs over these rounds in the same place (line ${clash}); only one ladder works a segment at a time, so add the proposed columns to that line instead.`);
  out.ladderSource = lines;
  out.patchedSource = `${req.source.replace(/\s*$/, '')}\n\n# Backing columns proposed by the planner (rounds ${req.first}-${req.last}).\n${lines}\n`;
  const patched = compile(out.patchedSource);
  out.after = overLimit(patched, req.first, req.last, limit);
  const newErrors = patched.diagnostics.filter((d) => d.severity === 'error');
  if (newErrors.length) problems.push(`The patched source has errors: ${newErrors.slice(0, 3).map((d) => d.message).join('; ')}`);
  out.ok = patched.ok && out.after.length === 0;
  return out;
}

/** The line of an existing ladder over the same place and overlapping rounds (first size's numbers), or null. */
function existingLadder(req: PlanRequest): number | null {
  const { ast } = parseSource(req.source);
  for (const l of ast.ladders) {
    const first = l.first.values[0], last = l.last.values[0];
    const samePlace = (l.segment?.name ?? null) === (req.segment ?? null) || !l.segment || !req.segment;
    if (samePlace && first <= req.last + 1 && last >= req.first) return l.span.line;
  }
  return null;
}

/** Floats over the limit in rounds [first, last], as the checker measured them. */
function overLimit(result: CompileResult, first: number, last: number, limit: number): string[] {
  const word = result.header.construction === 'flat' ? 'row' : 'round';
  const list: string[] = [];
  for (const s of result.sizes) {
    for (const r of s.stitches.rounds) {
      if (r.number < first || r.number > last) continue;
      for (const f of r.floats) if (f.stitches > limit) list.push(`${s.name} ${word} ${r.number}: ${s.stitches.yarns[f.yarn]} ${f.stitches} sts`);
    }
  }
  return list;
}

/** Front yarns, backing boundaries per yarn and the segment's front range of each round, in the first round's orientation. */
function viewRounds(s: SizeModel, req: PlanRequest, problems: string[]): RoundView[] | null {
  const level = s.stitches;
  const recs = level.rounds.filter((r) => r.number >= req.first && r.number <= req.last);
  if (recs.length !== req.last - req.first + 1) { problems.push(`Size ${s.name} does not work every round from ${req.first} to ${req.last}.`); return null; }
  const views: RoundView[] = [];
  const firstSide = recs[0].side;
  for (const rec of recs) {
    const front: number[] = [];
    const backAt: number[][] = level.yarns.map(() => []);
    const frontBefore: number[] = [];
    for (let i = rec.offset; i < rec.offset + rec.count; i++) {
      frontBefore.push(front.length);
      if (level.store.flags[i] & FLAG.BACKING) backAt[level.store.yarn[i]].push(front.length);
      else front.push(level.store.yarn[i]);
    }
    const n = front.length;
    let seg: [number, number] = [0, n];
    if (req.segment) {
      const names = ['start', ...rec.markers.map((m) => m.name)];
      const k = names.indexOf(req.segment);
      if (k < 0) { problems.push(`Round ${rec.number} of size ${s.name} has no segment ${req.segment} (it has ${names.join(', ')}).`); return null; }
      const from = k === 0 ? 0 : frontBefore[rec.markers[k - 1].at] ?? n;
      const to = k < rec.markers.length ? frontBefore[rec.markers[k].at] ?? n : n;
      seg = [from, to];
    }
    const mirror = rec.side !== firstSide;
    views.push({
      number: rec.number,
      front: Uint8Array.from(mirror ? front.reverse() : front),
      backAt: backAt.map((b) => (mirror ? b.map((x) => n - x) : b)),
      seg: mirror ? [n - seg[1], n - seg[0]] : seg,
    });
  }
  const n0 = views[0].front.length;
  if (views.some((v) => v.front.length !== n0 || v.seg[0] !== views[0].seg[0] || v.seg[1] !== views[0].seg[1])) {
    problems.push(`Size ${s.name}: the front count (or the segment) changes within rounds ${req.first}-${req.last}; plan a range without shaping.`);
    return null;
  }
  return views;
}

/** Runs of yarn y's floats in one round: [start, length] in front-stitch coordinates (start may wrap past n in the round). */
export function floatRuns(front: Uint8Array, backAt: readonly number[], y: number, cyclic: boolean): [number, number][] {
  const n = front.length;
  const cut = new Uint8Array(n + 1); // cut[k]: a catch between stitch k-1 and k (backing stitch in y)
  for (const b of backAt) cut[b] = 1;
  const runs: [number, number][] = [];
  let start = -1;
  for (let i = 0; i < n; i++) {
    if (cut[i] && start >= 0) { runs.push([start, i - start]); start = -1; }
    if (front[i] === y) { if (start >= 0) runs.push([start, i - start]); start = -1; continue; }
    if (start < 0) start = i;
  }
  if (start >= 0) runs.push([start, n - start]);
  if (!cyclic || runs.length === 0) return runs;
  const caught = front.some((v) => v === y) || backAt.length > 0;
  if (!caught) return [[0, n]];
  const head = runs[0], tail = runs[runs.length - 1];
  // The run that reaches the end of the round joins the one at its start (no catch between them).
  if (runs.length > 1 && head[0] === 0 && tail[0] + tail[1] === n && !cut[0] && !cut[n]) return [...runs.slice(1, -1), [tail[0], tail[1] + head[1]]];
  return runs;
}

/**
 * The fewest points hitting every interval [lo, hi] (inclusive, integers),
 * using only points in [allowedLo, allowedHi]: the greedy of step 3 above
 * (sort by right end, take the rightmost allowed point of the first
 * interval not yet hit). Intervals with no allowed point are counted in
 * `unhittable` and skipped. Points come out in increasing order.
 */
export function stabIntervals(intervals: readonly (readonly [number, number])[], allowedLo: number, allowedHi: number): { points: number[]; unhittable: number } {
  const points: number[] = [];
  let unhittable = 0;
  for (const [lo, hi] of [...intervals].sort((x, y) => Math.min(x[1], allowedHi) - Math.min(y[1], allowedHi))) {
    const a = Math.max(lo, allowedLo), b = Math.min(hi, allowedHi);
    if (a > b) { unhittable++; continue; }
    // Points are taken in increasing order, so the last one is the only one that can lie in [a, b] if any does.
    if (points.length && points[points.length - 1] >= a) continue;
    points.push(b);
  }
  return { points, unhittable };
}

/**
 * The fewest boundaries (1..n-1; 0 is the start of the round) hitting every
 * cyclic interval [lo, hi] (hi may pass n: it wraps). Exact: see step 4.
 */
export function coverCircle(intervals: readonly (readonly [number, number])[], n: number): number[] {
  const holds = (iv: readonly [number, number], p: number) => (p >= iv[0] && p <= iv[1]) || (p + n >= iv[0] && p + n <= iv[1]);
  const crossing = intervals.find((iv) => iv[1] >= n) ?? intervals[0];
  if (!crossing) return [];
  let best: number[] | null = null;
  for (let c = crossing[0]; c <= crossing[1]; c++) {
    const cut = c % n;
    if (cut === 0) continue;
    // Unroll: u = (p - cut) mod n; the start of the round (p = 0) becomes u = n - cut, which stays forbidden.
    const rest: [number, number][] = [];
    for (const iv of intervals) {
      if (holds(iv, cut)) continue;
      const a = (((iv[0] - cut) % n) + n) % n;
      rest.push([a, a + (iv[1] - iv[0])]);
    }
    const forbidden = n - cut;
    const points = stabWhere(rest, (u) => u >= 1 && u <= n - 1 && u !== forbidden);
    if (points === null) continue;
    const mapped = [cut, ...points.map((u) => (u + cut) % n)];
    if (!best || mapped.length < best.length) best = mapped;
  }
  return best ?? [];
}

/** The greedy with an allowed-point test: null when some interval has no allowed point. */
function stabWhere(intervals: readonly (readonly [number, number])[], isAllowed: (p: number) => boolean): number[] | null {
  const points: number[] = [];
  for (const [lo, hi] of [...intervals].sort((x, y) => x[1] - y[1])) {
    if (points.length && points[points.length - 1] >= lo) continue;
    let p = hi;
    while (p >= lo && !isAllowed(p)) p--;
    if (p < lo) return null;
    points.push(p);
  }
  return points;
}

/** Plans one size; null (with a problem) when it cannot. */
function planSize(s: SizeModel, result: CompileResult, req: PlanRequest, limit: number, problems: string[]): SizePlan | null {
  const views = viewRounds(s, req, problems);
  if (!views) return null;
  const cyclic = result.header.construction === 'round';
  const yarns = s.stitches.yarns;
  const n = views[0].front.length;
  // Which yarns float too far (only rounds where the yarn is used count: elsewhere it does not float).
  const worst = yarns.map((_, y) => {
    let max = 0;
    for (const v of views) {
      if (!v.front.some((f) => f === y) && v.backAt[y].length === 0) continue;
      for (const [, len] of floatRuns(v.front, v.backAt[y], y, cyclic)) max = Math.max(max, len);
    }
    return max;
  });
  const order = yarns.map((_, y) => y).filter((y) => worst[y] > limit).sort((a, b) => worst[b] - worst[a] || a - b);
  if (order.length === 0) return { size: s.name, yarn: null, columns: [], extraStitches: 0, otherYarns: [], catches: [] };
  const y = order[0];
  const [s0, s1] = views[0].seg;
  const lo0 = Math.max(1, s0 + 1), hi0 = Math.min(n - 1, s1 - 1);
  const linear: [number, number][] = [];
  const wrapping: [number, number][][] = [];
  for (const v of views) {
    for (const [start, len] of floatRuns(v.front, v.backAt[y], y, cyclic)) {
      if (len <= limit) continue;
      const full = cyclic && len === n && start === 0 && !v.front.some((f) => f === y) && v.backAt[y].length === 0;
      const windows = full ? n : len - limit;
      for (let w = 0; w < windows; w++) {
        let lo = start + w + 1, hi = start + w + limit;
        if (lo >= n) { lo -= n; hi -= n; }
        if (hi < n) linear.push([lo, hi]);
        else wrapping.push([[lo, n - 1], [1, hi - n]]);
      }
    }
  }
  const clip = ([a, b]: [number, number]): [number, number] => [Math.max(a, lo0), Math.min(b, hi0)];
  let chosen: number[];
  let unfixable = 0;
  if (wrapping.length && lo0 === 1 && hi0 === n - 1) {
    // The whole round, with floats across its start: exact, by fixing one point of a crossing window.
    const all = [...linear, ...wrapping.map((w) => [w[0][0], w[1][1] + n] as [number, number])];
    chosen = coverCircle(all, n);
  } else {
    // Within a segment at most one piece of a crossing window survives the clipping: it is an ordinary interval.
    const pieces = wrapping.map((w) => w.map(clip).filter(([a, b]) => a <= b)[0] ?? ([1, 0] as [number, number]));
    const stabbed = stabIntervals([...linear, ...pieces], lo0, hi0);
    chosen = stabbed.points;
    unfixable = stabbed.unhittable;
  }
  if (unfixable) problems.push(`Size ${s.name}: ${unfixable} stretch${unfixable === 1 ? '' : 'es'} of float cannot be cut inside ${req.segment ? `segment ${req.segment}` : 'the round'}; a column would have to sit outside it.`);
  const columns = [...new Set(chosen)].sort((a, b) => a - b).map((p) => p - s0);
  // Catches for the other yarns, round by round (a catch is worked on one round only).
  const catches: SizePlan['catches'] = [];
  for (const y2 of order.slice(1)) {
    for (const v of views) {
      if (!v.front.some((f) => f === y2) && v.backAt[y2].length === 0) continue;
      const ivs: [number, number][] = [];
      for (const [start, len] of floatRuns(v.front, v.backAt[y2], y2, cyclic)) {
        for (let w = 0; w + limit < len; w++) {
          const lo = (start + w + 1) % n, hi = lo + limit - 1;
          if (hi < n) ivs.push([lo, hi]);
        }
      }
      const hit = stabIntervals(ivs, lo0, hi0).points;
      if (hit.length) catches.push({ yarn: yarns[y2], round: v.number, after: hit.map((p) => p - s0) });
    }
  }
  return { size: s.name, yarn: yarns[y], columns, extraStitches: columns.length, otherYarns: order.slice(1).map((k) => yarns[k]), catches };
}

/** Adds columns in the middle of the widest gaps until there are `count` (more columns never lengthen a float). */
function padColumns(columns: number[], count: number, width: number): number[] {
  const cols = [...columns];
  while (cols.length < count) {
    const edges = [0, ...cols, width];
    let best = 0;
    for (let i = 1; i < edges.length; i++) if (edges[i] - edges[i - 1] > edges[best + 1] - edges[best]) best = i - 1;
    const mid = Math.floor((edges[best] + edges[best + 1]) / 2);
    if (mid <= edges[best] || mid >= edges[best + 1]) break;
    cols.push(mid);
    cols.sort((a, b) => a - b);
  }
  return cols;
}

/** The ladder line(s) for the plans, graded per size when they differ. */
function ladderLines(plans: SizePlan[], yarn: string, result: CompileResult, req: PlanRequest, problems: string[]): string | null {
  const sizes = result.header.sizes.length ? result.header.sizes : plans.map((p) => p.size);
  const bySize = new Map(plans.map((p) => [p.size, p]));
  if (sizes.some((n) => !bySize.has(n))) { problems.push('Not every size could be planned; see the other problems.'); return null; }
  const count = Math.max(...plans.map((p) => p.columns.length));
  const width = (name: string) => {
    const s = result.sizes.find((x) => x.name === name)!;
    const rec = s.stitches.rounds.find((r) => r.number === req.first)!;
    return rec ? rec.front : 0;
  };
  const lists = sizes.map((n) => padColumns(bySize.get(n)!.columns, count, width(n)));
  if (lists.some((l) => l.length !== count)) { problems.push('The sizes need different numbers of columns and the smaller ones have no room for more.'); return null; }
  const graded = lists[0].map((_, i) => {
    const vals = lists.map((l) => l[i]);
    return vals.every((v) => v === vals[0]) ? String(vals[0]) : vals.join('/');
  });
  // The closing round no longer holds the column, so the ladder closes on the round after the range.
  const lastRound = Math.min(...result.sizes.map((s) => s.rounds.length));
  let to = req.last + 1;
  if (to > lastRound) {
    to = req.last;
    problems.push(`Round ${req.last} is the last round, so the columns close on it and do not catch its floats.`);
  }
  const word = result.header.construction === 'flat' ? 'row' : 'round';
  const others = [...new Set(plans.flatMap((p) => p.otherYarns))];
  if (others.length) problems.push(`Yarn${others.length > 1 ? 's' : ''} ${others.join(', ')} also float too far; one ladder runs per segment at a time, so catch ${others.length > 1 ? 'them' : 'it'} by hand with \`catch\` where listed (wrapping floats across the start of the round are not listed).`);
  return `ladder ${yarn} columns ${graded.join(', ')} from ${word} ${req.first} to ${to}${req.segment ? ` at ${req.segment}` : ''}`;
}

/** Plain-text report of a plan. */
export function formatPlanText(plan: PlanResult): string {
  const lines: string[] = [];
  for (const p of plan.sizes) {
    lines.push(p.yarn
      ? `size ${p.size}: ${p.columns.length} column${p.columns.length === 1 ? '' : 's'} of ${p.yarn} after front sts ${p.columns.join(', ')} (${p.extraStitches} extra st${p.extraStitches === 1 ? '' : 's'} on each round)`
      : `size ${p.size}: no float over the limit`);
  }
  if (plan.ladderSource) {
    lines.push('', 'Insert:', `  ${plan.ladderSource}`);
  }
  lines.push('', `Floats over the limit in the range before: ${plan.before.length ? plan.before.length : 'none'}`);
  if (plan.ladderSource) lines.push(`After compiling the patched source: ${plan.after.length ? plan.after.join('; ') : 'none'}`);
  for (const p of plan.sizes) {
    for (const c of p.catches) lines.push(`size ${p.size}, ${c.round}: catch ${c.yarn} after front sts ${c.after.join(', ')}`);
  }
  for (const p of plan.problems) lines.push(`note: ${p}`);
  lines.push(plan.ok ? 'proof: the patched source compiles with no float over the limit in the range' : 'no proof: see the notes');
  return `${lines.join('\n')}\n`;
}
