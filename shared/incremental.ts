/**
 * An incremental front for {@link compile}: `createIncrementalCompiler()`
 * returns an object whose `compile(source)` gives exactly the result a fresh
 * `compile(source)` gives (same JSON; the property test in
 * tests/shared/incremental.test.ts checks it), reusing work from the
 * previous source it compiled.
 *
 * What is reused, and why it is safe:
 * 1. Parsing of unchanged statements. The whole source is lexed again (the
 *    lexer is cheap and its tokens decide where statements start). The token
 *    stream is cut before every statement-starting token, as the parser
 *    itself does (shared/notation/parser.ts parses each piece alone, with a
 *    fresh parser state, so a piece's CST and errors depend only on its own
 *    tokens). A piece whose text, token kinds and starting column equal a
 *    piece of the previous source gets that piece's CST and errors back,
 *    copied with every offset and line moved by the distance it moved
 *    (columns cannot change: the first line starts at the same column, later
 *    lines start inside the piece). The CST-to-AST step then runs as usual.
 * 2. The AST and the checker's per-size results, when every piece was
 *    reused unmoved and the pieces are exactly the previous source's pieces
 *    in the same order (so every CST, hence the AST the CST-to-AST step
 *    builds from them, is identical, spans included), and the requested size
 *    and whether there were syntax errors are the same too: the checker is a
 *    deterministic function of exactly these (shared/check/index.ts
 *    `checkPattern`; it does not read the comment list, which is rebuilt).
 *    This covers edits of comments and blank space that do not move later
 *    text (same length, or after the last statement) and re-compiling an
 *    unchanged text. Any other edit, a note included, works every size
 *    again: a changed round can change every round after it.
 *
 * Results may share objects with earlier results; treat them as read-only
 * (as every compile result is). Memory: only the previous source's pieces
 * and result are kept.
 */
import type { CstElement, CstNode, IToken, TokenType } from 'chevrotain';
import type { Diagnostic, Span } from './types';
import { compile, type CompileOptions, type CompileResult } from './index';
import { lexSource, tokenSpan, spanAt, MAX_SYNTAX_DIAGNOSTICS, allTokens, type PatternAst } from './notation';
import { getParser, type ParseError } from './notation/parser';
import { buildAst } from './notation/to-ast';
import { makeDiagnostic, sortDiagnostics } from './diagnostics';
import { checkPattern, type CheckOutput } from './check';

/** A compiler that remembers its previous source. */
export interface IncrementalCompiler {
  /** Same result as `compile(source, options)`; reuses what the previous call computed where safe. */
  compile(source: string, options?: CompileOptions): CompileResult;
  /** What the last call reused (for benchmarks and tests). */
  readonly lastStats: { pieces: number; reusedPieces: number; reusedCheck: boolean };
}

const byName = new Map<string, TokenType>(allTokens.map((t) => [t.name, t]));
const T = (name: string): TokenType => {
  const t = byName.get(name);
  if (!t) throw new Error(`incremental compiler: no token type ${name}`); // programmer error: the token set changed
  return t;
};
const starters = new Set<TokenType>(['Title', 'Designer', 'Item', 'Sizes', 'Gauge', 'Yarn', 'Work', 'Float', 'Cast', 'Ladder'].map(T));
const roundWords = new Set<TokenType>(['Round', 'Rounds', 'Row', 'Rows'].map(T));
const afterRoundNumber = new Set<TokenType>(['Colon', 'Dash', 'Every', 'At', 'In'].map(T));
const [NumberLit, Slash, Chart, Name, Colon] = ['NumberLit', 'Slash', 'Chart', 'Name', 'Colon'].map(T);

/** The parser's own cut rule (parser.ts `startsStatement`), repeated here; the property test guards the copy. */
function startsStatement(tokens: IToken[], i: number): boolean {
  const t = tokens[i].tokenType;
  if (starters.has(t)) return true;
  if (roundWords.has(t)) {
    let j = i + 1;
    if (tokens[j]?.tokenType !== NumberLit) return false;
    while (tokens[j + 1]?.tokenType === Slash && tokens[j + 2]?.tokenType === NumberLit) j += 2;
    const after = tokens[j + 1]?.tokenType;
    if (after && afterRoundNumber.has(after)) return true;
    return i > 0 && (tokens[i - 1].endLine ?? 0) < (tokens[i].startLine ?? 0);
  }
  if (t === Chart) return tokens[i + 1]?.tokenType === Name && tokens[i + 2]?.tokenType === Colon;
  return false;
}

type Built = ReturnType<typeof buildAst>;
interface PieceResult { cst: CstNode | null; errors: ParseError[]; offset: number; line: number }

const isToken = (e: CstElement): e is IToken => (e as IToken).image !== undefined;
type Located = { startOffset: number; endOffset?: number; startLine?: number; endLine?: number };
function move(x: Located, dOff: number, dLine: number, seen: Set<object>): void {
  if (seen.has(x)) return; // a token can sit in the CST and in an error: move it once
  seen.add(x);
  x.startOffset += dOff;
  if (x.endOffset !== undefined) x.endOffset += dOff;
  if (x.startLine !== undefined) x.startLine += dLine;
  if (x.endLine !== undefined) x.endLine += dLine;
}
function moveCst(n: CstNode, dOff: number, dLine: number, seen: Set<object>): void {
  if (n.location) move(n.location as Located, dOff, dLine, seen);
  for (const list of Object.values(n.children)) {
    for (const e of list) if (isToken(e)) move(e, dOff, dLine, seen); else moveCst(e, dOff, dLine, seen);
  }
}

/** Creates an incremental compiler (see the module comment for what it reuses). */
export function createIncrementalCompiler(): IncrementalCompiler {
  let pieces = new Map<string, PieceResult>();
  // The previous source's pieces in order, what buildAst made of them, and the check of that AST.
  let previous: { order: PieceResult[]; built: Built; size: string | undefined; hadSyntax: boolean; checked: CheckOutput } | null = null;
  const stats = { pieces: 0, reusedPieces: 0, reusedCheck: false };
  // CSTs handed out in the current compile (each at most once, since moving one changes it in place).
  let taken = new Set<object>();

  function parsePiece(source: string, piece: IToken[], next: Map<string, PieceResult>): PieceResult {
    const first = piece[0];
    const last = piece[piece.length - 1];
    const key = `${first.startColumn}\u0000${piece.map((t) => t.tokenType.name).join(',')}\u0000${source.slice(first.startOffset, (last.endOffset ?? last.startOffset) + 1)}`;
    const line = first.startLine ?? 1;
    stats.pieces++;
    const found = pieces.get(key) ?? next.get(key);
    const cached = found && !taken.has(found.cst ?? found) ? found : undefined;
    if (cached) {
      taken.add(cached.cst ?? cached);
      stats.reusedPieces++;
      const dOff = first.startOffset - cached.offset, dLine = line - cached.line;
      if (dOff === 0 && dLine === 0) { next.set(key, cached); return cached; }
      // Moved: shift its positions in place. Safe because nothing outside the cache keeps the
      // CST or its tokens (the AST and diagnostics copy positions into fresh spans), and a
      // piece is taken from the cache at most once per compile (see taken). The wrapper is
      // new, so an AST built from the old positions is never taken for the new ones.
      const seen = new Set<object>();
      if (cached.cst) moveCst(cached.cst, dOff, dLine, seen);
      for (const e of cached.errors) { move(e.token, dOff, dLine, seen); if (e.previous) move(e.previous, dOff, dLine, seen); }
      const moved: PieceResult = { cst: cached.cst, errors: cached.errors, offset: first.startOffset, line };
      next.set(key, moved);
      return moved;
    }
    const parser = getParser();
    parser.input = piece;
    const cst = parser.statement();
    const errors = parser.errors.map((e) => ({ message: e.message, token: e.token, previous: (e as { previousToken?: IToken }).previousToken }));
    const made: PieceResult = { cst: cst ?? null, errors, offset: first.startOffset, line };
    taken.add(made.cst ?? made);
    next.set(key, made);
    return made;
  }

  /** parseSource (shared/notation/index.ts) with the per-piece cache. */
  function parse(source: string): { ast: PatternAst; diagnostics: Diagnostic[]; order: PieceResult[]; built: Built; sameAst: boolean } {
    const lexed = lexSource(source);
    const diagnostics: Diagnostic[] = lexed.diagnostics;

    // parseTokens (parser.ts), piece by piece through the cache.
    const tokens = lexed.tokens;
    const maxErrors = MAX_SYNTAX_DIAGNOSTICS * 4;
    const next = new Map<string, PieceResult>();
    const csts: CstNode[] = [];
    const order: PieceResult[] = [];
    const errors: ParseError[] = [];
    let stopped = false;
    let start = 0;
    for (let i = 1; i <= tokens.length; i++) {
      if (i < tokens.length && !startsStatement(tokens, i)) continue;
      const piece = tokens.slice(start, i);
      start = i;
      const r = parsePiece(source, piece, next);
      order.push(r);
      errors.push(...r.errors);
      if (r.cst) csts.push(r.cst);
      if (errors.length > maxErrors) { stopped = i < tokens.length; break; }
    }
    pieces = next;

    let parseCount = 0;
    for (const e of errors) {
      parseCount++;
      if (parseCount > MAX_SYNTAX_DIAGNOSTICS) continue;
      let span: Span;
      if (!Number.isNaN(e.token.startOffset) && e.token.image !== undefined && e.token.tokenType.name !== 'EOF') span = tokenSpan(e.token);
      else if (e.previous && !Number.isNaN(e.previous.startOffset)) span = tokenSpan(e.previous);
      else span = spanAt(source, source.length);
      diagnostics.push(makeDiagnostic('LW102', span, { detail: e.message }));
    }
    if (parseCount > MAX_SYNTAX_DIAGNOSTICS || stopped) {
      diagnostics.push(makeDiagnostic('LW902', spanAt(source, 0), { count: Math.max(0, parseCount - MAX_SYNTAX_DIAGNOSTICS), code: stopped ? 'LW102; reading stopped' : 'LW102' }));
    }
    const prev = previous?.order;
    const sameAst = !!prev && prev.length === order.length && order.every((r, i) => r === prev[i]);
    const built = sameAst ? previous!.built : buildAst(csts);
    const ast = { ...built.ast, comments: (lexed.groups.comments ?? []).map(tokenSpan) };
    return { ast, diagnostics: [...diagnostics, ...built.diagnostics], order, built, sameAst };
  }

  return {
    get lastStats() { return { ...stats }; },
    compile(source: string, options: CompileOptions = {}): CompileResult {
      stats.pieces = 0; stats.reusedPieces = 0; stats.reusedCheck = false;
      taken = new Set();
      let parsed: ReturnType<typeof parse>;
      try {
        parsed = parse(source);
      } catch {
        // Anything unexpected in the cache path: forget it and compile afresh.
        pieces = new Map(); previous = null;
        return compile(source, options);
      }
      const hadSyntax = parsed.diagnostics.some((d) => d.code === 'LW101' || d.code === 'LW102');
      let checked: CheckOutput;
      if (previous && parsed.sameAst && previous.size === options.size && previous.hadSyntax === hadSyntax) {
        checked = previous.checked;
        stats.reusedCheck = true;
      } else {
        checked = checkPattern(parsed.ast, options.size, hadSyntax);
      }
      previous = { order: parsed.order, built: parsed.built, size: options.size, hadSyntax, checked };
      const diagnostics = sortDiagnostics([...parsed.diagnostics, ...checked.diagnostics]);
      return { ok: !diagnostics.some((d) => d.severity === 'error'), header: checked.header, diagnostics, sizes: checked.sizes };
    },
  };
}
