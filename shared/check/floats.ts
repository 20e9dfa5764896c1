/**
 * Floats: for each yarn used in a round, the runs of front stitches over
 * which that yarn is neither worked nor caught. A yarn is caught by a front
 * stitch in it, a backing stitch in it (the ladder-back point: backing
 * stitches carry the travelling yarn up the back), or an explicit `catch`.
 * Lengths are in front stitches (backing stitches take no width). In the
 * round the last run of a yarn joins its first (the round is a circle);
 * flat, the yarn also travels from the edge to its first use and from its
 * last use to the other edge.
 */
import { FLAG, type StitchStore } from './store';

/** The longest float of one yarn in a round. */
export interface FloatRun {
  yarn: number;
  /** Length in front stitches. */
  stitches: number;
  /** Store index of the stitch where the float starts (after the last catch), and where it ends. */
  fromStitch: number;
  toStitch: number;
}

/**
 * Measures the floats of the round stored at [off, off + len). `catchYarn`
 * and `catchAt` list explicit catches (yarn, front stitches worked before
 * the catch). Returns the longest float per yarn that floats at all.
 */
export function measureFloats(
  store: StitchStore, off: number, len: number, yarnCount: number,
  catchYarn: readonly number[], catchAt: readonly number[], cyclic: boolean,
): FloatRun[] {
  const last = new Int32Array(yarnCount).fill(-1); // front count at the last catch
  const lastStitch = new Int32Array(yarnCount).fill(off);
  const firstGap = new Int32Array(yarnCount).fill(-1);
  const best = new Int32Array(yarnCount);
  const bestFrom = new Int32Array(yarnCount);
  const bestTo = new Int32Array(yarnCount);
  const { flags, yarn } = store;
  let front = 0;
  let c = 0;
  const end = off + len;
  for (let i = off; i <= end; i++) {
    // Explicit catches recorded before front stitch `front` come first.
    while (c < catchAt.length && (i === end || catchAt[c] <= front)) {
      const y = catchYarn[c++];
      const at = i === end ? front : catchAt[c - 1];
      if (last[y] < 0) firstGap[y] = at;
      else if (at - last[y] > best[y]) { best[y] = at - last[y]; bestFrom[y] = lastStitch[y]; bestTo[y] = i < end ? i : end - 1; }
      last[y] = at; lastStitch[y] = i < end ? i : end - 1;
    }
    if (i === end) break;
    const y = yarn[i];
    // A front stitch in y or a backing stitch in y both catch y at this point.
    const gap = front - last[y];
    if (last[y] < 0) firstGap[y] = front;
    else if (gap > best[y]) { best[y] = gap; bestFrom[y] = lastStitch[y]; bestTo[y] = i; }
    if ((flags[i] & FLAG.BACKING) === 0) front++;
    last[y] = front; lastStitch[y] = i;
  }
  const runs: FloatRun[] = [];
  for (let y = 0; y < yarnCount; y++) {
    if (last[y] < 0) continue; // yarn not used in this round
    const tail = front - last[y];
    if (cyclic) {
      const wrap = tail + firstGap[y];
      if (wrap > best[y]) { best[y] = wrap; bestFrom[y] = lastStitch[y]; bestTo[y] = lastStitch[y]; }
    } else {
      if (firstGap[y] > best[y]) { best[y] = firstGap[y]; bestFrom[y] = off; bestTo[y] = off; }
      if (tail > best[y]) { best[y] = tail; bestFrom[y] = lastStitch[y]; bestTo[y] = off + len - 1; }
    }
    if (best[y] > 0) runs.push({ yarn: y, stitches: best[y], fromStitch: bestFrom[y], toStitch: bestTo[y] });
  }
  return runs;
}
