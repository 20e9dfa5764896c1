/**
 * The stitch machine, core: it works one round at a time from the stitches
 * on the needle (the previous round's output, turned for flat work) into the
 * size's StitchStore. This file holds the needle I/O (taking and putting
 * stitches, markers, segments, ladder columns); ops.ts interprets the
 * operations of a line on top of it; round.ts drives whole rounds.
 *
 * Hot paths touch only typed arrays and numbers: no object per stitch.
 */
import { OP } from '../notation';
import type { Span } from '../types';
import type { LadderLine } from '../notation';
import { LIMITS, TRACED, type SizeContext } from './context';
import { FLAG, StitchStore } from './store';
import type { SourceTable } from './sources';
import type { PreparedChart } from './charts';

/** A marker between stitches: it sits just before stitch `at` (at may equal the count). */
export interface MarkerPos { name: string; at: number }
/** A named stretch of the needle between markers: stitches [from, to) in working order. */
export interface SegmentRange { name: string; from: number; to: number }
/** A ladder line active on the current round. */
/**
 * A ladder line active on the current round. With `every` n the first column
 * comes after ceil(n/2) front stitches (half an interval, so the stretch
 * across the start of the round or the edges stays within n), then every n.
 */
export interface LadderRun { ladder: LadderLine; phase: 'setup' | 'work' | 'close'; every: number; columns: Set<number>; count: number; src: number; yarn: number }
/** A change to the machine's memory of closings, merges and reported columns (see Machine.trace). */
export type MachineEvent =
  | { kind: 'closed'; key: string; round: number; span: Span }
  | { kind: 'merged'; key: string }
  | { kind: 'reported'; col: number };
/** A backing column set up somewhere in the pattern. */
export interface ColumnInfo { yarn: number; src: number; round: number }

/** Name of the first segment of a round when no marker sits at its start. */
export const START_SEGMENT = 'start';

/**
 * The stitch machine of one size. Holds the size's store and, while a round
 * is worked, the needle it reads (`in*`, working order), the cursor
 * (`pos` within the scope [pos, end)), counters and markers. Not reentrant.
 */
export class Machine {
  readonly store = new StitchStore(4096);
  readonly columns: ColumnInfo[] = [];
  /** Where backing stitches were closed: key side:frontIndex -> round and place. */
  readonly closed = new Map<string, { round: number; span: Span }>();
  /** Stitches worked so far in this size (logical, for the bound). */
  logical = 0;
  steps = 0;
  /** Operations carried out so far in this size (for LIMITS.operations). */
  ops = 0;
  aborted = false;

  // ---- the round being worked ----
  inFlags: Uint8Array = new Uint8Array(0);
  inYarn: Uint8Array = new Uint8Array(0);
  inCol: Int32Array = new Int32Array(0);
  inLen = 0;
  hasManaged = false;
  hasBacking = false;
  private prefix: Int32Array | null = null;
  private frontPrefix: Int32Array | null = null;
  /** Where a hand-placed backing stitch was knitted into the fabric (LW401): key side:frontIndex. */
  readonly merged = new Set<string>();
  /** Columns already reported as unclosable (LW403), left out of LW404. */
  readonly reportedColumns = new Set<number>();
  pos = 0;
  end = 0;
  outStart = 0;
  front = 0;
  backing = 0;
  markersIn: MarkerPos[] = [];
  mi = 0;
  markersOut: MarkerPos[] = [];
  segs: SegmentRange[] = [];
  si = 0;
  nextEvent = 0;
  roundNo = 0;
  side: 'RS' | 'WS' = 'RS';
  word: 'round' | 'row' = 'round';
  /** Stitches the current scope's operations asked for (managed backing stitches excluded). */
  worked = 0;
  missing = 0;
  /** A count problem was already reported in this scope (suppresses LW301). */
  problem = false;
  /** Segment name for messages when working a segment line. */
  scopeName: string | null = null;
  ladders: LadderRun[] = [];
  ladder: LadderRun | null = null;
  pendingClose = -1;
  catchYarn: number[] = [];
  catchAt: number[] = [];
  /** Line context for chart rows and messages. */
  lineFirst = 1;
  lineSpan: Span | null = null;

  /**
   * When set, every change to `closed`, `merged` and `reportedColumns` is
   * appended here in order (the incremental compiler replays them; see
   * resume.ts). Changes go through the note* methods below.
   */
  trace: MachineEvent[] | null = null;

  noteClosed(key: string, at: { round: number; span: Span }): void {
    this.closed.set(key, at);
    if (TRACED) this.trace?.push({ kind: 'closed', key, round: at.round, span: at.span });
  }

  noteMerged(key: string): void {
    this.merged.add(key);
    if (TRACED) this.trace?.push({ kind: 'merged', key });
  }

  noteReportedColumn(col: number): void {
    this.reportedColumns.add(col);
    if (TRACED) this.trace?.push({ kind: 'reported', col });
  }

  constructor(
    readonly ctx: SizeContext,
    readonly sources: SourceTable,
    readonly charts: Map<string, PreparedChart>,
  ) {}

  /** Loads the needle for a round: `flags/yarn/col` in working order. */
  load(flags: Uint8Array, yarn: Uint8Array, col: Int32Array, markers: MarkerPos[], segs: SegmentRange[]): void {
    this.inFlags = flags; this.inYarn = yarn; this.inCol = col; this.inLen = flags.length;
    this.hasManaged = false;
    this.hasBacking = false;
    for (let i = 0; i < flags.length; i++) {
      if (flags[i] & FLAG.BACKING) { this.hasBacking = true; if (flags[i] & FLAG.MANAGED) { this.hasManaged = true; break; } }
    }
    this.prefix = null;
    this.frontPrefix = null;
    this.markersIn = markers; this.mi = 0; this.markersOut = [];
    this.segs = segs; this.si = 0;
    this.pos = 0; this.end = this.inLen;
    this.outStart = this.store.length; this.front = 0; this.backing = 0;
    this.catchYarn = []; this.catchAt = [];
    this.pendingClose = -1;
    this.computeNextEvent();
  }

  /** Stitches in [from, to) the operations must work (all but ladder-managed backing stitches): the LW301 count. */
  countable(from: number, to: number): number {
    if (to <= from) return 0;
    if (!this.hasManaged) return to - from;
    if (!this.prefix) this.buildPrefixes();
    return this.prefix![to] - this.prefix![from];
  }

  /** Front stitches in [from, to): what "to end", "to marker" and charts count. */
  fronts(from: number, to: number): number {
    if (to <= from) return 0;
    if (!this.hasBacking) return to - from;
    if (!this.frontPrefix) this.buildPrefixes();
    return this.frontPrefix![to] - this.frontPrefix![from];
  }

  private buildPrefixes(): void {
    const p = new Int32Array(this.inLen + 1);
    const q = new Int32Array(this.inLen + 1);
    for (let i = 0; i < this.inLen; i++) {
      const f = this.inFlags[i];
      p[i + 1] = p[i] + ((f & FLAG.MANAGED) ? 0 : 1);
      q[i + 1] = q[i] + ((f & FLAG.BACKING) ? 0 : 1);
    }
    this.prefix = p;
    this.frontPrefix = q;
  }

  /** The segment the cursor is in. */
  get segment(): string {
    return this.segs[this.si]?.name ?? START_SEGMENT;
  }

  private computeNextEvent(): void {
    // Markers and boundaries at the scope's end belong to the next scope (or the round's end).
    const mk = this.mi < this.markersIn.length ? this.markersIn[this.mi].at : Infinity;
    const m = mk < this.end ? mk : Infinity;
    const sb = this.si + 1 < this.segs.length ? this.segs[this.si].to : Infinity;
    const s = sb < this.end ? sb : Infinity;
    this.nextEvent = m < s ? m : s;
  }

  /**
   * Passes markers and segment boundaries at or before the cursor that lie
   * inside the scope (`final`: also those at its end, when the round ends).
   */
  passEvents(final = false): void {
    while (this.mi < this.markersIn.length && this.markersIn[this.mi].at <= this.pos && (final || this.markersIn[this.mi].at < this.end)) {
      const m = this.markersIn[this.mi++];
      this.markersOut.push({ name: m.name, at: this.store.length - this.outStart });
    }
    let moved = false;
    while (this.si + 1 < this.segs.length && this.segs[this.si].to <= this.pos && this.segs[this.si].to < this.end) { this.si++; moved = true; }
    if (moved) this.selectLadder();
    this.computeNextEvent();
  }

  /** Jumps the segment pointer (segment rounds work one segment at a time). */
  enterSegment(index: number): void {
    this.si = index;
    this.selectLadder();
    this.passEvents();
  }

  /** Picks the ladder for the current segment: one naming it, else a whole-round one. */
  selectLadder(): void {
    const name = this.segment;
    let pick: LadderRun | null = null;
    for (const l of this.ladders) {
      if (l.ladder.segment?.name === name) { pick = l; break; }
      if (!l.ladder.segment && !pick) pick = l;
    }
    this.ladder = pick;
  }

  /** Reserves output room; false (after LW901) when the size passes the stitch bound. */
  room(n: number, span: Span): boolean {
    if (this.aborted) return false;
    if (this.logical + (this.store.length - this.outStart) + n > LIMITS.stitchesPerSize) {
      this.abort(span, `more than ${LIMITS.stitchesPerSize.toLocaleString('en')} stitches would be worked`);
      return false;
    }
    this.store.reserve(n);
    return true;
  }

  /** Counts a repeat pass that worked no stitch; false (after LW901) past the bound. */
  step(span: Span): boolean {
    if (++this.steps > LIMITS.steps) { this.abort(span, `more than ${LIMITS.steps.toLocaleString('en')} repeat passes that work no stitch`); return false; }
    return !this.aborted;
  }

  /** Counts an operation carried out; false (after LW901) past the bound. */
  operate(span: Span): boolean {
    if (++this.ops > LIMITS.operations) { this.abort(span, `more than ${LIMITS.operations.toLocaleString('en')} operations would be carried out`); return false; }
    return true;
  }

  abort(span: Span, detail: string): void {
    if (!this.aborted) this.ctx.report('LW901', span, { detail, word: this.word });
    this.aborted = true;
  }

  /**
   * Takes the next stitch of the scope for a front operation and returns its
   * index, or -1 when the scope is used up. A ladder's backing stitches met on
   * the way are worked automatically; a hand-placed one is knitted into the
   * fabric like a front stitch, which is LW401.
   */
  takeFront(src: number, what: string): number {
    while (this.pos < this.end) {
      const i = this.pos;
      if (i >= this.nextEvent) this.passEvents();
      const f = this.inFlags[i];
      this.pos++;
      if ((f & FLAG.BACKING) === 0) return i;
      if (f & FLAG.MANAGED) { this.autoBacking(i); continue; }
      this.problem = true;
      this.noteMerged(`${this.side}:${this.front}`);
      const span = this.sources.spans[src];
      if (!this.ctx.repeat('LW401', span)) this.ctx.report('LW401', span, { word: this.word, round: this.roundNo, stitch: what, yarn: this.ctx.head.yarns[this.inYarn[i]] });
      return i;
    }
    return -1;
  }

  /** A ladder-managed backing stitch met while working: carried, or held to close with the next front stitch. */
  autoBacking(i: number): void {
    const l = this.ladder;
    if (l && l.phase === 'close' && this.pendingClose < 0) { this.pendingClose = i; return; }
    if (this.pendingClose >= 0) this.unclosed();
    this.putBacking(OP.carry, this.inYarn[i], l?.src ?? 0, this.inFlags[i], this.inCol[i]);
  }

  /** A held backing stitch found no front neighbour: it stays on the needle (LW403). */
  unclosed(): void {
    const i = this.pendingClose;
    this.pendingClose = -1;
    const span = this.lineSpan ?? this.sources.spans[0];
    this.noteReportedColumn(this.inCol[i]);
    this.ctx.report('LW403', span, { word: this.word, round: this.roundNo, detail: 'a ladder column has no front stitch after it to close with' }, `u${this.inCol[i]}`);
    this.putBacking(OP.carry, this.inYarn[i], this.ladder?.src ?? 0, this.inFlags[i], this.inCol[i]);
  }

  /** Puts a backing stitch on the right needle. */
  putBacking(op: number, yarn: number, src: number, flags: number, col: number): void {
    const s = this.store;
    if (s.length >= s.op.length) s.reserve(1);
    const k = s.length++;
    s.op[k] = op; s.yarn[k] = yarn; s.flags[k] = (flags & (FLAG.MANAGED | FLAG.UNWORKED)) | FLAG.BACKING; s.src[k] = src; s.col[k] = col;
    this.backing++;
  }

  /** Puts a front stitch on the right needle; closes a held ladder column and raises new ones. */
  putFront(op: number, yarn: number, src: number, flags: number): void {
    const s = this.store;
    if (this.pendingClose >= 0) {
      op = this.ladder?.ladder.close === 'ssk' ? OP.closeSsk : OP.closeK2tog;
      this.noteClosed(`${this.side}:${this.front}`, { round: this.roundNo, span: this.ladder?.ladder.span ?? this.sources.spans[src] });
      this.pendingClose = -1;
    }
    if (s.length >= s.op.length) s.reserve(1);
    const k = s.length++;
    s.op[k] = op; s.yarn[k] = yarn; s.flags[k] = flags; s.src[k] = src; s.col[k] = -1;
    this.front++;
    const l = this.ladder;
    if (l !== null && l.phase === 'setup') {
      l.count++;
      const half = Math.ceil(l.every / 2);
      const due = l.every > 0 ? l.count >= half && (l.count - half) % l.every === 0 : l.columns.has(l.count);
      if (due && this.pos < this.end && this.pos < (this.segs[this.si]?.to ?? this.end)) this.raise(l.yarn, l.src, FLAG.MANAGED);
    }
  }

  /** Sets up a new backing column (a lifted increase in `yarn`). */
  raise(yarn: number, src: number, flags: number): void {
    this.columns.push({ yarn, src, round: this.roundNo });
    this.putBacking(OP.raise, yarn, src, flags, this.columns.length - 1);
  }
}
