/**
 * Backing-stitch checks at the end of a size: every backing stitch set up
 * must be closed by the last round (LW404, reported at its set-up line with
 * how many are left). The per-round checks (worked on every round, closed
 * once, closed with a front neighbour) happen while working: see
 * machine.ts (LW401, LW403) and ops.ts (LW402, LW403, LW405).
 */
import type { Machine } from './machine';
import type { RoundRecord } from './round';
import { FLAG } from './store';

/** Reports backing stitches still on the needle after the last round. */
export function checkBackingClosed(m: Machine, last: RoundRecord | undefined): void {
  if (!last || m.aborted) return;
  const { store } = m;
  const bySetup = new Map<number, { count: number; yarn: number; round: number }>();
  for (let i = last.offset; i < last.offset + last.count; i++) {
    if (!(store.flags[i] & FLAG.BACKING)) continue;
    const col = m.columns[store.col[i]];
    if (!col || m.reportedColumns.has(store.col[i])) continue;
    const e = bySetup.get(col.src);
    if (e) e.count++; else bySetup.set(col.src, { count: 1, yarn: col.yarn, round: col.round });
  }
  for (const [src, e] of bySetup) {
    m.ctx.report('LW404', m.sources.spans[src], { count: e.count, yarn: m.ctx.head.yarns[e.yarn], word: m.word });
  }
}

/** Formats a list of round numbers as "round 5" or "rounds 5-9, 12". */
export function formatRounds(word: string, numbers: readonly number[]): string {
  const parts: string[] = [];
  for (let i = 0; i < numbers.length; i++) {
    let j = i;
    while (j + 1 < numbers.length && numbers[j + 1] === numbers[j] + 1) j++;
    parts.push(j > i ? `${numbers[i]}-${numbers[j]}` : String(numbers[i]));
    i = j;
  }
  const many = numbers.length > 1;
  const shown = parts.length > 8 ? [...parts.slice(0, 8), `and ${parts.length - 8} more`] : parts;
  return `${word}${many ? 's' : ''} ${shown.join(', ')}`;
}
