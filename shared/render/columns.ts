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
 * Known limit: a bind-off puts no stitch on the needle, so the model keeps
 * no trace of where it was; the stitches it took are attributed to the
 * following operations and the last columns of the round retire instead.
 */
import type { StitchLevel } from '../check';
import { FLAG } from '../check';

/** Column data of one size. */
export interface ColumnLayout {
  /** Number of columns (the chart's width in cells). */
  width: number;
  /** Per round (aligned with stitchLevel.rounds): position from the right of each stitch, in working order. */
  positions: Int32Array[];
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

/**
 * Lays out the columns of one size. `flat`: rows turn, so each row's input
 * is the previous output reversed and WS rows run left to right.
 * Cost: O(stitches × width) in the worst case (insertions); fine for charts
 * a person reads.
 */
export function layoutColumns(level: StitchLevel, castOn: number, flat: boolean): ColumnLayout {
  const { store, ops } = level;
  // In the round the cast-on is worked like a RS row (right to left); flat it
  // is the row "before" row 1, i.e. a WS-direction row (row 1 reverses it).
  // Column id i starts at position i. Flat, cast-on stitch j sits at
  // position castOn-1-j, so that row 1 (the cast-on reversed) starts at the right.
  const order = new ColumnOrder(castOn);
  let prevIds = Array.from({ length: castOn }, (_, j) => (flat ? castOn - 1 - j : j));
  let prevBacking: boolean[] = new Array<boolean>(castOn).fill(false);
  const ids: number[][] = [];
  for (const rec of level.rounds) {
    const ws = rec.side === 'WS';
    const inIds = flat ? [...prevIds].reverse() : prevIds;
    const inBack = flat ? [...prevBacking].reverse() : prevBacking;
    const out: number[] = [];
    let inp = 0;
    let k = rec.offset;
    const end = rec.offset + rec.count;
    // Working order runs right to left on RS (new columns go to the left of
    // the previous stitch) and left to right on WS.
    const leftwards = !ws;
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
          const anchor = out.length ? out[out.length - 1] : null;
          if (anchor !== null) id = order.insert(anchor, leftwards);
          else if (inp < inIds.length) id = order.insert(inIds[inp], !leftwards);
          else id = order.insert(null, leftwards);
        }
        out.push(id);
      }
      k += group;
    }
    ids.push(out);
    prevIds = out;
    const backs: boolean[] = [];
    for (let i = rec.offset; i < end; i++) backs.push((store.flags[i] & FLAG.BACKING) !== 0);
    prevBacking = backs;
  }
  const pos = order.positions();
  return { width: order.size, positions: ids.map((r) => Int32Array.from(r, (id) => pos[id])) };
}
