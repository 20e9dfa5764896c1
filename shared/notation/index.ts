/**
 * The notation front end: source text -> tokens -> CST -> AST, with every
 * lexing and parsing problem as a diagnostic (LW101, LW102). See README.md.
 */
import type { IToken } from 'chevrotain';
import type { Diagnostic, Span } from '../types';
import { makeDiagnostic } from '../diagnostics';
import { lexer } from './tokens';
import { parseTokens, type ParseError } from './parser';
import { buildAst, tokenSpan } from './to-ast';
import type { PatternAst } from './ast';

export type * from './ast';
export { STITCHES, STITCH_WORDS, MODIFIER_WORDS, OP, stitchByName, resolveStitch, type StitchInfo, type StitchKind } from './stitches';
export { allTokens, lexer, KEYWORD_WORDS, isKeywordToken } from './tokens';
export { getParser } from './parser';
export { tokenSpan, joinSpans } from './to-ast';

/** At most this many lexing and this many parsing diagnostics are listed (then one LW902). */
export const MAX_SYNTAX_DIAGNOSTICS = 100;

/**
 * A span for a bare offset range within one line of `source` (used where no
 * token exists). Lines end at \n, \r\n or \r, as for the lexer.
 */
export function spanAt(source: string, from: number, to = from): Span {
  let line = 1, lineStart = 0;
  const breaks = /\r\n?|\n/g;
  for (let m = breaks.exec(source); m && m.index < from; m = breaks.exec(source)) {
    if (m.index + m[0].length > from) break;
    line++; lineStart = m.index + m[0].length;
  }
  return { from, to, line, column: from - lineStart + 1, endLine: line, endColumn: to - lineStart + 1 };
}

/** The result of reading a source. */
export interface ParsedSource {
  ast: PatternAst;
  tokens: IToken[];
  diagnostics: Diagnostic[];
}

/**
 * Lexes a source and turns the lexer's errors into diagnostics: adjacent
 * unreadable characters are one LW101; past MAX_SYNTAX_DIAGNOSTICS one LW902
 * says how many more. Shared by parseSource and the incremental compiler.
 */
export function lexSource(source: string): { tokens: IToken[]; groups: Record<string, IToken[]>; diagnostics: Diagnostic[] } {
  const diagnostics: Diagnostic[] = [];
  const lexed = lexer.tokenize(source);
  let lexCount = 0;
  for (let i = 0; i < lexed.errors.length; i++) {
    const first = lexed.errors[i];
    let end = first.offset + first.length;
    while (i + 1 < lexed.errors.length && lexed.errors[i + 1].offset === end) { i++; end = lexed.errors[i].offset + lexed.errors[i].length; }
    lexCount++;
    if (lexCount > MAX_SYNTAX_DIAGNOSTICS) continue;
    const text = source.slice(first.offset, end);
    const shown = text.length > 20 ? `${text.slice(0, 20)}...` : text;
    const span: Span = { from: first.offset, to: end, line: first.line ?? 1, column: first.column ?? 1, endLine: first.line ?? 1, endColumn: (first.column ?? 1) + (end - first.offset) };
    diagnostics.push(makeDiagnostic('LW101', span, { text: JSON.stringify(shown) }));
  }
  if (lexCount > MAX_SYNTAX_DIAGNOSTICS) {
    diagnostics.push(makeDiagnostic('LW902', spanAt(source, 0), { count: lexCount - MAX_SYNTAX_DIAGNOSTICS, code: 'LW101' }));
  }
  return { tokens: lexed.tokens, groups: lexed.groups, diagnostics };
}

/**
 * The parser's errors as diagnostics: one LW102 each, at the unexpected
 * token (or the one before it, or the end of the text), up to
 * MAX_SYNTAX_DIAGNOSTICS; then one LW902 with how many more, also when
 * reading stopped. Shared by parseSource and the incremental compiler.
 */
export function parseErrorDiagnostics(source: string, errors: readonly ParseError[], stopped: boolean): Diagnostic[] {
  const out: Diagnostic[] = [];
  for (let i = 0; i < errors.length && i < MAX_SYNTAX_DIAGNOSTICS; i++) {
    const e = errors[i];
    let span: Span;
    if (!Number.isNaN(e.token.startOffset) && e.token.image !== undefined && e.token.tokenType.name !== 'EOF') span = tokenSpan(e.token);
    else if (e.previous && !Number.isNaN(e.previous.startOffset)) span = tokenSpan(e.previous);
    else span = spanAt(source, source.length);
    out.push(makeDiagnostic('LW102', span, { detail: e.message }));
  }
  if (errors.length > MAX_SYNTAX_DIAGNOSTICS || stopped) {
    out.push(makeDiagnostic('LW902', spanAt(source, 0), { count: Math.max(0, errors.length - MAX_SYNTAX_DIAGNOSTICS), code: stopped ? 'LW102; reading stopped' : 'LW102' }));
  }
  return out;
}

/** Reads a source. Never throws on user input; problems are diagnostics. */
export function parseSource(source: string): ParsedSource {
  const lexed = lexSource(source);
  const diagnostics = lexed.diagnostics;

  const parsed = parseTokens(lexed.tokens, MAX_SYNTAX_DIAGNOSTICS * 4);
  diagnostics.push(...parseErrorDiagnostics(source, parsed.errors, parsed.stopped));

  const built = buildAst(parsed.statements.map((s) => s.cst));
  const comments = (lexed.groups.comments ?? []).map(tokenSpan);
  built.ast.comments = comments;
  return { ast: built.ast, tokens: lexed.tokens, diagnostics: [...diagnostics, ...built.diagnostics] };
}
