/**
 * The diff of one size: align the rounds (exact content, then shape, then
 * position), compare paired rounds aspect by aspect and cell by cell, and
 * diff the backing columns.
 */
import { alignRounds, type Step } from './align';
import { diffColumns } from './columns';
import type { Fronts, SizeView } from './round-view';
import type { CellChange, RenumberedRun, RoundAspect, RoundChange, SizeDiff } from './types';

/** Round pairing of one size, kept for the diagnostics diff and columns. */
export interface RoundPairing {
  steps: Step[];
  /** Round number -> token naming its pair ("m<old>:<new>") or itself ("o<n>" / "n<n>") when unpaired. */
  oldToken: Map<number, string>;
  newToken: Map<number, string>;
}

/** Aligns the rounds of two views (see README.md, "Aligning rounds"). */
export function pairRounds(a: SizeView, b: SizeView): RoundPairing {
  const steps = alignRounds(a.keys(), b.keys());
  const oldToken = new Map<number, string>(), newToken = new Map<number, string>();
  const ra = a.model.rounds, rb = b.model.rounds;
  for (const s of steps) {
    if (s.o >= 0 && s.n >= 0) {
      const t = `m${ra[s.o].number}:${rb[s.n].number}`;
      oldToken.set(ra[s.o].number, t); newToken.set(rb[s.n].number, t);
    } else if (s.o >= 0) oldToken.set(ra[s.o].number, `o${ra[s.o].number}`);
    else newToken.set(rb[s.n].number, `n${rb[s.n].number}`);
  }
  return { steps, oldToken, newToken };
}

const sameList = (x: readonly string[], y: readonly string[]) => x.length === y.length && x.every((v, i) => v === y[i]);

/** Compares a pair of rounds; pushes changed cells (up to `room`) and returns the aspects and the number of changed cells. */
function compareRounds(a: SizeView, r: number, b: SizeView, s: number, yarns: YarnTable, cells: CellChange[], room: number): { aspects: RoundAspect[]; cellsChanged: number } {
  const sa = a.model.rounds[r], sb = b.model.rounds[s];
  const ra = a.model.stitches.rounds[r], rb = b.model.stitches.rounds[s];
  const aspects: RoundAspect[] = [];
  if (sa.front !== sb.front || sa.backing !== sb.backing || sa.total !== sb.total) aspects.push('counts');
  const fa = a.fronts(r, yarns.ids), fb = b.fronts(s, yarns.ids);
  const na = fa.op.length, nb = fb.op.length;
  // Trim the common prefix and suffix, pair the middle by position, and count the longer side's extra cells.
  let p = 0;
  while (p < na && p < nb && fa.op[p] === fb.op[p] && fa.yarn[p] === fb.yarn[p]) p++;
  let q = 0;
  while (q < na - p && q < nb - p && fa.op[na - 1 - q] === fb.op[nb - 1 - q] && fa.yarn[na - 1 - q] === fb.yarn[nb - 1 - q]) q++;
  const ma = na - p - q, mb = nb - p - q;
  let changed = 0;
  const cell = (f: Fronts, k: number) => ({ stitch: k + 1, op: f.view.opName(f.op[k]), yarn: yarns.names[f.yarn[k]] ?? '' });
  for (let k = 0; k < Math.max(ma, mb); k++) {
    const x = p + k;
    if (k < ma && k < mb && fa.op[x] === fb.op[x] && fa.yarn[x] === fb.yarn[x]) continue;
    changed++;
    if (cells.length < room) {
      cells.push({ round: { old: sa.number, new: sb.number }, old: k < ma ? cell(fa, x) : null, new: k < mb ? cell(fb, x) : null });
    }
  }
  if (changed > 0) aspects.push('stitches');
  if (!sameList(a.backings(r), b.backings(s))) aspects.push('backing');
  if (!sameList(a.floats(r), b.floats(s))) aspects.push('floats');
  if (!sameList(a.markers(r), b.markers(s))) aspects.push('markers');
  if (sa.side !== sb.side) aspects.push('side');
  if (ra.note !== rb.note) aspects.push('note');
  return { aspects, cellsChanged: changed };
}

/** Yarn names of both revisions, sorted (so ids do not depend on which revision is old), and their ids. */
interface YarnTable { names: string[]; ids: Map<string, number> }

function yarnTable(a: SizeView, b: SizeView): YarnTable {
  const names = [...new Set([...a.model.stitches.yarns, ...b.model.stitches.yarns])].sort();
  return { names, ids: new Map(names.map((y, i) => [y, i])) };
}

/** Diffs one size present in both revisions. `maxCells` bounds the listed cells. */
export function diffSize(name: string, a: SizeView, b: SizeView, pairing: RoundPairing, maxCells: number): SizeDiff {
  const yarns = yarnTable(a, b);
  const rounds: RoundChange[] = [];
  const renumbered: RenumberedRun[] = [];
  const cells: CellChange[] = [];
  let cellsTotal = 0, unchanged = 0;
  const summary = { added: 0, removed: 0, changed: 0, countsChanged: 0 };
  let run: RenumberedRun | null = null;
  for (const st of pairing.steps) {
    if (st.o >= 0 && st.n >= 0) {
      const same = a.sameRound(st.o, b, st.n, yarns.ids);
      const { aspects, cellsChanged } = same ? { aspects: [], cellsChanged: 0 } : compareRounds(a, st.o, b, st.n, yarns, cells, maxCells);
      cellsTotal += cellsChanged;
      if (aspects.length > 0) {
        rounds.push({ kind: 'changed', old: a.state(st.o), new: b.state(st.n), aspects, cellsChanged });
        summary.changed++;
        if (aspects[0] === 'counts') summary.countsChanged++;
        run = null;
        continue;
      }
      unchanged++;
      const on = a.model.rounds[st.o].number, nn = b.model.rounds[st.n].number;
      if (on === nn) { run = null; continue; }
      if (run && run.old.last + 1 === on && run.new.last + 1 === nn) { run.old.last = on; run.new.last = nn; }
      else { run = { old: { first: on, last: on }, new: { first: nn, last: nn } }; renumbered.push(run); }
      continue;
    }
    run = null;
    if (st.o >= 0) { rounds.push({ kind: 'removed', old: a.state(st.o), new: null, aspects: [], cellsChanged: 0 }); summary.removed++; }
    else { rounds.push({ kind: 'added', old: null, new: b.state(st.n), aspects: [], cellsChanged: 0 }); summary.added++; }
  }
  return {
    size: name,
    // Symmetric in the two revisions: rows when either is worked flat.
    word: a.flat || b.flat ? 'row' : 'round',
    castOn: a.model.castOn !== b.model.castOn ? { old: a.model.castOn, new: b.model.castOn } : null,
    rounds, renumbered, unchanged, cells, cellsTotal,
    columns: diffColumns(a, b, pairing),
    summary,
  };
}
