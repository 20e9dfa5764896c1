/**
 * Aligning two sequences of rounds by content. Each round has two keys: an
 * exact key (equal only for identical rounds) and a shape key (equal for
 * rounds worked the same way, whatever their stitch counts). The alignment
 * pairs rounds of equal shape so as to pair as many rounds as possible and,
 * among those alignments, as many identical rounds as possible (a weighted
 * longest common subsequence); rounds left between two pairs are then
 * paired by position. Ties are broken by the keys' content, so swapping the
 * two sequences swaps every step (mirror invariant). See README.md.
 */

/** One step of an alignment: a pair (both set), an old-only item or a new-only item (-1 on the missing side). */
export interface Step { o: number; n: number }

/** The keys of one sequence of rounds. */
export interface RoundKeys { exact: readonly string[]; shape: readonly string[] }

/** Above this many DP cells (4M cells, 16 MB) the middle is paired by position only. */
export const MAX_LCS_CELLS = 4_000_000;

const cmp = (x: string, y: string) => (x < y ? -1 : x > y ? 1 : 0);

/** Interns keys as small integers (one table for both sides, so equal keys get equal ids). */
function intern(table: Map<string, number>, keys: readonly string[], from: number, to: number): Int32Array {
  const out = new Int32Array(to - from);
  for (let k = from; k < to; k++) {
    let id = table.get(keys[k]);
    if (id === undefined) { id = table.size; table.set(keys[k], id); }
    out[k - from] = id;
  }
  return out;
}

/** Weighted LCS of a[i, ie) and b[j, je) (both non-empty); steps in order. */
function weighted(a: RoundKeys, b: RoundKeys, i: number, ie: number, j: number, je: number): Step[] {
  const n = ie - i, m = je - j, w = m + 1;
  // Ids only test equality; ties below compare the keys themselves, so id order never matters.
  const shapes = new Map<string, number>(), exacts = new Map<string, number>();
  const sa = intern(shapes, a.shape, i, ie), sb = intern(shapes, b.shape, j, je);
  const ea = intern(exacts, a.exact, i, ie), eb = intern(exacts, b.exact, j, je);
  // A pair of equal shape scores `pair`; an identical pair one more. `pair` exceeds
  // the most identical bonuses possible, so more pairs always win over more identical ones.
  const pair = Math.min(n, m) + 1;
  const score = (x: number, y: number) => (sa[x] !== sb[y] ? -1 : pair + (ea[x] === eb[y] ? 1 : 0));
  const dp = new Int32Array((n + 1) * w); // dp[x*w+y]: best score of a[i+x, ie) with b[j+y, je)
  for (let x = n - 1; x >= 0; x--) {
    for (let y = m - 1; y >= 0; y--) {
      const s = score(x, y);
      const skip = Math.max(dp[(x + 1) * w + y], dp[x * w + y + 1]);
      dp[x * w + y] = s >= 0 ? Math.max(skip, s + dp[(x + 1) * w + y + 1]) : skip;
    }
  }
  const steps: Step[] = [];
  let x = 0, y = 0;
  while (x < n && y < m) {
    const s = score(x, y);
    const here = dp[x * w + y];
    if (s >= 0 && s + dp[(x + 1) * w + y + 1] === here) { steps.push({ o: i + x, n: j + y }); x++; y++; continue; }
    const down = dp[(x + 1) * w + y], right = dp[x * w + y + 1];
    // Skip the side that keeps the best score; on a tie, the item with the smaller key (symmetric in a and b).
    const tie = cmp(a.exact[i + x], b.exact[j + y]) || cmp(a.shape[i + x], b.shape[j + y]);
    if (down > right || (down === right && tie < 0)) { steps.push({ o: i + x, n: -1 }); x++; }
    else { steps.push({ o: -1, n: j + y }); y++; }
  }
  while (x < n) steps.push({ o: i + x++, n: -1 });
  while (y < m) steps.push({ o: -1, n: j + y++ });
  return steps;
}

/**
 * Aligns two sequences of rounds. Identical leading and trailing rounds are
 * paired first (cheap, and most edits touch few rounds); the middle by the
 * weighted LCS (or, past {@link MAX_LCS_CELLS}, not at all); then the
 * unpaired rounds between two pairs are paired by position from the start of
 * the gap, the longer side's extra rounds staying unpaired at its end.
 */
export function alignRounds(a: RoundKeys, b: RoundKeys): Step[] {
  const na = a.exact.length, nb = b.exact.length;
  const head: Step[] = [];
  let i = 0, j = 0;
  while (i < na && j < nb && a.exact[i] === b.exact[j]) head.push({ o: i++, n: j++ });
  let ie = na, je = nb;
  const tail: Step[] = [];
  while (ie > i && je > j && a.exact[ie - 1] === b.exact[je - 1]) tail.push({ o: --ie, n: --je });
  let middle: Step[];
  if (ie > i && je > j && (ie - i + 1) * (je - j + 1) <= MAX_LCS_CELLS) middle = weighted(a, b, i, ie, j, je);
  else {
    middle = [];
    for (let x = i; x < ie; x++) middle.push({ o: x, n: -1 });
    for (let y = j; y < je; y++) middle.push({ o: -1, n: y });
  }
  return fillGaps([...head, ...middle, ...tail.reverse()]);
}

/** Pairs the unpaired items between two pairs by position (see {@link alignRounds}). */
export function fillGaps(steps: readonly Step[]): Step[] {
  const out: Step[] = [];
  let k = 0;
  while (k < steps.length) {
    if (steps[k].o >= 0 && steps[k].n >= 0) { out.push(steps[k++]); continue; }
    const olds: number[] = [], news: number[] = [];
    while (k < steps.length && !(steps[k].o >= 0 && steps[k].n >= 0)) {
      if (steps[k].o >= 0) olds.push(steps[k].o); else news.push(steps[k].n);
      k++;
    }
    const both = Math.min(olds.length, news.length);
    for (let x = 0; x < both; x++) out.push({ o: olds[x], n: news[x] });
    for (let x = both; x < olds.length; x++) out.push({ o: olds[x], n: -1 });
    for (let x = both; x < news.length; x++) out.push({ o: -1, n: news[x] });
  }
  return out;
}
