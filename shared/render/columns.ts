/**
 * Column alignment for charts: gives every stitch of every round a chart
 * column so that a stitch sits above the stitch(es) it was worked from.
 * Where counts change, the columns that have no stitch in a round become
 * no-stitch cells, which keeps the grid square (common practice in
 * published charts).
 *
 * Input: one size's stitch-level model. The model stores, per round, the
 * stitches on the needle at its end, each with the operation that made it
 * (see shared/check/README.md). An operation that takes c stitches and puts
 * p (STITCHES table) is read back as a group of p consecutive output
 * stitches that consumed the next c input stitches, in working order.
 *
 * Positions are counted from the RIGHT edge of the chart (position 0 is the
 * rightmost column): every round in the round, and every RS row flat, is
 * worked right to left; WS rows left to right (chart-reading guides).
 *
 * Bind-offs put no stitch on the needle, so the model keeps no trace of
 * where they were: within each segment of a round, the stitches no output
 * took are taken as bound off at the end of the segment (exact for a
 * segment or round bound off whole, approximate for a bind-off in the
 * middle of a stretch followed by other stitches).
 */
import type { RoundRecord, StitchLevel } from '../check';
import { FLAG } from '../check';

/** Column data of one size. */
export interface ColumnLayout {
  /** Number of columns (the chart's width in cells). */
  width: number;
  /** Per round (aligned with stitchLevel.rounds): position from the right of each stitch, in working order. */
  positions: Int32Array[];
  /** Per round: the stitches it bound off (taken, nothing put back), with the column each was in. */
  boundOff: BoundOff[][];
}

/** Orders column ids from right to left; insertion keeps neighbours together. */
class ColumnOrder {
  private order: number[] = [];
  private next = 0;

  constructor(count: number) {
    for (let i = 0; i < count; i++) this.order.push(i);
    this.next = count;
  }

  /** A new column right beside `anchor`: further left when `leftOf`, else further right. */
  insert(anchor: number | null, leftOf: boolean): number {
    const id = this.next++;
    if (anchor === null) {
      if (leftOf) this.order.push(id); else this.order.unshift(id);
      return id;
    }
    const at = this.order.indexOf(anchor);
    this.order.splice(leftOf ? at + 1 : at, 0, id);
    return id;
  }

  /** Position from the right of every id. */
  positions(): Int32Array {
    const pos = new Int32Array(this.next);
    this.order.forEach((id, i) => { pos[id] = i; });
    return pos;
  }

  get size(): number { return this.order.length; }
}

/** A stitch the round took from the needle without putting anything back: bound off (position from the right, store index of the stitch taken). */
export interface BoundOff { position: number; stitch: number }

/**
 * Lays out the columns of one size. `flat`: rows turn, so each row's input
 * is the previous output reversed and WS rows run left to right.
 * Cost: O(stitches × width) in the worst case (insertions); fine for charts
 * a person reads.
 */
export function layoutColumns(level: StitchLevel, castOn: number, flat: boolean): ColumnLayout {
  const { store } = level;
  // Column id i starts at position i. Flat, cast-on stitch j sits at
  // position castOn-1-j, so that row 1 (the cast-on reversed) starts at the right.
  const order = new ColumnOrder(castOn);
  let prevIds = Array.from({ length: castOn }, (_, j) => (flat ? castOn - 1 - j : j));
  let prevStore = Array.from({ length: castOn }, (_, j) => j);
  const ids: number[][] = [];
  const bound: { id: number; stitch: number }[][] = [];
  for (const rec of level.rounds) {
    const inIds = flat ? [...prevIds].reverse() : prevIds;
    const inStore = flat ? [...prevStore].reverse() : prevStore;
    const inBack = inStore.map((i) => (store.flags[i] & FLAG.BACKING) !== 0);
    const out: number[] = [];
    const gone: { id: number; stitch: number }[] = [];
    for (const ch of chunks(rec)) {
      const left = walkChunk(level, order, rec.side === 'RS', inIds.slice(ch.inFrom, ch.inTo), inBack.slice(ch.inFrom, ch.inTo), rec.offset + ch.outFrom, rec.offset + ch.outTo, out);
      for (const k of left) gone.push({ id: inIds[ch.inFrom + k], stitch: inStore[ch.inFrom + k] });
    }
    ids.push(out);
    bound.push(gone);
    prevIds = out;
    prevStore = Array.from({ length: rec.count }, (_, j) => rec.offset + j);
  }
  const pos = order.positions();
  return {
    width: order.size,
    positions: ids.map((r) => Int32Array.from(r, (id) => pos[id])),
    boundOff: bound.map((r) => r.map((b) => ({ position: pos[b.id], stitch: b.stitch }))),
  };
}

/**
 * Splits a round into stretches worked separately, so that stitches a
 * stretch takes without putting back (bind-offs) stay in their stretch:
 * the round's segments (input ranges) matched to the markers of the same
 * name on the output. Falls back to the whole round when a marker is gone.
 */
function chunks(rec: RoundRecord): { inFrom: number; inTo: number; outFrom: number; outTo: number }[] {
  const whole = [{ inFrom: 0, inTo: rec.start, outFrom: 0, outTo: rec.count }];
  if (rec.segments.length < 2) return whole;
  const outStarts: number[] = [];
  let after = 0;
  for (let s = 0; s < rec.segments.length; s++) {
    const seg = rec.segments[s];
    if (s === 0 && seg.from === 0 && !rec.markers.some((m) => m.name === seg.name)) { outStarts.push(0); continue; }
    const m = rec.markers.find((x) => x.name === seg.name && x.at >= after);
    if (!m) return whole;
    outStarts.push(m.at);
    after = m.at;
  }
  if (outStarts[0] !== 0) return whole;
  return rec.segments.map((seg, s) => ({ inFrom: seg.from, inTo: seg.to, outFrom: outStarts[s], outTo: s + 1 < outStarts.length ? outStarts[s + 1] : rec.count }));
}

/**
 * Works one stretch: output stitches [k, end) of the store consumed the
 * inputs in order. Pushes the column id of each output to `out`; returns the
 * indexes (within the stretch) of inputs no output took.
 */
function walkChunk(level: StitchLevel, order: ColumnOrder, isRS: boolean, inIds: number[], inBack: boolean[], k: number, end: number, out: number[]): number[] {
  const { store, ops } = level;
  // Working order runs right to left on RS (new columns go to the left of
  // the stitch before) and left to right on WS.
  const leftwards = isRS;
  let inp = 0;
  const firstOut = out.length;
  while (k < end) {
    const info = ops[store.op[k]];
    let group = 1;
    if (info.produces > 1) {
      while (group < info.produces && k + group < end && store.op[k + group] === store.op[k] && store.src[k + group] === store.src[k]) group++;
    }
    const c = Math.min(info.consumes, inIds.length - inp);
    const taken = inIds.slice(inp, inp + c);
    const takenBack = inBack.slice(inp, inp + c);
    inp += c;
    let keep: number[];
    if (info.kind === 'close') {
      // The backing stitch ends here; the front stitch's column goes on.
      const frontAt = takenBack.findIndex((b) => !b);
      keep = frontAt >= 0 ? [taken[frontAt]] : taken.slice(-1);
    } else {
      keep = taken.length > group ? taken.slice(taken.length - group) : taken;
    }
    for (let g = 0; g < group; g++) {
      let id: number;
      if (g < keep.length) id = keep[g];
      else {
        const anchor = out.length > firstOut ? out[out.length - 1] : null;
        if (anchor !== null) id = order.insert(anchor, leftwards);
        else if (inp < inIds.length) id = order.insert(inIds[inp], !leftwards);
        else if (inIds.length) id = order.insert(inIds[inIds.length - 1], leftwards);
        else id = order.insert(null, leftwards);
      }
      out.push(id);
    }
    k += group;
  }
  const left: number[] = [];
  for (let j = inp; j < inIds.length; j++) left.push(j);
  return left;
}
