/**
 * The stitch machine, rounds: works every planned round of one size in
 * order, from the cast-on onwards, and records each round (offset into the
 * store, counts, markers, segments, floats). Flat work turns the needle
 * between rows: a row's input is the previous row's output reversed.
 */
import { OP, type PatternAst, type RoundLine } from '../notation';
import type { Span } from '../types';
import { START_SEGMENT, type LadderRun, type Machine, type MarkerPos, type SegmentRange } from './machine';
import { execOps } from './ops';
import { LIMITS, TRACED } from './context';
import { leftNeedleAsFound, roundKey } from './reuse';
import { measureFloats, type FloatRun } from './floats';
import { FLAG } from './store';
import { sideOf, type PlannedRound, type LineRange } from './plan';
import type { ReportCall } from './context';
import type { MachineEvent } from './machine';
import type { Checkpoint, RoundsResumer, SizeTrace } from './resume';

/** One worked round as the model keeps it. */
export interface RoundRecord {
  number: number;
  side: 'RS' | 'WS';
  /** First stitch of the round in the size's store; the round's stitches are [offset, offset + count). */
  offset: number;
  count: number;
  front: number;
  backing: number;
  /** Stitches on the needle when the round began. */
  start: number;
  /** Stitches the round's operations asked for (equals `start` minus ladder-managed stitches when the round adds up). */
  worked: number;
  /** Markers after the round, in its working order (marker sits before stitch `at`). */
  markers: MarkerPos[];
  /** The segments the round was worked in, input positions in working order. */
  segments: SegmentRange[];
  /** The longest float per yarn that floats at all. */
  floats: FloatRun[];
  /** The line(s) that gave the instructions (source indexes), and the main span. */
  lines: number[];
  span: Span;
  note: string | null;
}

/** Reverses marker positions for a needle of `len` stitches turned around. */
function turnMarkers(markers: readonly MarkerPos[], len: number): MarkerPos[] {
  return markers.map((m) => ({ name: m.name, at: len - m.at })).reverse();
}

/** Segments from markers (RS orientation), then put in working order. */
function segmentsOf(rsMarkers: readonly MarkerPos[], len: number, ws: boolean): SegmentRange[] {
  const segs: SegmentRange[] = [];
  let from = 0, name = START_SEGMENT;
  for (const m of rsMarkers) {
    segs.push({ name, from, to: m.at });
    from = m.at; name = m.name;
  }
  segs.push({ name, from, to: len });
  if (!ws) return segs;
  return segs.map((s) => ({ name: s.name, from: len - s.to, to: len - s.from })).reverse();
}

/** Options of workRounds for the incremental compiler (see resume.ts). */
export interface WorkRoundsOptions {
  /** Record the fold into a trace (returned as `trace`). */
  record?: boolean;
  /** Takes what it can from an earlier compile's trace (resume.ts createResumer). */
  resume?: RoundsResumer;
  /** Report calls made while planning these rounds (kept in the trace: a plan is carried over only when it made none). */
  planReports?: number;
}

/** What workRounds did, for the incremental compiler. */
export interface WorkRoundsStats { reusedRounds: number; workedRounds: number }

/**
 * Works all rounds; returns their records (fewer than planned if the size
 * hit a bound), and with `record` the trace a later compile can resume from.
 */
export function workRounds(
  m: Machine, ast: PatternAst, plan: PlannedRound[], ranges: Map<RoundLine, LineRange>,
  castOn: { count: number; yarn: number; src: number }, flat: boolean, options: WorkRoundsOptions = {},
): { records: RoundRecord[]; trace: SizeTrace | null; stats: WorkRoundsStats } {
  const records: RoundRecord[] = [];
  const { ctx, store } = m;
  const stats: WorkRoundsStats = { reusedRounds: 0, workedRounds: 0 };
  const resume = TRACED ? options.resume : undefined;
  const recording = TRACED && (options.record === true || resume !== undefined);
  const reports: ReportCall[] = [];
  const events: MachineEvent[] = [];
  const checkpoints: Checkpoint[] = [];
  // repeats[i]: plan[i] has the reuse.ts key of plan[i - 1] (a round that may share the previous round's stitches).
  const repeats: boolean[] = [];
  const previousReportTrace = ctx.reporter.trace;
  if (TRACED && recording) { ctx.reporter.trace = reports; m.trace = events; }
  const done = (): { records: RoundRecord[]; trace: SizeTrace | null; stats: WorkRoundsStats } => {
    if (TRACED && recording) { ctx.reporter.trace = previousReportTrace; m.trace = null; }
    // The end-of-size checks read the word; rounds taken from a trace did not set it.
    if (records.length) m.word = flat ? 'row' : 'round';
    const trace = TRACED && recording ? {
      plan, ranges, planReports: options.planReports ?? -1, repeats, checkpoints, records, store, columns: m.columns, events, reports, aborted: m.aborted,
      spare: resume ? resume.spare() : null,
    } : null;
    return { records, trace, stats };
  };
  const keyOf = (i: number): string | null => (flat ? null : roundKey(plan[i], m.charts));

  // The rounds before the first changed one come from the trace (resume.ts).
  const range = TRACED && resume ? resume.changed(plan) : { first: 0, last: -1 };
  const start = range.first;
  // Room for every round at the cast-on width (plus a little for shaping and backing), to grow rarely.
  const expected = Math.min(castOn.count * (plan.length + 1) * 1.1 + 1024, LIMITS.stitchesPerSize * 1.05) | 0;
  let prevOff = 0, prevLen = castOn.count, prevMarkers: MarkerPos[] = [], prevSide: 'RS' | 'WS' = flat ? 'WS' : 'RS';
  let prevKey: string | null = null;
  let prevStable = false;
  let lastKey: string | null = null; // the key of the plan entry before the current one
  // `TRACED &&` lets the client build drop the resuming code (a constant there).
  if (TRACED && start > 0) {
    ({ prevOff, prevLen, prevMarkers, prevStable } = resume!.restore(m, start, { records, checkpoints, repeats }));
    m.store.reserve(Math.max(0, expected - m.store.length));
    prevKey = keyOf(start - 1);
    lastKey = prevKey;
    stats.reusedRounds += start;
  } else {
    // The cast-on is stored first, as the needle before round 1 (not a round).
    // A cast-on past the bound stops the size before any room is made for it (4 sizes of 2 million took 0.1 s to allocate).
    if (!m.room(castOn.count, m.sources.spans[castOn.src])) return done();
    m.store.reserve(expected);
    for (let i = 0; i < castOn.count; i++) {
      const k = store.length++;
      store.op[k] = OP.co; store.yarn[k] = castOn.yarn; store.flags[k] = 0; store.src[k] = castOn.src; store.col[k] = -1;
    }
  }
  const yarnCount = ctx.head.yarns.length;
  const defaultYarn = castOn.yarn;
  const checkpoint = (): Checkpoint => ({
    storeLen: store.length, events: events.length, reports: reports.length, columns: m.columns.length,
    logical: m.logical, steps: m.steps, ops: m.ops, prevOff, prevLen, prevMarkers, prevStable,
  });

  for (let pi = start; pi < plan.length; pi++) {
    const p = plan[pi];
    const number = pi + 1, side = sideOf(number, flat);
    if (m.aborted) break;
    // Plan entries are shared (plan.ts): the same entry as the round before has its key.
    const key = p === plan[pi - 1] ? lastKey : keyOf(pi);
    repeats[pi] = key !== null && key === lastKey;
    lastKey = key;
    if (TRACED && resume && pi > range.last) {
      // Back in the state the earlier compile had here? Then the rest is the same (resume.ts).
      const taken = resume.splice(m, pi, { prevOff, prevLen, prevMarkers, prevStable }, { records, checkpoints, repeats, events: events.length, reports: reports.length, planLength: plan.length });
      if (taken > 0) { stats.reusedRounds += taken; return done(); }
    }
    if (TRACED && recording) checkpoints[pi] = checkpoint();
    stats.workedRounds++;
    m.logical += prevLen;
    if (key !== null && key === prevKey && prevStable) {
      // Same instructions on an unchanged needle: the same round again (see reuse.ts).
      if (m.logical + prevLen > LIMITS.stitchesPerSize) {
        m.abort(p.whole?.span ?? records[records.length - 1].span, `more than ${LIMITS.stitchesPerSize.toLocaleString('en')} stitches would be worked`);
        break;
      }
      const r = records[records.length - 1];
      // Written out rather than spread: a gap of tens of thousands of rounds makes one record each.
      records.push({
        number, side, offset: r.offset, count: r.count, front: r.front, backing: r.backing, start: r.start, worked: r.worked,
        markers: r.markers, segments: r.segments, floats: r.floats, lines: r.lines, span: r.span, note: r.note,
      });
      continue;
    }
    const reported = ctx.reporter.calls;
    const ws = side === 'WS';
    let flags = store.flags.subarray(prevOff, prevOff + prevLen);
    let yarn = store.yarn.subarray(prevOff, prevOff + prevLen);
    let col = store.col.subarray(prevOff, prevOff + prevLen);
    let markers = prevMarkers;
    if (flat) {
      flags = flags.slice().reverse(); yarn = yarn.slice().reverse(); col = col.slice().reverse();
      markers = turnMarkers(prevMarkers, prevLen);
    }
    const rsMarkers = ws ? turnMarkers(markers, prevLen) : markers;
    const segs = segmentsOf(rsMarkers, prevLen, ws);
    m.load(flags, yarn, col, markers.map((x) => ({ ...x })), segs);
    m.roundNo = number; m.side = side; m.word = flat ? 'row' : 'round';
    m.ladders = p.ladders.map((l): LadderRun => ({
      ladder: l.ladder, phase: l.phase, count: 0, src: m.sources.of(l.ladder), yarn: ctx.yarn(l.ladder.yarn, defaultYarn),
      every: l.ladder.every ? Math.max(0, ctx.graded(l.ladder.every)) : 0,
      columns: new Set(l.ladder.columns.map((c) => ctx.graded(c))),
    }));
    for (const l of m.ladders) {
      if (l.ladder.every && l.every < 1) ctx.report('LW103', l.ladder.every.span, { what: 'a ladder spacing', need: 'at least 1 stitch', value: l.every });
      if (l.ladder.segment && !segs.some((s) => s.name === l.ladder.segment!.name)) {
        ctx.report('LW204', l.ladder.segment.span, { round: number, name: l.ladder.segment.name, known: segs.map((s) => s.name).join(', ') });
      }
    }
    const lines: number[] = [];
    let span: Span = p.whole?.span ?? [...p.segments.values()][0]?.span ?? ast.rounds[0]?.span ?? m.sources.spans[castOn.src];
    let worked = 0;
    const start = prevLen;
    m.selectLadder();
    if (p.whole || p.segments.size === 0) {
      m.end = prevLen; m.scopeName = null; m.worked = 0; m.missing = 0; m.problem = false;
      m.passEvents();
      if (p.whole) {
        workLine(m, p.whole, ranges, defaultYarn);
        lines.push(m.sources.of(p.whole));
      } else m.problem = true; // LW209 already says why
      finishScope(m, m.countable(0, prevLen), span);
      worked = m.worked;
    } else {
      const names = new Set(segs.map((s) => s.name));
      let misnamed = false;
      for (const [name, line] of p.segments) {
        if (!names.has(name)) { misnamed = true; ctx.report('LW204', line.segment!.span, { round: number, name, known: [...names].join(', ') }); }
      }
      for (let si = 0; si < segs.length && !m.aborted; si++) {
        const seg = segs[si];
        m.pos = seg.from; m.end = seg.to; m.scopeName = seg.name; m.worked = 0; m.missing = 0; m.problem = false;
        m.enterSegment(si);
        const line = p.segments.get(seg.name);
        const onNeedle = m.countable(seg.from, seg.to);
        if (line) {
          workLine(m, line, ranges, defaultYarn);
          lines.push(m.sources.of(line));
        } else if (seg.to > seg.from && !misnamed) {
          const first = [...p.segments.values()][0];
          ctx.report('LW305', first.headSpan, { word: m.word, round: number, segment: seg.name, stitches: onNeedle }, `${number}:${seg.name}`);
        }
        if (!line) m.problem = true; // LW305 (or LW204) already says why
        finishScope(m, onNeedle, line?.span ?? span);
        worked += m.worked;
      }
    }
    m.end = prevLen;
    m.pos = prevLen;
    m.passEvents(true);
    const offset = m.outStart;
    const count = store.length - offset;
    const floats = measureFloats(store, offset, count, yarnCount, m.catchYarn, m.catchAt, !flat);
    if (lines.length) span = m.sources.spans[lines[0]];
    const note = p.whole?.note ?? [...p.segments.values()].find((l) => l.note)?.note ?? null;
    records.push({
      number, side, offset, count, front: m.front, backing: m.backing, start, worked,
      markers: m.markersOut, segments: segs, floats, lines, span, note,
    });
    prevKey = key;
    prevStable = key !== null && !m.aborted && ctx.reporter.calls === reported && leftNeedleAsFound(m, markers, offset, count);
    prevOff = offset; prevLen = count; prevMarkers = m.markersOut; prevSide = side;
  }
  void prevSide;
  if (TRACED && recording && !m.aborted) checkpoints[records.length] = checkpoint();
  return done();
}

/** Works one line over the current scope with its yarn. */
function workLine(m: Machine, line: RoundLine, ranges: Map<RoundLine, LineRange>, defaultYarn: number): void {
  m.lineFirst = ranges.get(line)?.first ?? 1;
  m.lineSpan = line.span;
  execOps(m, line.ops, m.ctx.yarn(line.yarn, defaultYarn));
}

/** Ends a scope: works trailing ladder stitches, checks the count (LW301), passes leftovers through. */
function finishScope(m: Machine, onNeedle: number, span: Span): void {
  while (m.pos < m.end && (m.inFlags[m.pos] & FLAG.MANAGED)) {
    if (m.pos >= m.nextEvent) m.passEvents();
    m.autoBacking(m.pos);
    m.pos++;
  }
  if (m.pendingClose >= 0) m.unclosed();
  const leftover = m.countable(m.pos, m.end);
  if (!m.problem && !m.aborted && (leftover > 0 || m.missing > 0)) {
    m.ctx.report('LW301', span, { word: m.word, round: m.roundNo, worked: m.worked, onNeedle, ...(m.scopeName ? { segment: m.scopeName } : {}) });
  }
  if (m.aborted) return;
  m.store.reserve(m.end - m.pos);
  while (m.pos < m.end) {
    if (m.pos >= m.nextEvent) m.passEvents();
    const i = m.pos++;
    const f = m.inFlags[i];
    if (f & FLAG.BACKING) m.putBacking(OP.carry, m.inYarn[i], 0, f | FLAG.UNWORKED, m.inCol[i]);
    else m.putFront(OP.k, m.inYarn[i], 0, FLAG.UNWORKED);
  }
}
