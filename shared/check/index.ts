/**
 * The checker: AST in, per-size model and diagnostics out. For each size it
 * plans the rounds (plan.ts), works them on the stitch machine
 * (machine.ts, ops.ts, round.ts), measures floats (floats.ts) and checks
 * backing stitches (backing.ts). See README.md for the model's layout.
 */
import type { Diagnostic, PatternHeader, RoundSummary, Span } from '../types';
import type { Facts } from '../diagnostics/codes';
import { STITCHES, type PatternAst, type StitchInfo } from '../notation';
import { sortDiagnostics } from '../diagnostics';
import { Reporter, SizeContext, TRACED } from './context';
import { resolveHeader } from './header';
import { prepareCharts } from './charts';
import { SourceTable } from './sources';
import { Machine, type ColumnInfo } from './machine';
import { planRounds } from './plan';
import { workRounds, type RoundRecord } from './round';
import { checkBackingClosed, formatRounds } from './backing';
import type { StitchStore } from './store';
import type { RoundsResumer, SizeTrace } from './resume';

export { FLAG, StitchStore } from './store';
export { SourceTable } from './sources';
export type { NodeMap, SizeTrace, RoundsResumer } from './resume';
export { LIMITS } from './context';
export { ONE_SIZE, DEFAULT_YARN } from './header';
export { formatRounds } from './backing';
export { asSeenFromRightSide } from './charts';
export type { RoundRecord } from './round';
export type { MarkerPos, SegmentRange, ColumnInfo } from './machine';
export type { FloatRun } from './floats';

/** Stitch-level data of one size, for renderers. Layout documented in README.md. */
export interface StitchLevel {
  /** Yarn names by yarn index. */
  yarns: string[];
  /** The operation table: `store.op[i]` indexes it. */
  ops: readonly StitchInfo[];
  /** Spans by source index: `store.src[i]` indexes it. */
  sources: Span[];
  /** Every stitch: the cast-on first ([0, castOn)), then each round at its record's offset. */
  store: Pick<StitchStore, 'op' | 'yarn' | 'flags' | 'src' | 'col' | 'length'>;
  /** One record per worked round, aligned with SizeModel.rounds. */
  rounds: RoundRecord[];
  /** Every backing column set up (store.col indexes it). */
  columns: ColumnInfo[];
  /**
   * Operations carried out while working the size (an operation once per
   * pass of its repeat; a round repeated on an unchanged needle is not worked
   * again): the checker's work besides the stitches, bounded by LIMITS.operations.
   */
  operations: number;
}

/** One size of the pattern, worked. */
export interface SizeModel {
  name: string;
  castOn: number;
  rounds: RoundSummary[];
  stitches: StitchLevel;
}

/** What the checker returns. */
export interface CheckOutput {
  header: PatternHeader;
  diagnostics: Diagnostic[];
  sizes: SizeModel[];
}

const origin: Span = { from: 0, to: 0, line: 1, column: 1, endLine: 1, endColumn: 1 };

/** What a check leaves for the incremental compiler: the source table and each size's trace (resume.ts). */
export interface CheckTrace { sources: SourceTable; sizes: Map<string, SizeTrace> }

/** How the incremental compiler asks a check to record and to resume (shared/incremental.ts). */
export interface CheckIncremental {
  /**
   * Called once the new source table is numbered; returns how the earlier
   * compile's objects map to this one's and its traces, or null to work
   * every round.
   */
  prepare(sources: SourceTable, srcMap: Int32Array | null): { resumerFor(size: string): RoundsResumer | undefined } | null;
  /**
   * Numbers the round lines and operations by taking over the earlier
   * compile's table (carry-sources.ts); returns new index by old index,
   * or null to number them afresh (preassign).
   */
  number?(sources: SourceTable): Int32Array | null;
  /**
   * A size's round summaries: a record carried over (the same object at the
   * same place as in the earlier compile) keeps its summary (`yarns`: the
   * yarn names, joined; summaries name yarns).
   */
  summaries(size: string, records: RoundRecord[], yarns: string, make: (r: RoundRecord) => RoundSummary): RoundSummary[];
  /** The facts of the earlier compile's long-float reports for a size, and where to put this compile's (reportFloats). */
  floatFacts?(size: string): FloatFactsMemo;
  /** Diagnostics made for facts objects (Reporter.made), kept across compiles. */
  made?: WeakMap<object, Diagnostic>;
}

/** CheckOutput plus what the incremental compiler needs. */
export interface TracedCheckOutput extends CheckOutput {
  trace: CheckTrace; reusedRounds: number; workedRounds: number;
  /** Sizes whose round plan was carried over from the earlier compile. */
  carriedPlans: number;
}

/**
 * Checks a parsed pattern; `only` restricts the work to one size (LW208 when
 * it does not exist); `hadSyntaxErrors` quiets LW209. Never throws on user input.
 */
export function checkPattern(ast: PatternAst, only?: string, hadSyntaxErrors = false): CheckOutput {
  return check(ast, only, hadSyntaxErrors, null);
}

/**
 * checkPattern for the incremental compiler: records each size's rounds and
 * resumes from `incremental.prepare`'s traces where it can. Throws
 * ResumeMiss when a trace cannot be used (the caller then checks afresh).
 */
export function checkPatternTraced(ast: PatternAst, only: string | undefined, hadSyntaxErrors: boolean, incremental: CheckIncremental): TracedCheckOutput {
  return check(ast, only, hadSyntaxErrors, incremental) as TracedCheckOutput;
}

function check(ast: PatternAst, only: string | undefined, hadSyntaxErrors: boolean, traced: CheckIncremental | null): CheckOutput | TracedCheckOutput {
  // The studio's client build compiles tracing out (build-flags.d.ts).
  const incremental = TRACED ? traced : null;
  const rep = new Reporter();
  if (TRACED && incremental?.made) rep.made = incremental.made;
  const early: Diagnostic[] = [];
  const head = resolveHeader(ast.header, early, origin);
  for (const d of early) rep.list.push(d);
  const flat = head.header.construction === 'flat';
  const sources = new SourceTable();
  sources.add(ast.castOn?.span ?? origin); // index 0: the cast-on (also used for stitches left unworked)
  const charts = prepareCharts(ast.charts, head, rep, sources);
  // New source number by old one when the earlier compile's table was carried over; else number afresh.
  const srcMap = TRACED && incremental ? incremental.number?.(sources) ?? null : null;
  if (!srcMap) sources.preassign(ast);
  const prepared = TRACED && incremental ? incremental.prepare(sources, srcMap) : null;
  const traces = new Map<string, SizeTrace>();
  const yarnsKey = TRACED && incremental ? head.yarns.join('\u0000') : '';
  let reusedRounds = 0, workedRounds = 0, carriedPlans = 0;
  if (!ast.castOn) rep.report('LW207', origin, {});
  if (head.yarns.length > 1 && !head.gauge) rep.report('LW503', ast.header.yarns[0]?.span ?? origin, {});
  if (only !== undefined && !head.sizes.includes(only)) {
    rep.report('LW208', ast.header.sizesSpan ?? origin, { name: only, known: head.sizes.join(' ') });
    const out = { header: head.header, diagnostics: sortDiagnostics(rep.finish()), sizes: [] };
    return TRACED && incremental ? { ...out, trace: { sources, sizes: traces }, reusedRounds, workedRounds, carriedPlans } : out;
  }
  const sizes: SizeModel[] = [];
  head.sizes.forEach((size, sizeIndex) => {
    if (only !== undefined && size !== only) return;
    const ctx = new SizeContext(head, size, sizeIndex, rep);
    const m = new Machine(ctx, sources, charts);
    const castOnCount = ast.castOn ? ctx.graded(ast.castOn.count) : 0;
    const castOnYarn = ctx.yarn(ast.castOn?.yarn ?? null, 0);
    // The incremental compiler may carry the earlier compile's plan over (resume.ts); planning
    // reports nothing then, and how many reports planning made is kept for the next compile.
    const resume = TRACED ? prepared?.resumerFor(size) : undefined;
    const callsBefore = rep.calls;
    const carried = TRACED && resume ? resume.plan() : null;
    if (TRACED && carried) carriedPlans++;
    const planned = carried ?? planRounds(ctx, ast, flat, hadSyntaxErrors);
    const planReports = rep.calls - callsBefore;
    let records: RoundRecord[] = [];
    if (castOnCount < 0) ctx.report('LW103', ast.castOn!.count.span, { what: 'a cast-on', need: '0 or more stitches', value: castOnCount });
    if (planned) {
      const worked = workRounds(m, ast, planned.rounds, planned.ranges, { count: Math.max(0, castOnCount), yarn: castOnYarn, src: 0 }, flat, {
        record: incremental !== null,
        resume,
        planReports,
      });
      records = worked.records;
      if (worked.trace) traces.set(size, worked.trace);
      reusedRounds += worked.stats.reusedRounds;
      workedRounds += worked.stats.workedRounds;
    }
    checkBackingClosed(m, records[records.length - 1]);
    reportFloats(ctx, records, m.word, m.store, sources.spans, TRACED && incremental ? incremental.floatFacts?.(size) : undefined);
    m.store.trim();
    sizes.push({
      name: size,
      castOn: Math.max(0, castOnCount),
      rounds: TRACED && incremental ? incremental.summaries(size, records, yarnsKey, (r) => summarize(r, head.yarns)) : records.map((r) => summarize(r, head.yarns)),
      stitches: { yarns: head.yarns, ops: STITCHES, sources: sources.spans, store: m.store, rounds: records, columns: m.columns, operations: m.ops },
    });
  });
  const out = { header: head.header, diagnostics: sortDiagnostics(rep.finish()), sizes };
  return TRACED && incremental ? { ...out, trace: { sources, sizes: traces }, reusedRounds, workedRounds, carriedPlans } : out;
}

function summarize(r: RoundRecord, yarns: string[]): RoundSummary {
  let longest: RoundSummary['longestFloat'] = null;
  for (const f of r.floats) if (!longest || f.stitches > longest.stitches) longest = { yarn: yarns[f.yarn], stitches: f.stitches };
  return { number: r.number, side: r.side, front: r.front, backing: r.backing, total: r.front + r.backing, longestFloat: longest, span: r.span };
}

/** One LW501 report's facts, kept by the incremental compiler for the next compile (by end span). */
export interface FloatFacts { yarn: number; stitches: number; rounds: number[]; basis: string; facts: Facts }
/** The earlier compile's LW501 facts by end span, and this compile's. */
export interface FloatFactsMemo { before: Map<Span, FloatFacts[]> | undefined; after: Map<Span, FloatFacts[]> }

/** The facts kept for a group, when every input of its facts is the same. */
function keptFacts(memo: FloatFactsMemo, span: Span, yarn: number, stitches: number, rounds: number[], basis: string): Facts | undefined {
  const list = memo.before?.get(span);
  if (!list) return undefined;
  for (const e of list) {
    if (e.yarn !== yarn || e.stitches !== stitches || e.basis !== basis || e.rounds.length !== rounds.length) continue;
    let same = true;
    for (let i = 0; i < rounds.length && same; i++) same = e.rounds[i] === rounds[i];
    if (same) return e.facts;
  }
  return undefined;
}

/**
 * LW501: floats past the limit, grouped by yarn, length and line so a range
 * of rounds is one warning. With `memo` (the incremental compiler), a group
 * whose facts the earlier compile made from the same inputs reuses them.
 */
function reportFloats(ctx: SizeContext, records: RoundRecord[], word: string, store: StitchStore, spans: Span[], memo?: FloatFactsMemo): void {
  const limit = ctx.head.floatLimitStitches;
  const gauge = ctx.head.gauge;
  if (limit === null || !gauge) return;
  const groups = new Map<string, { rounds: number[]; span: Span; yarn: number; stitches: number }>();
  for (const r of records) {
    for (const f of r.floats) {
      if (f.stitches <= limit) continue;
      const src = store.src[f.toStitch];
      const endSpan = src > 0 && spans[src] ? spans[src] : r.span;
      const key = `${f.yarn}|${f.stitches}|${endSpan.from}`;
      const g = groups.get(key);
      if (g) g.rounds.push(r.number); else groups.set(key, { rounds: [r.number], span: endSpan, yarn: f.yarn, stitches: f.stitches });
    }
  }
  const lim = ctx.head.header.floatLimit;
  // Everything besides the group that the facts read.
  const basis = TRACED && memo ? `${word}|${gauge.stitchesPerInch}|${limit}|${lim.value} ${lim.unit}|${ctx.head.yarns.join('\u0000')}` : '';
  for (const g of groups.values()) {
    let facts = TRACED && memo ? keptFacts(memo, g.span, g.yarn, g.stitches, g.rounds, basis) : undefined;
    if (!facts) {
      const inches = g.stitches / gauge.stitchesPerInch;
      facts = {
        rounds: formatRounds(word, g.rounds), yarn: ctx.head.yarns[g.yarn], stitches: g.stitches,
        inches: inches.toFixed(2), cm: (inches * 2.54).toFixed(1), limit: `${lim.value} ${lim.unit}`, every: Math.max(1, limit),
      };
    }
    if (TRACED && memo) {
      const list = memo.after.get(g.span);
      const e = { yarn: g.yarn, stitches: g.stitches, rounds: g.rounds, basis, facts };
      if (list) list.push(e); else memo.after.set(g.span, [e]);
    }
    ctx.report('LW501', g.span, facts, `${g.yarn}|${g.stitches}|${g.rounds[0]}`);
  }
}
