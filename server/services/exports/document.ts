/**
 * What an export says, independent of its format: the facts of one size of
 * one revision (title, version, sizes, gauge, yarns and estimated amounts,
 * finished size), the abbreviations used with their meanings, the written
 * instructions with counts, the chart as SVG, and the cautions of the
 * trade. Built from the shared compiler and renderers only; the text and
 * PDF writers lay it out. Pure apart from the compile work.
 */
import { compile, type CompileResult } from '../../../shared/index.ts';
import { formatGauge, formatLength } from '../../../shared/measure/index.ts';
import {
  buildChart, formatCounts, renderBackSvg, renderChartSvg, summarize, writeInstructions, type KeyEntry, type SizeSummary,
} from '../../../shared/render/index.ts';

/** What to export. */
export interface ExportInput {
  source: string;
  /** The pattern's title in the studio (used when the source declares none). */
  title: string;
  designer: string | null;
  revision: number;
  /** Release label, when the revision is released. */
  label: string | null;
  /** Size name; null: the first size. */
  size: string | null;
  view: 'front' | 'back';
}

/** One line of the yarn table. */
export interface YarnLine { name: string; label: string; colour: string; amount: string | null }

/** One entry of the written instructions. */
export interface EntryLine { label: string; text: string; counts: string | null; note: string | null }

/** Everything the writers need. */
export interface ExportDocument {
  title: string;
  /** "Version 1.1 (revision 7), size M" or "Revision 7, size M". */
  subtitle: string;
  designer: string | null;
  construction: 'round' | 'flat';
  size: string;
  sizes: string[];
  gauge: string | null;
  yarnWeight: string | null;
  finished: string[];
  yarns: YarnLine[];
  yarnAssumption: string | null;
  key: KeyEntry[];
  castOn: string;
  entries: EntryLine[];
  chartSvg: string | null;
  cautions: string[];
  /** Problems the compiler reported (errors first), so a reader knows. */
  problems: string[];
}

/** Why an export cannot be made (a user matter: the route answers 400). */
export class ExportRefusal extends Error {
  override name = 'ExportRefusal';
  constructor(readonly code: string, message: string) {
    super(message);
  }
}

function finishedLines(s: SizeSummary, word: string): string[] {
  if (!s.finished) return [`${s.mainFrontStitches} front sts over ${s.roundsWorked} ${word}s (no gauge declared, so no lengths).`];
  return [
    `Finished ${s.finished.widthKind}: ${formatLength(s.finished.width, { primary: 'cm' })} over ${s.mainFrontStitches} front sts.`,
    `Finished length: ${formatLength(s.finished.length, { primary: 'cm' })} over ${s.roundsWorked} ${word}s.`,
  ];
}

/** Compiles and lays out the content of an export; throws {@link ExportRefusal} when there is nothing to export. */
export function buildExportDocument(input: ExportInput, result: CompileResult = compile(input.source)): ExportDocument {
  const sizeName = input.size ?? result.sizes[0]?.name ?? null;
  const model = result.sizes.find((s) => s.name === sizeName);
  if (!sizeName || !model) {
    throw new ExportRefusal('unknown-size', sizeName ? `This revision has no size "${sizeName}".` : 'This revision has no size to export yet.');
  }
  const ins = writeInstructions(input.source, result, sizeName);
  if (!ins) throw new ExportRefusal('unknown-size', `This revision has no size "${sizeName}".`);
  const summary = summarize(result);
  const sizeSummary = summary.sizes.find((s) => s.name === sizeName) ?? null;
  const word = result.header.construction === 'flat' ? 'row' : 'round';
  const amounts = new Map((sizeSummary?.yarn?.amounts ?? []).map((a) => [a.yarn, a]));
  const allowance = sizeSummary?.yarn ? Math.round(sizeSummary.yarn.allowance * 100) : null;
  const yarns = result.header.yarns.map((y) => {
    const a = amounts.get(y.name);
    return {
      name: y.name,
      label: y.label,
      colour: y.colour,
      amount: a ? `about ${Math.ceil(a.metresWithAllowance)} m / ${Math.ceil(a.yardsWithAllowance)} yd (estimate, ${allowance} % allowance included)` : null,
    };
  });
  const chart = buildChart(result, sizeName);
  const chartSvg = chart ? (input.view === 'back' ? renderBackSvg(chart) : renderChartSvg(chart)) : null;
  const title = result.header.title ?? input.title;
  const version = input.label ? `Version ${input.label} (revision ${input.revision})` : `Revision ${input.revision} (not released)`;
  const problems = result.diagnostics
    .filter((d) => d.severity !== 'info' && (!d.size || d.size === sizeName))
    .sort((a, b) => (a.severity === b.severity ? 0 : a.severity === 'error' ? -1 : 1))
    .map((d) => `${d.severity === 'error' ? 'Error' : 'Warning'} ${d.code} (line ${d.span.line}): ${d.message}`);
  return {
    title,
    subtitle: `${version}, ${sizeName === 'one size' ? 'one size' : `size ${sizeName}`}`,
    designer: result.header.designer ?? input.designer,
    construction: result.header.construction,
    size: sizeName,
    sizes: result.header.sizes.length ? [...result.header.sizes] : result.sizes.map((s) => s.name),
    gauge: summary.gauge ? formatGauge(summary.gauge) : null,
    yarnWeight: summary.yarnWeight?.message ?? null,
    finished: sizeSummary ? finishedLines(sizeSummary, word) : [],
    yarns,
    yarnAssumption: summary.yarnAssumption,
    key: ins.key,
    castOn: ins.castOn,
    entries: ins.entries.map((e) => ({ label: e.label, text: e.text, counts: e.counts ? formatCounts(e.counts) : null, note: e.note })),
    chartSvg,
    cautions: summary.cautions,
    problems,
  };
}

/** The plain-text export: facts, yarns, abbreviations, instructions with counts, cautions. */
export function formatExportText(doc: ExportDocument): string {
  const out: string[] = [];
  out.push(doc.title, doc.subtitle);
  if (doc.designer) out.push(`Designer: ${doc.designer}`);
  out.push('');
  out.push(`Sizes: ${doc.sizes.join(', ')}`);
  out.push(`Gauge: ${doc.gauge ?? 'not declared'}`);
  if (doc.yarnWeight) out.push(`Yarn weight: ${doc.yarnWeight}`);
  for (const f of doc.finished) out.push(f);
  out.push('', 'Yarns');
  for (const y of doc.yarns) out.push(`  ${y.name}: ${y.label} (${y.colour})${y.amount ? `, ${y.amount}` : ''}`);
  if (doc.yarnAssumption) out.push(`  Amounts are estimates: ${doc.yarnAssumption}`);
  out.push('', 'Abbreviations');
  for (const k of doc.key) out.push(`  ${k.abbreviation}: ${k.meaning}`);
  if (doc.problems.length) {
    out.push('', 'Open problems in this revision');
    for (const p of doc.problems) out.push(`  ${p}`);
  }
  out.push('', 'Instructions', doc.castOn);
  for (const e of doc.entries) {
    let line = `${e.label}: ${e.text}`;
    if (e.counts) line += ` (${e.counts})`;
    if (e.note) line += ` Note: ${e.note}`;
    out.push(line);
  }
  out.push('', 'Cautions');
  for (const c of doc.cautions) out.push(`  - ${c}`);
  return `${out.join('\n')}\n`;
}
