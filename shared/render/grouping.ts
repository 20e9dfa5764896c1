/**
 * Grouping rounds the way the trade writes them:
 * - consecutive rounds that read the same and keep the same count are one
 *   entry ("Rnds 5–12: k to end.");
 * - consecutive rounds that differ only by working the next chart row are
 *   one entry ("Rnds 11–16: work rows 1–6 of chart wave ...");
 * - a block of a few rounds repeated with the same words and no count
 *   change is written once, then "Rep rnds 11–12 5 more times."
 * Invariant: the entries cover the rounds in order, each once, and an
 * entry's counts are present exactly when its first round changes the
 * count; the rounds it covers all end with those counts.
 */
import type { Span } from '../types';

/** A round ready to group: its words, note and counts. */
export interface RoundWords { number: number; side: 'RS' | 'WS'; text: string; note: string | null; front: number; backing: number; span: Span }

/** A grouped entry, before labelling. */
export interface Group { first: number; last: number; side: 'RS' | 'WS' | null; text: string; note: string | null; counts: { front: number; backing: number; total: number } | null; span: Span }

const CHART_ROW = /row (\d+) of chart /g;

function template(text: string): string {
  return text.replace(CHART_ROW, 'row # of chart ');
}

function chartRows(text: string): number[] {
  return [...text.matchAll(CHART_ROW)].map((m) => Number(m[1]));
}

/** Groups rounds; `castOn` is the count before the first round. */
export function groupRounds(rounds: readonly RoundWords[], castOn: number, flat: boolean): Group[] {
  const groups: Group[] = [];
  let prev = { front: castOn, backing: 0 };
  for (let i = 0; i < rounds.length; i++) {
    const r = rounds[i];
    const changes = r.front !== prev.front || r.backing !== prev.backing;
    const same = (a: RoundWords, b: RoundWords) => a.note === b.note && a.front === b.front && a.backing === b.backing;
    let j = i;
    // Identical words.
    while (j + 1 < rounds.length && rounds[j + 1].text === r.text && same(rounds[j + 1], r)) j++;
    let text = r.text;
    if (j === i && chartRows(r.text).length) {
      // The next chart row each round.
      const t = template(r.text);
      while (j + 1 < rounds.length && same(rounds[j + 1], r) && template(rounds[j + 1].text) === t) {
        const a = chartRows(rounds[j].text), b = chartRows(rounds[j + 1].text);
        if (!a.every((v, k) => b[k] === v + 1)) break;
        j++;
      }
      if (j > i) {
        const last = chartRows(rounds[j].text);
        let k = 0;
        text = r.text.replace(CHART_ROW, (_m, n: string) => `rows ${n}–${last[k++]} of chart `);
      }
    }
    groups.push({
      first: r.number, last: rounds[j].number, side: flat && i === j ? r.side : null, text, note: r.note,
      counts: changes ? { front: r.front, backing: r.backing, total: r.front + r.backing } : null, span: r.span,
    });
    prev = { front: r.front, backing: r.backing };
    i = j;
  }
  return foldRepeats(groups, flat);
}

/**
 * Writes a repeated block once: when groups [i, i+p) are followed by the
 * same p groups again (same words, notes, no count change), the copies
 * become one "Rep rnds a–b N more times." entry. Blocks of 2 to 6 groups.
 */
function foldRepeats(groups: Group[], flat: boolean): Group[] {
  const out: Group[] = [];
  const word = flat ? 'rows' : 'rnds';
  const key = (g: Group) => `${g.last - g.first}|${g.side ?? ''}|${g.text}|${g.note ?? ''}`;
  for (let i = 0; i < groups.length;) {
    let folded = false;
    for (let p = 2; p <= 6 && !folded; p++) {
      if (i + 2 * p > groups.length) break;
      let copies = 0;
      while (i + (copies + 2) * p <= groups.length) {
        let ok = true;
        for (let k = 0; k < p && ok; k++) {
          const a = groups[i + k], b = groups[i + (copies + 1) * p + k];
          ok = key(a) === key(b) && b.counts === null;
        }
        if (!ok) break;
        copies++;
      }
      if (copies === 0) continue;
      const block = groups.slice(i, i + p);
      out.push(...block);
      const rest = groups.slice(i + p, i + (copies + 1) * p);
      const firstNo = block[0].first, lastNo = block[p - 1].last;
      out.push({
        first: rest[0].first, last: rest[rest.length - 1].last, side: null,
        text: `Rep ${word} ${firstNo}–${lastNo} ${copies === 1 ? 'once more' : `${copies} more times`}.`,
        note: null, counts: null, span: block[0].span,
      });
      i += (copies + 1) * p;
      folded = true;
    }
    if (!folded) out.push(groups[i++]);
  }
  return out;
}
