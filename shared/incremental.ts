/**
 * An incremental front for {@link compile}: `createIncrementalCompiler()`
 * returns an object whose `compile(source)` gives exactly the result a fresh
 * `compile(source)` gives (same JSON; the property test in
 * tests/shared/incremental.test.ts checks it), reusing work from the
 * previous source it compiled.
 *
 * What is reused, and why it is safe:
 * 1. Lexing and cutting. The previous source's statements (pieces) before
 *    the first changed character and after the last one are kept, those
 *    after it moved by the change in length (cutAround). Only whole lines
 *    around the edit are lexed again: no token but skipped blank space
 *    crosses a line break, and the region starts and ends where a statement
 *    starts a line, so the cut (parser.ts `startsStatement`, the parser's own rule)
 *    comes out as a cut of the whole text would. Anything unusual (\r line
 *    ends, unreadable characters, many errors, edits in the first statement)
 *    lexes the whole text instead (cutAll).
 * 2. Parsing of unchanged statements. The parser parses each piece alone
 *    with a fresh state, so a piece's CST and errors depend only on its own
 *    tokens: a piece whose text, token kinds and starting column equal a
 *    piece of the previous source gets that piece's CST and errors back,
 *    with every offset and line moved by the distance it moved (columns
 *    cannot change: the first line starts at the same column, later lines
 *    start inside the piece), lazily (settle()).
 * 3. Round and ladder lines of unchanged statements (the CST-to-AST step's
 *    memo): a round line depends only on its statement and its place among
 *    the round lines, a ladder line only on its statement. A moved one is
 *    moved in place (LineShift: its spans shift), a renumbered round line
 *    gets its new index in place: both keep their identity, so the previous
 *    check's plans, records, reports and sources still name them.
 * 4. The check. When nothing but round lines changed (header, cast-on,
 *    charts and ladders reused), each size's rounds resume from the
 *    previous check's trace (shared/check/resume.ts): rounds before the
 *    first round whose plan changed are taken over, the changed ones are
 *    worked, and once the machine is back in the state the previous check
 *    had at a round, the rest is taken over too. Old objects map to new ones
 *    by identity (unchanged or moved lines), through `pairs` (the other
 *    statements, built again) or not at all (objects of edited statements,
 *    `dead`: then the check starts over). When every piece is the previous
 *    one, unmoved, the whole previous check is reused (comment edits in
 *    place).
 *
 * A result is valid until the next call. Results share objects with earlier
 * results, and the next compile moves the spans of reused lines in place and
 * takes over the previous check's round checkpoints, so an earlier result
 * may no longer describe its own source (as an incremental parser edits its
 * previous tree in place): serialize what must outlive the next call
 * (toCheckJson). Treat results as read-only (as every compile result is).
 * Memory: only the previous source's pieces and result are kept.
 */
import type { CstElement, CstNode, IToken } from 'chevrotain';
import type { Diagnostic, RoundSummary, Span } from './types';
import { compile, type CompileOptions, type CompileResult } from './index';
import { lexSource, lexer, tokenSpan, parseErrorDiagnostics, MAX_SYNTAX_DIAGNOSTICS, type PatternAst } from './notation';
import { getParser, startsStatement, type ParseError } from './notation/parser';
import { buildAst, type RoundLineMemo } from './notation/to-ast';
import type { LadderLine, Op, Repeat, RoundLine, ToSpec } from './notation/ast';
import { sortDiagnostics } from './diagnostics';
import { checkPatternTraced, type CheckOutput, type CheckTrace, type FloatFacts, type FloatFactsMemo, type NodeMap, type RoundRecord, type SourceTable } from './check';
import { createResumer, ResumeMiss } from './check/resume';
import { carrySources } from './check/carry-sources';

/** What one incremental compile reused. */
export interface IncrementalStats {
  /** Statements in the source, and how many kept their parse from the previous source. */
  pieces: number;
  reusedPieces: number;
  /** The whole check was the previous one. */
  reusedCheck: boolean;
  /** Rounds (over all sizes checked) taken from the previous check, and rounds worked. */
  reusedRounds: number;
  workedRounds: number;
  /** Sizes whose round plan was carried over from the previous check (not planned again). */
  carriedPlans: number;
  /** The AST was the previous one with the edited round lines built anew (no statement walked again). */
  patchedAst: boolean;
}

/** A compiler that remembers its previous source. */
export interface IncrementalCompiler {
  /** Same result as `compile(source, options)`, valid until the next call (see the module comment); reuses what the previous call computed where safe. */
  compile(source: string, options?: CompileOptions): CompileResult;
  /** What the last call reused (for benchmarks and tests). */
  readonly lastStats: IncrementalStats;
}

type Built = ReturnType<typeof buildAst>;
/**
 * A parsed statement. `offset`/`line`: where it starts in the current source;
 * `cstOffset`/`cstLine`: where its CST and errors think it starts (moved
 * lazily, only when something reads them: see settle()).
 */
interface PieceResult {
  cst: CstNode | null; errors: ParseError[]; offset: number; line: number; cstOffset: number; cstLine: number; kind: string; reused: boolean;
  /** The cache key (start column, token kinds, text). */
  key: string;
  /** Offset just after its last token. */
  end: number;
  /** Its first token is the first on its line. */
  firstOnLine: boolean;
  /** Its tokens (as lexed when it was parsed; only their kinds are read again, for look-ahead). */
  tokens: IToken[];
}
interface LineEntry { line: RoundLine; diagnostics: Diagnostic[] }
interface LadderEntry { ladder: LadderLine | null; diagnostics: Diagnostic[] }

/** A reused piece moved by (dOff, dLine): a new object (the previous source's list keeps the old one), written out field by field (a spread costs several times as much). */
function placed(r: PieceResult, dOff: number, dLine: number, firstOnLine: boolean): PieceResult {
  return {
    cst: r.cst, errors: r.errors, offset: r.offset + dOff, line: r.line + dLine, cstOffset: r.cstOffset, cstLine: r.cstLine, kind: r.kind, reused: true,
    key: r.key, end: r.end + dOff, firstOnLine, tokens: r.tokens,
  };
}

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

/**
 * Moves a round line's spans in place by (dOff, dLine); columns stay (see the
 * module comment). In place, so the line keeps its identity: the previous
 * check's records, reports and source table name the same objects, and the
 * resumer takes them over as they are. `seen` (when given) collects the
 * spans moved, for diagnostics that share one.
 */
class LineShift {
  constructor(private dOff: number, private dLine: number, private seen: Set<Span> | null) {}

  span(s: Span): void {
    s.from += this.dOff; s.to += this.dOff; s.line += this.dLine; s.endLine += this.dLine;
    if (this.seen) this.seen.add(s);
  }
  to(t: ToSpec): void {
    if (t.kind === 'last') this.span(t.n.span);
    else if (t.kind === 'marker' && t.name) this.span(t.name.span);
  }
  repeat(r: Repeat): void {
    if (r.kind === 'times') this.span(r.n.span);
    else if (r.kind !== 'once') this.to(r);
  }
  op(o: Op): void {
    this.span(o.span);
    switch (o.type) {
      case 'stitch': if (o.count) this.span(o.count.span); if (o.to) this.to(o.to); if (o.yarn) this.span(o.yarn.span); break;
      case 'group': for (const x of o.ops) this.op(x); this.repeat(o.repeat); if (o.yarn) this.span(o.yarn.span); break;
      case 'chart': this.span(o.chart.span); if (o.row) this.span(o.row.span); break;
      case 'mark': case 'unmark': this.span(o.name.span); break;
      case 'catch': case 'raise': this.span(o.yarn.span); break;
      case 'carry': if (o.count) this.span(o.count.span); break;
      case 'close': break;
      case 'cable': if (o.yarn) this.span(o.yarn.span); break;
    }
  }
  line(l: RoundLine): void {
    this.span(l.first.span);
    if (l.last) this.span(l.last.span);
    if (l.segment) this.span(l.segment.span);
    if (l.yarn) this.span(l.yarn.span);
    for (const o of l.ops) this.op(o);
    this.span(l.span); this.span(l.headSpan);
  }
  ladder(l: LadderLine): void {
    this.span(l.yarn.span);
    if (l.every) this.span(l.every.span);
    for (const c of l.columns) this.span(c.span);
    this.span(l.first.span); this.span(l.last.span);
    if (l.segment) this.span(l.segment.span);
    this.span(l.span);
  }
  /** A diagnostic of the line, moved (a copy; a span it shares with the line has moved already). */
  diagnostic(d: Diagnostic): Diagnostic {
    const mv = (s: Span): Span => (this.seen?.has(s) ? s : { ...s, from: s.from + this.dOff, to: s.to + this.dOff, line: s.line + this.dLine, endLine: s.endLine + this.dLine });
    return { ...d, span: mv(d.span), ...(d.related ? { related: d.related.map((r) => ({ ...r, span: mv(r.span) })) } : {}) };
  }
}

/** Pairs the objects of two equal AST values (old -> new); false when their shapes differ. */
function pairWalk(a: unknown, b: unknown, pairs: Map<object, object>): boolean {
  if (a === b) return true;
  if (a === null || b === null || typeof a !== 'object' || typeof b !== 'object') return a === b || (Number.isNaN(a) && Number.isNaN(b));
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  pairs.set(a, b);
  if (Array.isArray(a)) {
    const bb = b as unknown[];
    if (a.length !== bb.length) return false;
    for (let i = 0; i < a.length; i++) if (!pairWalk(a[i], bb[i], pairs)) return false;
    return true;
  }
  const ka = Object.keys(a), kb = Object.keys(b);
  if (ka.length !== kb.length) return false;
  for (const k of ka) if (!pairWalk((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], pairs)) return false;
  return true;
}

const sameValues = (a: readonly number[], b: readonly number[]): boolean => a.length === b.length && a.every((v, i) => v === b[i]);
/** Whether two round lines give the same rounds (planning reads only these). */
const planAlike = (a: RoundLine, b: RoundLine): boolean =>
  a.word === b.word && a.every === b.every && sameValues(a.first.values, b.first.values)
  && (a.last === null ? b.last === null : b.last !== null && sameValues(a.last.values, b.last.values))
  && (a.segment?.name ?? null) === (b.segment?.name ?? null);

/**
 * The round lines of the previous AST replaced by lines that plan alike at
 * the same place (resume.ts ResumeFrom.replaced), or null. Reused lines keep
 * their identity (moved in place), so any other difference is a change.
 */
function replacedLines(p: PatternAst, ast: PatternAst, kept: ReadonlySet<object>): Map<RoundLine, RoundLine> | null {
  if (p.rounds.length !== ast.rounds.length || p.ladders.length !== ast.ladders.length) return null;
  for (let i = 0; i < p.ladders.length; i++) if (p.ladders[i] !== ast.ladders[i]) return null;
  const replaced = new Map<RoundLine, RoundLine>();
  let before: Set<object> | null = null;
  for (let i = 0; i < p.rounds.length; i++) {
    const o = p.rounds[i], n = ast.rounds[i];
    if (o === n) continue;
    // The first line also names rounds no line gives (their span): planning again handles that.
    if (i === 0 || !planAlike(o, n)) return null;
    // An edited line for a new one, not lines that swapped places.
    before ??= new Set(p.rounds);
    if (kept.has(o) || before.has(n)) return null;
    replaced.set(o, n);
  }
  return replaced;
}

/** Adds every object reachable from v (except stitch definitions) to `into`. */
function collect(v: unknown, into: Set<object>): void {
  if (v === null || typeof v !== 'object' || into.has(v)) return;
  into.add(v);
  if (Array.isArray(v)) { for (const x of v) collect(x, into); return; }
  for (const [k, x] of Object.entries(v)) if (k !== 'stitch') collect(x, into);
}

/** The statement kind of a piece's CST ('roundLine', 'yarnLine', ...; '' when unreadable). */
const kindOf = (cst: CstNode | null): string => (cst ? Object.keys(cst.children)[0] ?? '' : '');

interface Previous {
  order: PieceResult[];
  built: Built;
  ast: PatternAst;
  size: string | undefined;
  hadSyntax: boolean;
  checked: CheckOutput;
  trace: CheckTrace;
}

/** Creates an incremental compiler (see the module comment for what it reuses). */
export function createIncrementalCompiler(): IncrementalCompiler {
  let pieces = new Map<string, PieceResult>();
  // Round lines built from the previous source's statements, by CST.
  let lines = new Map<CstNode, LineEntry>();
  // Ladder lines likewise.
  let ladders = new Map<CstNode, LadderEntry>();
  let previous: Previous | null = null;
  const stats: IncrementalStats = { pieces: 0, reusedPieces: 0, reusedCheck: false, reusedRounds: 0, workedRounds: 0, carriedPlans: 0, patchedAst: false };
  // CSTs handed out in the current compile (each at most once, since moving one changes it in place).
  let taken = new Set<object>();
  // Objects of the previous AST -> their copies in this compile's AST (moved or renumbered round lines, the other statements).
  let pairs = new Map<object, object>();
  // The previous source and how it was cut (for cutAround).
  let lastCut: (Cut & { source: string }) | null = null;

  function parsePiece(source: string, piece: IToken[], next: Map<string, PieceResult>, firstOnLine: boolean): PieceResult {
    const first = piece[0];
    const last = piece[piece.length - 1];
    const end = (last.endOffset ?? last.startOffset) + 1;
    const key = `${first.startColumn}\u0000${piece.map((t) => t.tokenType.name).join(',')}\u0000${source.slice(first.startOffset, end)}`;
    const line = first.startLine ?? 1;
    stats.pieces++;
    const found = pieces.get(key) ?? next.get(key);
    const cached = found && !taken.has(found.cst ?? found) ? found : undefined;
    if (cached) {
      taken.add(cached.cst ?? cached);
      stats.reusedPieces++;
      const dOff = first.startOffset - cached.offset, dLine = line - cached.line;
      if (dOff === 0 && dLine === 0) {
        const same: PieceResult = cached.reused && cached.firstOnLine === firstOnLine ? cached : placed(cached, 0, 0, firstOnLine);
        next.set(key, same);
        return same;
      }
      const moved = movePiece(cached, dOff, dLine, firstOnLine);
      next.set(key, moved);
      return moved;
    }
    const parser = getParser();
    parser.input = piece;
    const cst = parser.statement();
    const errors = parser.errors.map((e) => ({ message: e.message, token: e.token, previous: (e as { previousToken?: IToken }).previousToken }));
    const made: PieceResult = {
      cst: cst ?? null, errors, offset: first.startOffset, line, cstOffset: first.startOffset, cstLine: line, kind: kindOf(cst ?? null), reused: false,
      key, end, firstOnLine, tokens: piece,
    };
    taken.add(made.cst ?? made);
    next.set(key, made);
    return made;
  }

  /** A reused piece at a new place: its round line moves now (in place), its CST when read (settle()). */
  function movePiece(cached: PieceResult, dOff: number, dLine: number, firstOnLine = cached.firstOnLine): PieceResult {
    const entry = cached.cst ? lines.get(cached.cst) : undefined;
    if (entry && cached.cst) {
      const shift = new LineShift(dOff, dLine, entry.diagnostics.length ? new Set() : null);
      shift.line(entry.line);
      if (entry.diagnostics.length) lines.set(cached.cst, { line: entry.line, diagnostics: entry.diagnostics.map((d) => shift.diagnostic(d)) });
    }
    const ladder = cached.cst && !entry ? ladders.get(cached.cst) : undefined;
    if (ladder && cached.cst) {
      const shift = new LineShift(dOff, dLine, ladder.diagnostics.length ? new Set() : null);
      if (ladder.ladder) shift.ladder(ladder.ladder);
      if (ladder.diagnostics.length) ladders.set(cached.cst, { ladder: ladder.ladder, diagnostics: ladder.diagnostics.map((d) => shift.diagnostic(d)) });
    }
    return placed(cached, dOff, dLine, firstOnLine);
  }

  /**
   * Brings a piece's CST and errors to where the piece now is. Moving in
   * place is safe because nothing outside the cache keeps the CST or its
   * tokens (the AST and diagnostics copy positions into fresh spans), and a
   * piece is taken from the cache at most once per compile (see taken).
   */
  function settle(r: PieceResult): void {
    const dOff = r.offset - r.cstOffset, dLine = r.line - r.cstLine;
    if (dOff === 0 && dLine === 0) return;
    const seen = new Set<object>();
    if (r.cst) moveCst(r.cst, dOff, dLine, seen);
    for (const e of r.errors) { move(e.token, dOff, dLine, seen); if (e.previous) move(e.previous, dOff, dLine, seen); }
    r.cstOffset = r.offset; r.cstLine = r.line;
  }

  /** The pieces of a source with their parse, the lexer's diagnostics and the comments. */
  interface Cut {
    order: PieceResult[]; lexDiagnostics: Diagnostic[]; comments: Span[]; stopped: boolean;
    /**
     * cutAround: the previous source's pieces the edit removed, the pieces
     * parsed anew in their place, and where in `order` the pieces cut again
     * begin (those before are the previous ones, unmoved) and end (those
     * after are the previous ones, moved by the edit); for patchAst.
     */
    edit?: { removed: PieceResult[]; added: PieceResult[]; from: number; keptFrom: number };
  }

  /** Lexes the whole source and cuts it as the parser does (parser.ts parseTokens), piece by piece through the cache. */
  function cutAll(source: string, next: Map<string, PieceResult>): Cut {
    const lexed = lexSource(source);
    const tokens = lexed.tokens;
    const maxErrors = MAX_SYNTAX_DIAGNOSTICS * 4;
    const order: PieceResult[] = [];
    let errors = 0;
    let stopped = false;
    let start = 0;
    for (let i = 1; i <= tokens.length; i++) {
      if (i < tokens.length && !startsStatement(tokens, i)) continue;
      const piece = tokens.slice(start, i);
      const firstOnLine = start === 0 || (tokens[start - 1].endLine ?? 0) < (tokens[start].startLine ?? 0);
      start = i;
      const r = parsePiece(source, piece, next, firstOnLine);
      order.push(r);
      errors += r.errors.length;
      if (errors > maxErrors) { stopped = i < tokens.length; break; }
    }
    return { order, lexDiagnostics: lexed.diagnostics, comments: (lexed.groups.comments ?? []).map(tokenSpan), stopped };
  }

  /**
   * The same as cutAll, lexing only around the edit: the previous source's
   * pieces before the first changed character and after the last one are
   * kept (those after it moved by the change in length), and the text
   * between whole lines around the edit is lexed and cut again. Returns null
   * when the shortcut does not apply (no previous source, line ends other
   * than \n, characters the lexer cannot read, many syntax errors, or the
   * edit reaches the ends); cutAll then does the whole text.
   */
  function cutAround(source: string, next: Map<string, PieceResult>): Cut | null {
    const prev = lastCut;
    if (!prev || prev.stopped || prev.lexDiagnostics.length || prev.order.length < 3 || source.includes('\r')) return null;
    const old = prev.source, pieces = prev.order;
    const max = Math.min(old.length, source.length);
    // The common start and end, a block at a time (comparing slices is native; a loop of charCodeAt was 10x slower), then by character.
    const B = 256;
    let p = 0;
    while (p + B <= max && old.slice(p, p + B) === source.slice(p, p + B)) p += B;
    while (p < max && old.charCodeAt(p) === source.charCodeAt(p)) p++;
    let q = 0;
    while (q + B <= max - p && old.slice(old.length - q - B, old.length - q) === source.slice(source.length - q - B, source.length - q)) q += B;
    while (q < max - p && old.charCodeAt(old.length - 1 - q) === source.charCodeAt(source.length - 1 - q)) q++;
    const delta = source.length - old.length, oldEditEnd = old.length - q;
    // First kept piece after the edit: starts a line, and the line break before it is unchanged.
    let b = 0;
    while (b < pieces.length && pieces[b].offset - 1 < oldEditEnd) b++;
    while (b < pieces.length && !pieces[b].firstOnLine) b++;
    // Last kept piece before the edit: one piece of margin, and the region starts a line.
    let a = 0;
    while (a < pieces.length && pieces[a].end <= p) a++;
    a = Math.min(a, pieces.length - 1) - 1;
    while (a > 0 && !pieces[a].firstOnLine) a--;
    if (a < 1 || b <= a) return null;
    const from = old.lastIndexOf('\n', pieces[a].offset - 1) + 1; // a line start, before the edit
    if (from > p) return null;
    const toOld = b < pieces.length ? pieces[b].offset : old.length;
    const toNew = toOld + delta;
    if (toNew < from || toNew < source.length - q) return null;
    const lexed = lexer.tokenize(source.slice(from, toNew));
    if (lexed.errors.length) return null;
    const baseLine = pieces[a].line - 1;
    const fix = (t: IToken): IToken => {
      t.startOffset += from;
      if (t.endOffset !== undefined) t.endOffset += from;
      if (t.startLine !== undefined) t.startLine += baseLine;
      if (t.endLine !== undefined) t.endLine += baseLine;
      return t;
    };
    const tokens = lexed.tokens.map(fix);
    if (tokens.length === 0) return null;
    let breaksNew = 0, breaksOld = 0;
    for (let i = source.indexOf('\n', from); i >= 0 && i < toNew; i = source.indexOf('\n', i + 1)) breaksNew++;
    for (let i = old.indexOf('\n', from); i >= 0 && i < toOld; i = old.indexOf('\n', i + 1)) breaksOld++;
    const dLine = breaksNew - breaksOld;

    // Kept pieces are taken first, so the middle cannot take them by their text.
    for (let i = 0; i < a; i++) taken.add(pieces[i].cst ?? pieces[i]);
    for (let i = b; i < pieces.length; i++) taken.add(pieces[i].cst ?? pieces[i]);
    const order: PieceResult[] = [];
    const keep = (r: PieceResult): PieceResult => (r.reused ? r : placed(r, 0, 0, r.firstOnLine));
    for (let i = 0; i < a; i++) { const r = keep(pieces[i]); order.push(r); next.set(r.key, r); stats.pieces++; stats.reusedPieces++; }
    // Cut the middle as the parser would; look-ahead may read the first tokens after it.
    const ahead = b < pieces.length ? tokens.concat(pieces[b].tokens.slice(0, 8)) : tokens;
    let start = 0;
    for (let i = 1; i <= tokens.length; i++) {
      if (i < tokens.length && !startsStatement(ahead, i)) continue;
      const firstOnLine = start === 0 || (tokens[start - 1].endLine ?? 0) < (tokens[start].startLine ?? 0);
      order.push(parsePiece(source, tokens.slice(start, i), next, firstOnLine));
      start = i;
    }
    let errors = 0;
    for (const r of order) errors += r.errors.length;
    for (let i = b; i < pieces.length; i++) errors += pieces[i].errors.length;
    // Past the cap the parser stops reading (cutAll); the caches were touched, so start over.
    if (errors > MAX_SYNTAX_DIAGNOSTICS * 4) throw new Error('too many syntax errors for the shortcut');
    const removed: PieceResult[] = [], added: PieceResult[] = [];
    for (let i = a; i < b; i++) if (!taken.has(pieces[i].cst ?? pieces[i])) removed.push(pieces[i]);
    for (let i = a; i < order.length; i++) if (!order[i].reused) added.push(order[i]);
    const keptFrom = order.length;
    for (let i = b; i < pieces.length; i++) {
      const r = delta === 0 && dLine === 0 ? keep(pieces[i]) : movePiece(pieces[i], delta, dLine);
      order.push(r); next.set(r.key, r); stats.pieces++; stats.reusedPieces++;
    }
    const comments: Span[] = [];
    for (const c of prev.comments) if (c.to <= from) comments.push(c); else break;
    for (const t of lexed.groups.comments ?? []) comments.push(tokenSpan(fix(t)));
    for (const c of prev.comments) {
      if (c.from >= toOld) comments.push(delta === 0 && dLine === 0 ? c : { ...c, from: c.from + delta, to: c.to + delta, line: c.line + dLine, endLine: c.endLine + dLine });
    }
    return { order, lexDiagnostics: [], comments, stopped: false, edit: { removed, added, from: a, keptFrom } };
  }

  /**
   * The AST of the previous compile with the edited round lines built anew,
   * when that is what building every statement would give: the edit
   * replaced round lines by as many round lines, every statement after the
   * first one it touched is a round or ladder line whose built line the
   * memo moved, nothing has a syntax error, and building reported nothing.
   * Null otherwise (then buildAst builds every statement, most from the memo).
   */
  function patchAst(cut: Cut, errors: number): Built | null {
    const p = previous;
    if (!p || !cut.edit || errors > 0 || p.built.diagnostics.length > 0) return null;
    const { removed, added, from, keptFrom } = cut.edit;
    if (removed.length === 0 || removed.length !== added.length) return null;
    const order = cut.order;
    // Statements other than round and ladder lines keep their built objects only where they did not move.
    for (let i = from; i < order.length; i++) {
      const r = order[i];
      if (!r.cst) return null;
      if (!r.reused) continue; // an added piece: checked below
      if (r.kind === 'roundLine' ? !lines.has(r.cst) : r.kind !== 'ladderLine' || !ladders.has(r.cst)) return null;
    }
    const rounds = p.built.ast.rounds.slice();
    const made: { was: CstNode; is: CstNode; line: RoundLine }[] = [];
    for (let k = 0; k < removed.length; k++) {
      const o = removed[k], n = added[k];
      if (o.kind !== 'roundLine' || n.kind !== 'roundLine' || !o.cst || !n.cst) return null;
      const entry = lines.get(o.cst);
      if (!entry || entry.diagnostics.length > 0 || rounds[entry.line.index] !== entry.line) return null;
      const one = buildAst([n.cst]);
      if (one.diagnostics.length > 0 || one.ast.rounds.length !== 1) return null;
      const line = one.ast.rounds[0];
      (line as { index: number }).index = entry.line.index;
      rounds[line.index] = line;
      made.push({ was: o.cst, is: n.cst, line });
    }
    // The round lines of the region cut again must follow one another as before (an edit may also
    // have moved a line within it); the statements before and after it kept their order.
    const built = new Map(made.map((m) => [m.is, m.line]));
    let expect = -1;
    for (let i = from; i < keptFrom; i++) {
      const r = order[i];
      if (r.kind !== 'roundLine' || !r.cst) continue;
      const line = built.get(r.cst) ?? lines.get(r.cst)?.line;
      if (!line || (expect >= 0 && line.index !== expect) || rounds[line.index] !== line) return null;
      expect = line.index + 1;
    }
    for (const m of made) { lines.delete(m.was); lines.set(m.is, { line: m.line, diagnostics: [] }); }
    return { ast: { ...p.built.ast, rounds }, diagnostics: p.built.diagnostics };
  }

  /** parseSource (shared/notation/index.ts) with the per-piece cache. */
  function parse(source: string): { ast: PatternAst; diagnostics: Diagnostic[]; order: PieceResult[]; built: Built; sameAst: boolean } {
    const next = new Map<string, PieceResult>();
    // cutAround returns null before it touches anything; past that point it throws,
    // and compile() forgets every cache and compiles afresh.
    const cut = cutAround(source, next) ?? cutAll(source, next);
    pieces = next;
    lastCut = { ...cut, source };
    const { order, stopped } = cut;
    const diagnostics: Diagnostic[] = [...cut.lexDiagnostics];
    const csts: CstNode[] = [];
    const errors: ParseError[] = [];
    for (const r of order) {
      // Round and ladder lines with a built line in the cache never read their CST; everything else does.
      if (r.errors.length || !r.cst || !(r.kind === 'roundLine' ? lines.has(r.cst) : r.kind === 'ladderLine' && ladders.has(r.cst))) settle(r);
      if (r.errors.length) errors.push(...r.errors);
      if (r.cst) csts.push(r.cst);
    }

    diagnostics.push(...parseErrorDiagnostics(source, errors, stopped));
    const prev = previous?.order;
    const sameAst = !!prev && prev.length === order.length && order.every((r, i) => r.cst === prev[i].cst && r.offset === prev[i].offset && r.line === prev[i].line && r.errors === prev[i].errors);
    let built: Built | null;
    if (sameAst) built = previous!.built;
    else if ((built = patchAst(cut, errors.length))) {
      // The memo's lines were kept (patchAst swapped the edited ones).
      stats.patchedAst = true;
    } else {
      const nextLines = new Map<CstNode, LineEntry>();
      const nextLadders = new Map<CstNode, LadderEntry>();
      const memo: RoundLineMemo = {
        get(cst) { const e = lines.get(cst); if (e) nextLines.set(cst, e); return e; },
        set(cst, line, diags) { nextLines.set(cst, { line, diagnostics: diags }); },
        // Renumbered in place too: the line keeps its identity (its source index is mapped by prepare).
        reindex(line, index) {
          (line as { index: number }).index = index;
          return line;
        },
        getLadder(cst) { const e = ladders.get(cst); if (e) nextLadders.set(cst, e); return e; },
        setLadder(cst, ladder, diags) { nextLadders.set(cst, { ladder, diagnostics: diags }); },
      };
      built = buildAst(csts, memo);
      lines = nextLines;
      ladders = nextLadders;
    }
    const ast = { ...built.ast, comments: cut.comments };
    return { ast, diagnostics: [...diagnostics, ...built.diagnostics], order, built, sameAst };
  }

  /**
   * How the previous compile's objects map to this one's, or null when the
   * previous check cannot be resumed: any statement other than a round line
   * changed (header, cast-on, charts and ladders shape every round).
   */
  function prepare(
    prev: Previous, order: PieceResult[], ast: PatternAst, sources: SourceTable, carried: Int32Array | null,
    kept: ReadonlySet<object>, replaced: Map<RoundLine, RoundLine> | null,
  ): ReturnType<Parameters<typeof checkPatternTraced>[3]['prepare']> {
    const others = (o: PieceResult[]) => o.filter((r) => r.kind !== 'roundLine');
    const now = others(order), then = others(prev.order);
    if (now.length !== then.length || now.some((r, i) => !r.reused || r.kind !== then[i].kind)) return null;
    const p = prev.ast;
    if (!pairWalk(p.header, ast.header, pairs) || !pairWalk(p.castOn, ast.castOn, pairs) || !pairWalk(p.charts, ast.charts, pairs) || !pairWalk(p.ladders, ast.ladders, pairs)) return null;
    // Round lines of the previous AST that are not in this one (the edited ones) are gone.
    const dead = new Set<object>();
    for (const l of p.rounds) if (!kept.has(l) && !pairs.has(l)) collect(l, dead);
    const node = <T extends object>(old: T): T | null => {
      const n = pairs.get(old);
      if (n) return n as T;
      return dead.has(old) ? null : old;
    };
    const oldSources = prev.trace.sources;
    // The table carried over says where each old number went; else ask the new table.
    const srcMap = carried ?? new Int32Array(oldSources.spans.length);
    for (let i = 0; !carried && i < srcMap.length; i++) {
      const n = oldSources.nodes[i];
      if (n === null) { srcMap[i] = sources.nodes[i] === null && i < sources.nodes.length ? i : -1; continue; }
      const m = node(n);
      srcMap[i] = (m && sources.indexOf(m)) ?? -1;
    }
    const map: NodeMap = { node, srcMap };
    const firstLineSame = p.rounds.length === 0 ? ast.rounds.length === 0 : node(p.rounds[0]) === (ast.rounds[0] ?? null);
    return {
      resumerFor: (size: string) => {
        const trace = prev.trace.sizes.get(size);
        return trace ? createResumer({ trace, map, firstLineSame, replaced }) : undefined;
      },
    };
  }

  // Where each source table's round lines and operations were numbered from and to (carrySources).
  const numbered = new WeakMap<SourceTable, { start: number; end: number }>();
  // Facts of the long-float reports by size and end span (reportFloats), and the diagnostics made for them (Reporter.made).
  let floatFacts = new Map<string, Map<Span, FloatFacts[]>>();
  const made = new WeakMap<object, Diagnostic>();
  // Each size's records and their summaries, from the last check (a record carried over is the same object at the same place).
  let summarized = new Map<string, { records: RoundRecord[]; rounds: RoundSummary[]; yarns: string }>();
  let nextSummarized = new Map<string, { records: RoundRecord[]; rounds: RoundSummary[]; yarns: string }>();
  const summaries = (size: string, records: RoundRecord[], yarns: string, make: (r: RoundRecord) => RoundSummary): RoundSummary[] => {
    const before = summarized.get(size);
    const same = before && before.yarns === yarns ? before : null;
    const rounds: RoundSummary[] = [];
    // Only the records' identities are compared: the records themselves are not read again.
    for (let i = 0; i < records.length; i++) rounds.push(same && same.records[i] === records[i] ? same.rounds[i] : make(records[i]));
    nextSummarized.set(size, { records, rounds, yarns });
    return rounds;
  };

  return {
    get lastStats() { return { ...stats }; },
    compile(source: string, options: CompileOptions = {}): CompileResult {
      stats.pieces = 0; stats.reusedPieces = 0; stats.reusedCheck = false; stats.reusedRounds = 0; stats.workedRounds = 0; stats.carriedPlans = 0; stats.patchedAst = false;
      taken = new Set();
      pairs = new Map();
      let parsed: ReturnType<typeof parse>;
      try {
        parsed = parse(source);
      } catch {
        // Anything unexpected in the cache path: forget it and compile afresh.
        pieces = new Map(); lines = new Map(); ladders = new Map(); previous = null; lastCut = null;
        return compile(source, options);
      }
      const hadSyntax = parsed.diagnostics.some((d) => d.code === 'LW101' || d.code === 'LW102');
      let checked: CheckOutput;
      let trace: CheckTrace;
      const prev = previous;
      if (prev && parsed.sameAst && prev.size === options.size && prev.hadSyntax === hadSyntax) {
        checked = prev.checked;
        trace = prev.trace;
        stats.reusedCheck = true;
      } else {
        const canResume = prev !== null && prev.size === options.size && prev.hadSyntax === hadSyntax;
        // Round lines of the previous AST replaced by ones that plan alike (the rest kept their identity).
        // The new AST's round lines (kept lines are the previous objects), for replacedLines and prepare.
        const kept = new Set<object>(parsed.ast.rounds);
        const replaced = canResume ? replacedLines(prev.ast, parsed.ast, kept) : null;
        let out;
        const nextFacts = new Map<string, Map<Span, FloatFacts[]>>();
        const facts = (size: string): FloatFactsMemo => {
          let after = nextFacts.get(size);
          if (!after) nextFacts.set(size, (after = new Map()));
          return { before: floatFacts.get(size), after };
        };
        // Where each table's round lines and operations were numbered (carrySources checks the old one's).
        const number = (sources: SourceTable, carry: boolean): Int32Array | null => {
          const from = sources.spans.length;
          const before = prev ? numbered.get(prev.trace.sources) : undefined;
          const carried = carry && canResume && replaced && before ? carrySources(sources, prev.trace.sources, before, replaced) : null;
          numbered.set(sources, { start: from, end: -1 });
          return carried;
        };
        const numberedTo = (sources: SourceTable): void => { const n = numbered.get(sources); if (n) n.end = sources.spans.length; };
        try {
          out = checkPatternTraced(parsed.ast, options.size, hadSyntax, {
            number: (sources) => number(sources, true),
            prepare: (sources, carried) => { numberedTo(sources); return canResume ? prepare(prev, parsed.order, parsed.ast, sources, carried, kept, replaced) : null; },
            summaries, floatFacts: facts, made,
          });
        } catch (e) {
          if (!(e instanceof ResumeMiss)) throw e;
          nextFacts.clear();
          nextSummarized = new Map();
          out = checkPatternTraced(parsed.ast, options.size, hadSyntax, {
            number: (sources) => number(sources, false), prepare: (sources) => { numberedTo(sources); return null; }, summaries, floatFacts: facts, made,
          });
        }
        floatFacts = nextFacts;
        summarized = nextSummarized;
        nextSummarized = new Map();
        checked = out;
        trace = out.trace;
        stats.reusedRounds = out.reusedRounds;
        stats.carriedPlans = out.carriedPlans;
        stats.workedRounds = out.workedRounds;
      }
      previous = { order: parsed.order, built: parsed.built, ast: parsed.ast, size: options.size, hadSyntax, checked, trace };
      const diagnostics = sortDiagnostics([...parsed.diagnostics, ...checked.diagnostics]);
      return { ok: !diagnostics.some((d) => d.severity === 'error'), header: checked.header, diagnostics, sizes: checked.sizes };
    },
  };
}
