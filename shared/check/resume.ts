/**
 * Resuming a size's rounds from an earlier compile (for the incremental
 * compiler, shared/incremental.ts). The rounds of one size are a fold: each
 * round reads the needle the round before left, the markers, the machine's
 * counters and its memory of closings, and writes stitches, a record, report
 * calls and machine events. When a compile records that fold (`SizeTrace`),
 * a later compile of an edited text can
 *
 * 1. take the rounds before the first round whose plan changed from the
 *    trace (their inputs are the same, so a fresh run would do the same),
 * 2. work the changed rounds, and the ones after them until the machine is
 *    back in the state the earlier compile had at that round (same needle,
 *    markers, counters, columns, closings), then
 * 3. take the rest from the trace again.
 *
 * Everything taken is moved into the new compile's terms: AST nodes and
 * spans through `NodeMap` (unchanged statements keep their objects; moved
 * ones were copied with their positions shifted), source indexes through
 * `srcMap`, store offsets by how much the worked rounds grew or shrank the
 * store. Report calls and machine events are replayed through the new
 * reporter and machine, so deduplication and caps come out exactly as in a
 * fresh compile. When anything cannot be mapped, `ResumeMiss` is thrown and
 * the caller compiles afresh. The property test in
 * tests/shared/incremental.test.ts compares every result with a fresh compile.
 */
import type { RoundLine } from '../notation';
import type { Span } from '../types';
import { LIMITS, type ReportCall } from './context';
import type { ColumnInfo, Machine, MachineEvent, MarkerPos } from './machine';
import type { LineRange, PlannedRound } from './plan';
import type { RoundRecord } from './round';
import type { StitchStore } from './store';

/** The state of a size's fold before one round (or after the last). */
export interface Checkpoint {
  storeLen: number;
  /** Length of the machine's event log. */
  events: number;
  /** Report calls made by the rounds so far (counted from the first round). */
  reports: number;
  columns: number;
  logical: number;
  steps: number;
  /** Operations carried out so far (an edit may change it: see splice). */
  ops: number;
  prevOff: number;
  prevLen: number;
  prevMarkers: MarkerPos[];
  prevStable: boolean;
}

/** What one size's rounds did, kept for a later compile. */
export interface SizeTrace {
  plan: PlannedRound[];
  /** The round lines' ranges for this size, as planned. */
  ranges: Map<RoundLine, LineRange>;
  /** Report calls made while planning (-1: not counted). */
  planReports: number;
  /** repeats[i]: plan[i] has the reuse.ts key of plan[i - 1] (it may share that round's stitches). */
  repeats: boolean[];
  /** checkpoints[i]: before plan[i]; the last one is after the last round worked. */
  checkpoints: Checkpoint[];
  records: RoundRecord[];
  store: StitchStore;
  columns: ColumnInfo[];
  events: MachineEvent[];
  /** Report calls made by the rounds (not by planning or the end-of-size checks). */
  reports: ReportCall[];
  aborted: boolean;
  /**
   * A store no result in use reads any more (the one of the compile before
   * the trace's: incremental results are valid until the next call): a
   * compile that resumes from this trace works into its arrays instead of
   * allocating new ones, and leaves this trace's store as the next spare.
   */
  spare: StitchStore | null;
}

/** Thrown when a trace cannot be used; the incremental compiler then compiles afresh. */
export class ResumeMiss extends Error {}

/** How objects of the earlier compile's AST map to this compile's. */
export interface NodeMap {
  /** The new object for an old one (same object when the statement was reused unmoved); null when it is gone. */
  node<T extends object>(old: T): T | null;
  /** New source index by old source index (-1: gone). */
  srcMap: Int32Array;
}

/** What workRounds needs to resume from a trace. */
export interface ResumeFrom {
  trace: SizeTrace;
  map: NodeMap;
  /** True when rounds with no line of their own would be the same (they take their span from the first round line). */
  firstLineSame: boolean;
  /**
   * Round lines of the earlier AST replaced by new ones that plan alike (same
   * word, range, step and segment, at the same place, not the first line),
   * every other round and ladder line being the same object; null when the
   * lines changed otherwise (then planning is done again).
   */
  replaced: ReadonlyMap<RoundLine, RoundLine> | null;
}

/** Whether the planned rounds at one place of both compiles' plans are the same (same lines, same ladders in the same phase). */
export function samePlannedRound(o: PlannedRound, n: PlannedRound, map: NodeMap, firstLineSame: boolean): boolean {
  if (!sameNode(o.whole, n.whole, map)) return false;
  if (o.segments.size !== n.segments.size) return false;
  if (o.segments.size) {
    // In order too: the first segment line names the round in some messages (LW305).
    const it = n.segments.entries();
    for (const [name, line] of o.segments) {
      const [nName, nLine] = it.next().value as [string, RoundLine];
      if (name !== nName || !sameNode(line, nLine, map)) return false;
    }
  }
  if (!o.whole && o.segments.size === 0 && !firstLineSame) return false;
  if (o.ladders.length !== n.ladders.length) return false;
  for (let i = 0; i < o.ladders.length; i++) {
    const a = o.ladders[i], b = n.ladders[i];
    if (a.phase !== b.phase || a.first !== b.first || !sameNode(a.ladder, b.ladder, map)) return false;
  }
  return true;
}

function sameNode(a: object | null, b: object | null, map: NodeMap): boolean {
  if (a === b) return a === null || map.node(a) === b; // the same object may still have been copied (moved)
  if (a === null || b === null) return false;
  return map.node(a) === b;
}

/** A span of the old compile in new terms; ResumeMiss when it belonged to an edited statement. */
export function mapSpan(map: NodeMap, s: Span): Span {
  const n = map.node(s);
  if (!n) throw new ResumeMiss('a span of an edited statement');
  return n;
}

/** The first and last plan index that differ (first = length when none do). */
export function changedRounds(old: PlannedRound[], plan: PlannedRound[], map: NodeMap, firstLineSame: boolean): { first: number; last: number } {
  const n = Math.max(old.length, plan.length);
  let first = n, last = -1;
  let same = false;
  for (let i = 0; i < n; i++) {
    // Entries are shared (plan.ts): the same pair as the round before has the same answer.
    if (!(i > 0 && i < old.length && i < plan.length && old[i] === old[i - 1] && plan[i] === plan[i - 1])) {
      same = i < old.length && i < plan.length && samePlannedRound(old[i], plan[i], map, firstLineSame);
    }
    if (!same) { if (first === n) first = i; last = i; }
  }
  return { first, last };
}

/** Makes `into` (empty) use the whole arrays of `spare` (trimmed to views when its model was finished), its stitches forgotten. */
function adopt(into: StitchStore, spare: StitchStore): void {
  into.op = new Uint8Array(spare.op.buffer);
  into.yarn = new Uint8Array(spare.yarn.buffer);
  into.flags = new Uint8Array(spare.flags.buffer);
  into.src = new Uint32Array(spare.src.buffer);
  into.col = new Int32Array(spare.col.buffer);
  into.length = 0;
}

/** Copies old store [from, to) to the end of `into`, source indexes mapped. */
export function copyStitches(into: StitchStore, from: StitchStore, start: number, end: number, srcMap: Int32Array): void {
  const n = end - start;
  if (n <= 0) return;
  into.reserve(n);
  const at = into.length;
  into.op.set(from.op.subarray(start, end), at);
  into.yarn.set(from.yarn.subarray(start, end), at);
  into.flags.set(from.flags.subarray(start, end), at);
  into.col.set(from.col.subarray(start, end), at);
  const src = into.src, old = from.src;
  // Gone sources map to -1: or-ing every index keeps the sign bit of any (one test after the loop).
  // Old indexes are below srcMap's length (it is as long as the old table).
  let any = 0;
  for (let i = 0; i < n; i++) {
    const s = srcMap[old[start + i]];
    any |= s;
    src[at + i] = s;
  }
  if (any < 0) throw new ResumeMiss('a stitch names a source that is gone');
  into.length = at + n;
}

/** A record of the old compile in new terms; `offset` maps store offsets. */
export function mapRecord(r: RoundRecord, map: NodeMap, offset: ((o: number) => number) | null): RoundRecord {
  const span = mapSpan(map, r.span);
  let same = span === r.span && (offset === null || offset(r.offset) === r.offset);
  for (const s of r.lines) {
    const t = map.srcMap[s];
    if (t === undefined || t < 0) throw new ResumeMiss('a round names a line that is gone');
    if (t !== s) same = false;
  }
  // Unchanged (the usual case before the edit): the same record, shared like every result object.
  if (same) return r;
  const to = offset ?? ((o: number) => o);
  return {
    ...r,
    offset: to(r.offset),
    floats: r.floats.length ? r.floats.map((f) => ({ ...f, fromStitch: to(f.fromStitch), toStitch: to(f.toStitch) })) : r.floats,
    lines: r.lines.map((s) => map.srcMap[s]),
    span,
  };
}

/** Replays old report calls through the new reporter, spans mapped. */
export function replayReports(m: Machine, calls: readonly ReportCall[], from: number, to: number, map: NodeMap): void {
  const rep = m.ctx.reporter;
  for (let i = from; i < to; i++) {
    const c = calls[i];
    rep.report(c.code, mapSpan(map, c.span), c.facts, c.size, c.key, c.related?.map((r) => ({ span: mapSpan(map, r.span), message: r.message })));
  }
}

/** Replays old machine events into the new machine, spans mapped. */
export function replayEvents(m: Machine, events: readonly MachineEvent[], from: number, to: number, map: NodeMap): void {
  for (let i = from; i < to; i++) {
    const e = events[i];
    if (e.kind === 'closed') m.noteClosed(e.key, { round: e.round, span: mapSpan(map, e.span) });
    else if (e.kind === 'merged') m.noteMerged(e.key);
    else m.noteReportedColumn(e.col);
  }
}

/** Old columns [from, to) in new terms, appended to the machine's. */
export function copyColumns(m: Machine, old: readonly ColumnInfo[], from: number, to: number, map: NodeMap): void {
  for (let i = from; i < to; i++) {
    const c = old[i];
    const src = map.srcMap[c.src];
    if (src === undefined || src < 0) throw new ResumeMiss('a column names a line that is gone');
    m.columns.push({ yarn: c.yarn, src, round: c.round });
  }
}

function sameMarkers(a: readonly MarkerPos[], b: readonly MarkerPos[]): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i].name !== b[i].name || a[i].at !== b[i].at) return false;
  return true;
}

/**
 * Whether the new machine, about to work plan index `i`, is in the state the
 * old compile had there (under the map): then the rest of the old rounds
 * can be taken as they are. Cheap tests first; the machine's memory of
 * closings last.
 */
export function sameState(
  m: Machine, now: { prevOff: number; prevLen: number; prevMarkers: MarkerPos[]; prevStable: boolean; repeats: boolean[] },
  i: number, from: ResumeFrom,
): boolean {
  const t = from.trace;
  const cp = t.checkpoints[i];
  if (!cp || i >= t.records.length || m.aborted) return false;
  if (m.logical !== cp.logical || m.steps !== cp.steps || now.prevLen !== cp.prevLen || now.prevStable !== cp.prevStable) return false;
  if (m.columns.length !== cp.columns) return false;
  if (now.prevStable) {
    if (now.repeats[i] !== t.repeats[i]) return false;
  }
  if (!sameMarkers(now.prevMarkers, cp.prevMarkers)) return false;
  const a = m.store, b = t.store;
  for (let k = 0; k < cp.prevLen; k++) {
    const x = now.prevOff + k, y = cp.prevOff + k;
    if (a.flags[x] !== b.flags[y] || a.yarn[x] !== b.yarn[y] || a.col[x] !== b.col[y]) return false;
  }
  for (let c = 0; c < cp.columns; c++) {
    const n = m.columns[c], o = t.columns[c];
    if (n.yarn !== o.yarn || n.round !== o.round || n.src !== from.map.srcMap[o.src]) return false;
  }
  // The old machine's memory at this checkpoint, rebuilt from its events.
  const closed = new Map<string, { round: number; span: Span }>();
  const merged = new Set<string>();
  const reported = new Set<number>();
  for (let k = 0; k < cp.events; k++) {
    const e = t.events[k];
    if (e.kind === 'closed') closed.set(e.key, { round: e.round, span: e.span });
    else if (e.kind === 'merged') merged.add(e.key);
    else reported.add(e.col);
  }
  if (closed.size !== m.closed.size || merged.size !== m.merged.size || reported.size !== m.reportedColumns.size) return false;
  for (const k of merged) if (!m.merged.has(k)) return false;
  for (const k of reported) if (!m.reportedColumns.has(k)) return false;
  for (const [k, v] of closed) {
    const n = m.closed.get(k);
    if (!n || n.round !== v.round || n.span !== from.map.node(v.span)) return false;
  }
  return true;
}

/** Where workRounds keeps what it builds (resume.ts fills them in). */
export interface RoundsSink { records: RoundRecord[]; checkpoints: Checkpoint[]; repeats: boolean[] }
/** The fold's state before a round, as workRounds keeps it. */
export interface FoldState { prevOff: number; prevLen: number; prevMarkers: MarkerPos[]; prevStable: boolean }

/** What workRounds asks of a trace (created by createResumer; workRounds itself does not import this module's code). */
export interface RoundsResumer {
  /**
   * The trace's plan with the replaced lines' rounds given to their new
   * lines, or null when planning must be done again (lines changed
   * otherwise, or planning reported anything: a plan carried over reports
   * nothing). Takes the trace's ranges over.
   */
  plan(): { rounds: PlannedRound[]; ranges: Map<RoundLine, LineRange> } | null;
  /** The plan indexes that differ from the trace's plan; `first` is 0 when nothing can be taken before them. */
  changed(plan: PlannedRound[]): { first: number; last: number };
  /**
   * Takes rounds [0, start) from the trace into the machine and the sink
   * (into the trace's spare arrays, when it has some); returns the fold's
   * state before `start`.
   */
  restore(m: Machine, start: number, into: RoundsSink): FoldState;
  /** The store the next compile may work into: the trace's own, which no result reads once this compile is done. */
  spare(): StitchStore;
  /**
   * When the machine before plan index `pi` is in the state the trace had
   * there, takes the rest of the trace's rounds and returns how many; else 0.
   */
  splice(m: Machine, pi: number, now: FoldState, into: RoundsSink & { events: number; reports: number; planLength: number }): number;
}

/** A resumer over a trace, or undefined when the trace cannot be resumed (its size hit a bound). */
export function createResumer(from: ResumeFrom): RoundsResumer | undefined {
  const t = from.trace, map = from.map;
  if (t.aborted || t.checkpoints.length === 0) return undefined;
  // Store offsets below this hold stitches identical in both compiles (the cast-on, or the restored rounds).
  let prefixLen = t.checkpoints[0].storeLen;
  // A plan carried over, and the plan indexes where it differs from the trace's.
  let carried: { plan: PlannedRound[]; first: number; last: number } | null = null;
  return {
    plan() {
      const replaced = from.replaced;
      if (!replaced || t.planReports !== 0) return null;
      const ranges = t.ranges;
      for (const o of replaced.keys()) if (!ranges.has(o)) return null;
      const plan = t.plan.slice();
      // Entries are shared (plan.ts): one new entry per old entry keeps the sharing.
      const made = new Map<PlannedRound, PlannedRound>();
      let first = plan.length, last = -1;
      for (const [o, n] of replaced) {
        const r = ranges.get(o)!;
        const name = o.segment?.name;
        for (let k = r.first; k <= r.last && k <= plan.length; k += r.step) {
          const e = plan[k - 1];
          // The rounds the old line gave (a later line may give some of its range).
          if (name === undefined ? e.whole !== o : e.segments.get(name) !== o) continue;
          let ne = made.get(e);
          if (!ne) {
            ne = name === undefined ? { whole: n, segments: e.segments, ladders: e.ladders } : { whole: e.whole, segments: new Map(e.segments).set(name, n), ladders: e.ladders };
            made.set(e, ne);
          }
          plan[k - 1] = ne;
          if (k - 1 < first) first = k - 1;
          if (k - 1 > last) last = k - 1;
        }
        ranges.delete(o);
        ranges.set(n, r);
      }
      carried = { plan, first, last };
      return { rounds: plan, ranges };
    },
    changed(plan) {
      const c = carried && carried.plan === plan ? carried : changedRounds(t.plan, plan, map, from.firstLineSame);
      return { first: c.first > 0 && c.first < t.checkpoints.length ? c.first : 0, last: c.last };
    },
    restore(m, start, into) {
      const cp = t.checkpoints[start];
      if (t.spare && t.spare !== t.store) adopt(m.store, t.spare);
      copyStitches(m.store, t.store, 0, cp.storeLen, map.srcMap);
      copyColumns(m, t.columns, 0, cp.columns, map);
      replayEvents(m, t.events, 0, cp.events, map);
      replayReports(m, t.reports, 0, cp.reports, map);
      for (let i = 0; i < start; i++) {
        into.records.push(mapRecord(t.records[i], map, null));
        into.checkpoints.push(t.checkpoints[i]);
        into.repeats.push(t.repeats[i]);
      }
      m.logical = cp.logical; m.steps = cp.steps; m.ops = cp.ops;
      prefixLen = cp.storeLen;
      return { prevOff: cp.prevOff, prevLen: cp.prevLen, prevMarkers: cp.prevMarkers, prevStable: cp.prevStable };
    },
    spare() {
      return t.store;
    },
    splice(m, pi, now, into) {
      if (!sameState(m, { ...now, repeats: into.repeats }, pi, from)) return 0;
      const cp = t.checkpoints[pi];
      const cpStoreLen = cp.storeLen, cpPrevOff = cp.prevOff;
      // The rounds taken over carry out what they did before; with this compile's count
      // before them they must still end within the bound, or working them would stop on the way.
      const last = t.checkpoints[t.checkpoints.length - 1];
      const lastLogical = last.logical, lastSteps = last.steps, lastOps = last.ops;
      const dOps = m.ops - cp.ops;
      if (lastOps + dOps > LIMITS.operations) return 0;
      const d = m.store.length - cpStoreLen, dEvents = into.events - cp.events, dReports = into.reports - cp.reports;
      const offset = (o: number): number => {
        if (o >= cpStoreLen) return o + d;
        if (o === cpPrevOff) return now.prevOff;
        if (o < prefixLen) return o;
        throw new ResumeMiss('a round shares stitches that were worked again');
      };
      copyStitches(m.store, t.store, cpStoreLen, t.store.length, map.srcMap);
      copyColumns(m, t.columns, cp.columns, t.columns.length, map);
      replayEvents(m, t.events, cp.events, t.events.length, map);
      replayReports(m, t.reports, cp.reports, t.reports.length, map);
      for (let i = pi; i < t.records.length; i++) into.records.push(mapRecord(t.records[i], map, offset));
      // The trace's checkpoints from here on, moved into this compile's terms in place:
      // the trace they belong to is left behind once this compile is done.
      for (let i = pi; i < t.checkpoints.length; i++) {
        const c = t.checkpoints[i];
        c.prevOff = offset(c.prevOff);
        c.storeLen += d; c.events += dEvents; c.reports += dReports; c.ops += dOps;
        into.checkpoints[i] = c;
        if (i > pi && i < into.planLength) into.repeats[i] = t.repeats[i];
      }
      m.logical = lastLogical; m.steps = lastSteps; m.ops = lastOps + dOps;
      return t.records.length - pi;
    },
  };
}
