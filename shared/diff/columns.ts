/**
 * Backing columns: where each column of backing stitches sits, derived from
 * the stitch-level model (the first round a column id appears in, the front
 * stitches before it there in right-side order, the last round it is on
 * the needle), and how the columns of two revisions differ.
 */
import type { RoundPairing } from './size-diff';
import type { SizeView } from './round-view';
import type { ColumnChange, ColumnState } from './types';

const FLAG_BACKING = 1; // shared/check/store.ts FLAG.BACKING

/** A column with the alignment facts needed to compare it. */
interface Located { state: ColumnState; firstTok: string; lastTok: string; step: number }

/** Every backing column of a size, in the order they were set up. */
export function locateColumns(v: SizeView): ColumnState[] {
  const { store, rounds, yarns } = v.model.stitches;
  const found = new Map<number, ColumnState>();
  for (let r = 0; r < rounds.length; r++) {
    let front = 0;
    for (let k = 0; k < rounds[r].count; k++) {
      const i = v.at(r, k);
      if (!(store.flags[i] & FLAG_BACKING)) { front++; continue; }
      const id = store.col[i];
      if (id < 0) continue;
      const c = found.get(id);
      if (c) c.lastRound = rounds[r].number;
      else found.set(id, { yarn: yarns[store.yarn[i]] ?? '', after: front, firstRound: rounds[r].number, lastRound: rounds[r].number });
    }
  }
  return [...found.values()];
}

function locate(v: SizeView, tokens: Map<number, string>, stepOf: Map<number, number>): Located[] {
  return locateColumns(v).map((state) => ({
    state,
    firstTok: tokens.get(state.firstRound) ?? `?${state.firstRound}`,
    lastTok: tokens.get(state.lastRound) ?? `?${state.lastRound}`,
    step: stepOf.get(state.firstRound) ?? 0,
  }));
}

/**
 * Pairs the columns of two revisions in stages: identical (same yarn, place
 * and rounds: no change), then `moved` (same yarn and rounds, another place;
 * the leftovers of each group are paired in order of place), then `changed`
 * (same yarn and place, other rounds), the rest `added` / `removed`. Rounds
 * are compared through the round pairing, so an inserted round does not
 * make every later column look different. The stages and the sort are
 * symmetric in the two revisions.
 */
export function diffColumns(a: SizeView, b: SizeView, pairing: RoundPairing): ColumnChange[] {
  const stepOfOld = new Map<number, number>(), stepOfNew = new Map<number, number>();
  pairing.steps.forEach((s, k) => {
    if (s.o >= 0) stepOfOld.set(a.model.rounds[s.o].number, k);
    if (s.n >= 0) stepOfNew.set(b.model.rounds[s.n].number, k);
  });
  let olds = locate(a, pairing.oldToken, stepOfOld);
  let news = locate(b, pairing.newToken, stepOfNew);
  const out: { change: ColumnChange; sort: number[]; yarn: string }[] = [];
  const emit = (kind: ColumnChange['kind'], o: Located | null, n: Located | null) => {
    const afters = [o?.state.after, n?.state.after].filter((x): x is number => x !== undefined);
    const steps = [o?.step, n?.step].filter((x): x is number => x !== undefined);
    out.push({ change: { kind, old: o?.state ?? null, new: n?.state ?? null }, sort: [Math.min(...steps), Math.min(...afters), Math.max(...afters)], yarn: (o ?? n)!.state.yarn });
  };
  const stage = (key: (c: Located) => string, kind: ColumnChange['kind'] | null) => {
    const groups = new Map<string, { o: Located[]; n: Located[] }>();
    for (const c of olds) { const k = key(c); if (!groups.has(k)) groups.set(k, { o: [], n: [] }); groups.get(k)!.o.push(c); }
    for (const c of news) { const k = key(c); if (!groups.has(k)) groups.set(k, { o: [], n: [] }); groups.get(k)!.n.push(c); }
    const usedO = new Set<Located>(), usedN = new Set<Located>();
    for (const g of groups.values()) {
      g.o.sort((x, y) => x.state.after - y.state.after || x.step - y.step);
      g.n.sort((x, y) => x.state.after - y.state.after || x.step - y.step);
      const both = Math.min(g.o.length, g.n.length);
      for (let k = 0; k < both; k++) {
        usedO.add(g.o[k]); usedN.add(g.n[k]);
        if (kind) emit(kind, g.o[k], g.n[k]);
      }
    }
    olds = olds.filter((c) => !usedO.has(c));
    news = news.filter((c) => !usedN.has(c));
  };
  stage((c) => `${c.state.yarn}|${c.state.after}|${c.firstTok}|${c.lastTok}`, null);
  stage((c) => `${c.state.yarn}|${c.firstTok}|${c.lastTok}`, 'moved');
  stage((c) => `${c.state.yarn}|${c.state.after}`, 'changed');
  for (const c of olds) emit('removed', c, null);
  for (const c of news) emit('added', null, c);
  out.sort((x, y) => x.sort[0] - y.sort[0] || x.sort[1] - y.sort[1] || x.sort[2] - y.sort[2] || (x.yarn < y.yarn ? -1 : x.yarn > y.yarn ? 1 : 0));
  return out.map((x) => x.change);
}
