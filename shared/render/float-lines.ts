/**
 * Every float of every round, for the back-of-work view and the float
 * report. The checker keeps only the longest float per yarn and round
 * (RoundRecord.floats); the back view draws them all, so they are derived
 * here from the stitches, by the same rule as shared/check/floats.ts: a yarn
 * used in a round is caught by a front stitch in it or a backing stitch in
 * it; its float is the run of front stitches between two catches. In the
 * round the last run joins the first (the round is a circle); flat, the yarn
 * also travels from the edge to its first use and from its last use to the
 * other edge.
 *
 * Known limit: explicit `catch` operations are not stored in the model, so a
 * float broken only by a `catch` is shown whole here (the checker, which
 * sees the catch, reports it shorter).
 */
import type { StitchLevel } from '../check';
import { FLAG } from '../check';

/** A stretch of floated front stitches: store indexes of the first and last stitch floated, in working order. */
export interface FloatPiece { from: number; to: number }

/** One float: a yarn passing behind `stitches` front stitches. */
export interface FloatLine {
  yarn: number;
  /** Length in front stitches (backing stitches take no width). */
  stitches: number;
  /** One piece, or two when an in-the-round float crosses the start of the round. */
  pieces: FloatPiece[];
}

/** The floats of one round (its stitches are [offset, offset + count) of the store). */
export function roundFloats(level: StitchLevel, offset: number, count: number, cyclic: boolean): FloatLine[] {
  const { store } = level;
  const yarnCount = level.yarns.length;
  const used = new Uint8Array(yarnCount);
  for (let i = offset; i < offset + count; i++) used[store.yarn[i]] = 1;
  const out: FloatLine[] = [];
  for (let y = 0; y < yarnCount; y++) {
    if (!used[y]) continue;
    const runs: { from: number; to: number; n: number; caughtBefore: boolean }[] = [];
    let cur: { from: number; to: number; n: number; caughtBefore: boolean } | null = null;
    let seenCatch = false;
    for (let i = offset; i < offset + count; i++) {
      const isBacking = (store.flags[i] & FLAG.BACKING) !== 0;
      if (store.yarn[i] === y) {
        if (cur) { runs.push(cur); cur = null; }
        seenCatch = true;
      } else if (!isBacking) {
        if (cur) { cur.to = i; cur.n++; } else cur = { from: i, to: i, n: 1, caughtBefore: seenCatch };
      }
    }
    const trailing = cur !== null; // a run with no catch after it, up to the end of the round
    if (cur) runs.push(cur);
    if (!runs.length) continue;
    const first = runs[0];
    // A run at the start of the round with no catch before it and a run at
    // the end join across the start of the round when worked in the round.
    const joins = cyclic && trailing && runs.length > 1 && !first.caughtBefore;
    for (let r = 0; r < runs.length; r++) {
      const run = runs[r];
      if (joins && r === 0) continue;
      if (joins && r === runs.length - 1) {
        out.push({ yarn: y, stitches: run.n + first.n, pieces: [{ from: run.from, to: run.to }, { from: first.from, to: first.to }] });
      } else out.push({ yarn: y, stitches: run.n, pieces: [{ from: run.from, to: run.to }] });
    }
  }
  return out;
}

/** Longest float per yarn in a list (yarn index -> stitches). */
export function longestByYarn(floats: readonly FloatLine[]): Map<number, number> {
  const m = new Map<number, number>();
  for (const f of floats) if (f.stitches > (m.get(f.yarn) ?? 0)) m.set(f.yarn, f.stitches);
  return m;
}
