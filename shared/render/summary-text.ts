/**
 * Plain-text form of the summary (for the command line and exports):
 * gauge and yarn weight, per size the finished size, the yarn estimate and
 * the float report (consecutive rounds with the same longest floats merged),
 * then the rounds' counts, the gaps and the cautions.
 */
import { formatGauge, formatLength } from '../measure';
import type { PatternSummary, SizeSummary } from './summary';

/** Formats a summary as text. `counts`: include the per-round counts table (default true). */
export function formatSummaryText(sum: PatternSummary, counts = true): string {
  const out: string[] = [];
  const word = sum.construction === 'flat' ? 'row' : 'round';
  out.push(`${sum.title ?? 'Untitled pattern'}: summary`);
  if (sum.gauge) out.push(`Gauge: ${formatGauge(sum.gauge)}.`);
  if (sum.yarnWeight) out.push(`Yarn weight (Craft Yarn Council): ${sum.yarnWeight.message}`);
  if (sum.floatLimitStitches !== null) out.push(`Float limit: ${sum.floatLimitStitches} sts at this gauge.`);
  for (const s of sum.sizes) {
    out.push('');
    out.push(`Size ${s.name}`);
    out.push(...sizeLines(s, word));
    if (counts) {
      out.push(`  Counts after each ${word} (front + backing = total):`);
      out.push(`    cast on: ${s.castOn}`);
      for (const r of mergeCounts(s)) out.push(`    ${r}`);
    }
  }
  if (sum.yarnAssumption) {
    out.push('');
    out.push(`Yarn estimate: an estimate, not a measurement. ${sum.yarnAssumption}`);
  }
  if (sum.gaps.length) {
    out.push('');
    for (const g of sum.gaps) out.push(`Not given: ${g}`);
  }
  out.push('');
  out.push('Cautions');
  for (const c of sum.cautions) out.push(`  - ${c}`);
  return `${out.join('\n')}\n`;
}

function sizeLines(s: SizeSummary, word: string): string[] {
  const out: string[] = [];
  if (s.finished) {
    out.push(`  Finished ${s.finished.widthKind}: ${formatLength(s.finished.width, { primary: 'cm' })} over ${s.mainFrontStitches} front sts.`);
    out.push(`  Finished length: ${formatLength(s.finished.length, { primary: 'cm' })} over ${s.roundsWorked} ${word}s.`);
  } else out.push(`  ${s.mainFrontStitches} front sts, ${s.roundsWorked} ${word}s (no gauge, so no lengths).`);
  if (s.yarn) {
    for (const a of s.yarn.amounts) {
      const grams = a.gramsWithAllowance !== undefined ? `, about ${Math.ceil(a.gramsWithAllowance)} g` : '';
      out.push(`  Yarn ${a.yarn} (estimate): about ${Math.ceil(a.metresWithAllowance)} m / ${Math.ceil(a.yardsWithAllowance)} yd with ${Math.round(s.yarn.allowance * 100)} % allowance${grams} (${a.stitches} sts, floats over ${a.floatStitches} sts).`);
    }
  }
  if (s.body) {
    for (const c of s.body.comparisons) out.push(`  Body: ${c.message}`);
    out.push(`  Suits: ${s.body.suits.length ? s.body.suits.join(', ') : 'none of the listed wearers'}.`);
  }
  const floats = mergeFloats(s);
  if (floats.length) {
    out.push(`  Longest float per yarn and ${word}:`);
    for (const f of floats) out.push(`    ${f}`);
  }
  return out;
}

/** "rounds 5-12: B 4 sts (1.45 cm, 0.57 in)", consecutive rounds with the same floats merged. */
function mergeFloats(s: SizeSummary): string[] {
  const byRound = new Map<number, string>();
  for (const f of s.floats) {
    const len = f.length ? ` (${formatLength(f.length, { unit: 'cm', cmDigits: 2 })}, ${formatLength(f.length, { unit: 'in', inDigits: 2 })})` : '';
    const part = `${f.yarn} ${f.stitches} st${f.stitches === 1 ? '' : 's'}${len}${f.isOverLimit ? ' OVER THE LIMIT' : ''}`;
    byRound.set(f.round, byRound.has(f.round) ? `${byRound.get(f.round)}; ${part}` : part);
  }
  return mergeRuns([...byRound].map(([n, t]) => ({ n, t })));
}

function mergeCounts(s: SizeSummary): string[] {
  return mergeRuns(s.rounds.map((r) => ({ n: r.number, t: r.backing > 0 ? `${r.front} + ${r.backing} = ${r.total}` : `${r.total}` })));
}

function mergeRuns(items: { n: number; t: string }[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < items.length; i++) {
    let j = i;
    while (j + 1 < items.length && items[j + 1].t === items[i].t && items[j + 1].n === items[j].n + 1) j++;
    out.push(`${j > i ? `${items[i].n}-${items[j].n}` : items[i].n}: ${items[i].t}`);
    i = j;
  }
  return out;
}
