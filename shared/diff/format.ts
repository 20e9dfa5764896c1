/**
 * Plain-text rendering of a revision diff for the command line: the
 * header, each size's rounds, cells and columns, the diagnostics, then the
 * line diff as unified hunks. One formatter; the JSON form is the diff
 * itself.
 */
import type { PatternHeader } from '../index';
import type { CellState, ColumnState, DiagnosticRef, RevisionDiff, RoundState, SizeDiff } from './types';

/** Options of {@link formatDiffText}. */
export interface FormatOptions {
  /** Cells listed per size before "... and N more"; default 20. */
  cells?: number;
  /** Append the line diff; default true. */
  text?: boolean;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const gauge = (g: PatternHeader['gauge'], word: string) => (g ? `${g.stitches} sts and ${g.rows} ${word}s per ${g.per === '4in' ? '4 in' : '10 cm'}` : 'none');
const counts = (r: RoundState) => `${r.front} front + ${r.backing} backing = ${r.total}`;
const lines = (r: RoundState) => (r.endLine > r.line ? `lines ${r.line}-${r.endLine}` : `line ${r.line}`);
const cell = (c: CellState | null) => (c ? `${c.op} in ${c.yarn}` : 'no stitch');
const column = (c: ColumnState, word: string) => `${c.yarn} after stitch ${c.after}, ${word}s ${c.firstRound}-${c.lastRound}`;
const diag = (mark: string, d: DiagnosticRef) => `  ${mark} ${d.line}:${d.column} ${d.severity} ${d.code} ${d.message}`;

function headerLines(d: RevisionDiff, word: string): string[] {
  const h = d.header;
  const out: string[] = [];
  const q = (s: string | null) => (s === null ? 'none' : `"${s}"`);
  if (h.title) out.push(`  title: ${q(h.title.old)} -> ${q(h.title.new)}`);
  if (h.designer) out.push(`  designer: ${q(h.designer.old)} -> ${q(h.designer.new)}`);
  if (h.construction) out.push(`  construction: ${h.construction.old} -> ${h.construction.new}`);
  if (h.gauge) out.push(`  gauge: ${gauge(h.gauge.old, word)} -> ${gauge(h.gauge.new, word)}`);
  if (h.floatLimit) out.push(`  float limit: ${h.floatLimit.old.value} ${h.floatLimit.old.unit} -> ${h.floatLimit.new.value} ${h.floatLimit.new.unit}`);
  if (h.sizes.added.length) out.push(`  sizes added: ${h.sizes.added.join(' ')}`);
  if (h.sizes.removed.length) out.push(`  sizes removed: ${h.sizes.removed.join(' ')}`);
  if (h.sizes.order) out.push(`  sizes reordered: ${h.sizes.order.old.join(' ')} -> ${h.sizes.order.new.join(' ')}`);
  for (const y of h.yarns.added) out.push(`  yarn added: ${y.name} "${y.label}" ${y.colour}`);
  for (const y of h.yarns.removed) out.push(`  yarn removed: ${y.name} "${y.label}" ${y.colour}`);
  for (const y of h.yarns.recoloured) out.push(`  yarn ${y.name} recoloured: ${y.old} -> ${y.new}`);
  for (const y of h.yarns.relabelled) out.push(`  yarn ${y.name} relabelled: "${y.old}" -> "${y.new}"`);
  return out;
}

function sizeLines(s: SizeDiff, maxCells: number): string[] {
  const w = s.word;
  const out: string[] = [`size ${s.size}${s.castOn ? ` (cast on ${s.castOn.old} -> ${s.castOn.new})` : ''}: ${plural(s.summary.added, `${w} added`, `${w}s added`)}, ${s.summary.removed} removed, ${s.summary.changed} changed, ${s.unchanged} unchanged`];
  for (const r of s.rounds) {
    if (r.kind === 'added') out.push(`  + ${w} ${r.new!.number} added: ${counts(r.new!)} (${lines(r.new!)})`);
    else if (r.kind === 'removed') out.push(`  - ${w} ${r.old!.number} removed: was ${counts(r.old!)} (old ${lines(r.old!)})`);
    else {
      const o = r.old!, n = r.new!;
      const was = o.number !== n.number ? ` (was ${o.number})` : '';
      const cnt = r.aspects.includes('counts') ? `: ${counts(o)} -> ${counts(n)}` : '';
      const cells = r.cellsChanged ? `; ${plural(r.cellsChanged, 'cell')}` : '';
      out.push(`  ~ ${w} ${n.number}${was} changed [${r.aspects.join(', ')}]${cnt}${cells} (${lines(n)})`);
    }
  }
  for (const run of s.renumbered) {
    const span = (x: { first: number; last: number }) => (x.first === x.last ? `${x.first}` : `${x.first}-${x.last}`);
    out.push(`  = ${run.new.first === run.new.last ? w : `${w}s`} ${span(run.new)} unchanged, were ${span(run.old)}`);
  }
  if (s.cellsTotal) {
    out.push(`  cells changed: ${s.cellsTotal}`);
    for (const c of s.cells.slice(0, maxCells)) {
      const was = c.round.old !== c.round.new ? ` (was ${w} ${c.round.old})` : '';
      out.push(`    ${w} ${c.round.new}${was} stitch ${(c.new ?? c.old)!.stitch}: ${cell(c.old)} -> ${cell(c.new)}`);
    }
    if (s.cellsTotal > Math.min(maxCells, s.cells.length)) out.push(`    ... and ${s.cellsTotal - Math.min(maxCells, s.cells.length)} more`);
  }
  for (const c of s.columns) {
    if (c.kind === 'added') out.push(`  backing column added: ${column(c.new!, w)}`);
    else if (c.kind === 'removed') out.push(`  backing column removed: ${column(c.old!, w)}`);
    else out.push(`  backing column ${c.kind}: ${column(c.old!, w)} -> ${column(c.new!, w)}`);
  }
  return out;
}

/** Renders a diff as plain text (no colours, stable for golden files). */
export function formatDiffText(d: RevisionDiff, options: FormatOptions = {}): string {
  const word = d.sizes[0]?.word ?? 'round';
  const out: string[] = [];
  if (d.same) return 'no changes';
  const state = (f: RevisionDiff['old']) => `${f.ok ? 'ok' : 'errors'} (${plural(f.errors, 'error')}, ${plural(f.warnings, 'warning')})`;
  out.push(`old: ${state(d.old)}; new: ${state(d.new)}`);
  const head = headerLines(d, word);
  out.push(head.length ? 'header:' : 'header: unchanged', ...head);
  for (const s of d.sizes) out.push(...sizeLines(s, options.cells ?? 20));
  const dg = d.diagnostics;
  out.push(`diagnostics: ${dg.introduced.length} introduced, ${dg.fixed.length} fixed, ${dg.unchanged} unchanged`);
  for (const x of dg.introduced) out.push(diag('+', x));
  for (const x of dg.fixed) out.push(diag('-', x));
  out.push(`text: ${plural(d.text.added, 'line')} added, ${plural(d.text.removed, 'line')} removed${d.text.replacedWhole ? ' (replaced as a whole)' : ''}`);
  if (options.text !== false) {
    for (const h of d.text.hunks) {
      out.push(`@@ -${h.oldStart},${h.oldLines} +${h.newStart},${h.newLines} @@`);
      for (const l of h.lines) out.push(`${l.kind === 'added' ? '+' : l.kind === 'removed' ? '-' : ' '}${l.text}`);
    }
  }
  return out.join('\n');
}
