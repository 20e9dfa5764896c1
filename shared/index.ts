/**
 * Loopwright compiler: the public API (a contract with the studio, the
 * server and the command line; see /work/notes/contracts.md).
 *
 * `compile` composes the stages: notation (source -> AST, shared/notation)
 * and check (AST -> per-size model + diagnostics, shared/check). Pure, no
 * I/O, deterministic, never throws on user input.
 */
import type { Diagnostic, PatternHeader, RoundSummary, FloatInfo } from './types';
import { parseSource, KEYWORD_WORDS, STITCH_WORDS, MODIFIER_WORDS, lexer, isKeywordToken } from './notation';
import { checkPattern, type SizeModel } from './check';
import { sortDiagnostics } from './diagnostics';

export type { Span, Severity, Diagnostic, FloatInfo, RoundSummary, PatternHeader } from './types';
export type { SizeModel, StitchLevel, RoundRecord, MarkerPos, SegmentRange, ColumnInfo, FloatRun } from './check';
export { FLAG, LIMITS, asSeenFromRightSide } from './check';
export { STITCHES, type StitchInfo } from './notation';
export { CODE_LIST, formatDiagnosticText } from './diagnostics';

/** Everything the compiler knows about a source. */
export interface CompileResult {
  /** True when there is no error diagnostic (warnings and infos allowed). */
  ok: boolean;
  header: PatternHeader;
  /** Every diagnostic, sorted by position. */
  diagnostics: Diagnostic[];
  /** One model per size (only the requested one with `options.size`). */
  sizes: SizeModel[];
}

/** Options of {@link compile}. */
export interface CompileOptions {
  /** Work only this size (LW208 when the pattern has no such size). */
  size?: string;
}

/** Compiles a source. Deterministic; never throws on user input. */
export function compile(source: string, options: CompileOptions = {}): CompileResult {
  const parsed = parseSource(source);
  const checked = checkPattern(parsed.ast, options.size, parsed.diagnostics.some((d) => d.code === 'LW101' || d.code === 'LW102'));
  const diagnostics = sortDiagnostics([...parsed.diagnostics, ...checked.diagnostics]);
  return { ok: !diagnostics.some((d) => d.severity === 'error'), header: checked.header, diagnostics, sizes: checked.sizes };
}

/** The command line's JSON (notation.md "The command line"). */
export interface CheckJson {
  ok: boolean;
  diagnostics: { code: string; severity: Diagnostic['severity']; line: number; column: number; endLine: number; endColumn: number; size: string | null; message: string }[];
  sizes: { name: string; rounds: { number: number; side: 'RS' | 'WS'; front: number; backing: number; total: number; longestFloat: FloatInfo | null }[] }[];
}

/** The JSON form of a result, exactly as `loop check --json` prints it. */
export function toCheckJson(result: CompileResult): CheckJson {
  return {
    ok: result.ok,
    diagnostics: result.diagnostics.map((d) => ({
      code: d.code, severity: d.severity, line: d.span.line, column: d.span.column, endLine: d.span.endLine, endColumn: d.span.endColumn,
      size: d.size ?? null, message: d.message,
    })),
    sizes: result.sizes.map((s) => ({
      name: s.name,
      rounds: s.rounds.map((r: RoundSummary) => ({
        number: r.number, side: r.side, front: r.front, backing: r.backing, total: r.total,
        longestFloat: r.longestFloat ? { yarn: r.longestFloat.yarn, stitches: r.longestFloat.stitches } : null,
      })),
    })),
  };
}

/** A small summary to store beside a revision. */
export function summarizeForStorage(result: CompileResult): { errors: number; warnings: number; sizes: { name: string; rounds: { number: number; front: number; backing: number; total: number }[] }[] } {
  return {
    errors: result.diagnostics.filter((d) => d.severity === 'error').length,
    warnings: result.diagnostics.filter((d) => d.severity === 'warning').length,
    sizes: result.sizes.map((s) => ({ name: s.name, rounds: s.rounds.map((r) => ({ number: r.number, front: r.front, backing: r.backing, total: r.total })) })),
  };
}

/** A highlighted stretch of source for the editor. */
export type HighlightKind = 'keyword' | 'stitch' | 'number' | 'comment' | 'string' | 'yarn' | 'colour' | 'name' | 'punctuation' | 'invalid';

const yarnBefore = new Set(['Yarn', 'In', 'Raise', 'Catch', 'Ladder']);

/**
 * Token kinds for highlighting, from the lexer's own token definitions,
 * sorted by position. Names right after `yarn`, `in`, `raise`, `catch` or
 * `ladder` are yarns; other names are plain names.
 */
export function highlightTokens(source: string): { from: number; to: number; kind: HighlightKind }[] {
  const lexed = lexer.tokenize(source);
  const out: { from: number; to: number; kind: HighlightKind }[] = [];
  let prev = '';
  for (const t of lexed.tokens) {
    const type = t.tokenType;
    const name = type.name;
    let kind: HighlightKind;
    if (isKeywordToken(type)) kind = 'keyword';
    else if (name === 'Stitch' || name === 'Modifier') kind = 'stitch';
    else if (name === 'NumberLit' || name === 'Ordinal') kind = 'number';
    else if (name === 'Text' || name === 'GridRow') kind = 'string';
    else if (name === 'Colour') kind = 'colour';
    else if (name === 'Name') kind = yarnBefore.has(prev) ? 'yarn' : 'name';
    else kind = 'punctuation';
    out.push({ from: t.startOffset, to: t.endOffset! + 1, kind });
    prev = name;
  }
  for (const c of lexed.groups.comments ?? []) out.push({ from: c.startOffset, to: c.endOffset! + 1, kind: 'comment' });
  for (const e of lexed.errors) out.push({ from: e.offset, to: e.offset + e.length, kind: 'invalid' });
  return out.sort((a, b) => a.from - b.from);
}

/** Every stitch word, for editor completion. */
export const STITCH_NAMES: readonly string[] = [...new Set([...STITCH_WORDS, ...MODIFIER_WORDS])];
/** Every keyword, for editor completion. */
export const KEYWORDS: readonly string[] = KEYWORD_WORDS;

export { sortDiagnostics };
