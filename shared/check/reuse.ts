/**
 * Expanding repeated rounds cleverly: when a round is worked by exactly the
 * same instructions as the round before it, and that round left the needle
 * as it found it (same stitches, backing columns and markers, no problem
 * reported), the new round is the same as the previous one. Its record then
 * shares the previous round's stitches in the store instead of working them
 * again. Only in the round (flat rows turn the work, so the next identical
 * row is two rows back).
 */
import type { Op, RoundLine } from '../notation';
import type { PreparedChart } from './charts';
import type { MarkerPos, Machine } from './machine';
import type { PlannedRound } from './plan';
import { FLAG } from './store';

function chartFree(ops: readonly Op[], charts: Map<string, PreparedChart>): boolean {
  for (const op of ops) {
    if (op.type === 'group' && !chartFree(op.ops, charts)) return false;
    // A chart without a fixed row changes row with the round number.
    if (op.type === 'chart' && !op.row && (charts.get(op.chart.name)?.rows.length ?? 1) > 1) return false;
  }
  return true;
}

// Whether a line is chart-free depends on the charts too (a chart's row count), and lines
// outlive a check (the incremental compiler reuses them): one cache per charts map.
const caches = new WeakMap<Map<string, PreparedChart>, WeakMap<RoundLine, boolean>>();

/** A key naming what works a round, or null when the round may differ from an identical-looking one. */
export function roundKey(p: PlannedRound, charts: Map<string, PreparedChart>): string | null {
  if (p.ladders.some((l) => l.phase !== 'work')) return null;
  // A round no line gives (LW209) passes the needle through unworked: rounds of a gap share too.
  // (Asked once per round, up to 100,000 per size: no lists made for the plain cases.)
  if (!p.whole && p.segments.size === 0) return p.ladders.length ? `-/${p.ladders.map((l) => l.ladder.span.from).join(',')}` : '-/';
  const lines = p.whole ? [p.whole] : [...p.segments.values()];
  let cache = caches.get(charts);
  if (!cache) { cache = new WeakMap(); caches.set(charts, cache); }
  for (const l of lines) {
    let free = cache.get(l);
    if (free === undefined) { free = chartFree(l.ops, charts); cache.set(l, free); }
    if (!free) return null;
  }
  const body = p.whole ? `w${p.whole.index}` : [...p.segments].map(([n, l]) => `${n}=${l.index}`).join('|');
  return `${body}/${p.ladders.map((l) => l.ladder.span.from).join(',')}`;
}

/**
 * True when the round just worked left the needle as it found it: same
 * count, same front/backing layout, backing columns and yarns, same markers.
 */
export function leftNeedleAsFound(m: Machine, markersBefore: readonly MarkerPos[], offset: number, count: number): boolean {
  if (count !== m.inLen) return false;
  const { flags, col, yarn } = m.store;
  for (let i = 0; i < count; i++) {
    const f = m.inFlags[i];
    if (flags[offset + i] !== f || col[offset + i] !== m.inCol[i]) return false;
    if ((f & FLAG.BACKING) && yarn[offset + i] !== m.inYarn[i]) return false;
  }
  if (m.markersOut.length !== markersBefore.length) return false;
  return markersBefore.every((x, i) => x.name === m.markersOut[i].name && x.at === m.markersOut[i].at);
}
