/**
 * CST -> AST (stage 3 of 3). Walks the parser's CST defensively (error
 * recovery can leave nodes partial) and builds the AST of ast.ts, keeping a
 * span on every node. Problems found here (a count that is not a whole
 * number, an unknown stitch combination) become diagnostics; nothing throws.
 */
import type { CstNode, IToken } from 'chevrotain';
import type { Diagnostic, Span } from '../types';
import { makeDiagnostic } from '../diagnostics';
import { resolveStitch, STITCH_WORDS } from './stitches';
import { TRACED } from '../check/context';
import type { ChartBlock, ChartKey, Graded, HeaderAst, LadderLine, NameRef, Op, PatternAst, Repeat, RoundLine, ToSpec } from './ast';

type Element = CstNode | IToken;
const isToken = (e: Element): e is IToken => (e as IToken).image !== undefined;
const real = (t: IToken) => !Number.isNaN(t.startOffset) && !t.isInsertedInRecovery;

function toks(n: CstNode | undefined, key: string): IToken[] {
  return ((n?.children[key] ?? []) as Element[]).filter((e): e is IToken => isToken(e) && real(e));
}
function tok(n: CstNode | undefined, key: string): IToken | undefined {
  return toks(n, key)[0];
}
function sub(n: CstNode | undefined, key: string): CstNode[] {
  return ((n?.children[key] ?? []) as Element[]).filter((e): e is CstNode => !isToken(e));
}

/** The span of one token (end exclusive). */
export function tokenSpan(t: IToken): Span {
  return {
    from: t.startOffset,
    to: (t.endOffset ?? t.startOffset) + 1,
    line: t.startLine ?? 1,
    column: t.startColumn ?? 1,
    endLine: t.endLine ?? t.startLine ?? 1,
    endColumn: (t.endColumn ?? t.startColumn ?? 1) + 1,
  };
}
/** The smallest span covering a and b. */
export function joinSpans(a: Span, b: Span): Span {
  const first = a.from <= b.from ? a : b;
  const last = a.to >= b.to ? a : b;
  return { from: first.from, to: last.to, line: first.line, column: first.column, endLine: last.endLine, endColumn: last.endColumn };
}
function collect(n: CstNode, out: IToken[]): void {
  for (const list of Object.values(n.children)) {
    for (const e of list as Element[]) {
      if (isToken(e)) { if (real(e)) out.push(e); } else collect(e, out);
    }
  }
}
/** The span of everything under a CST node, or null when recovery left it empty. */
function nodeSpan(n: CstNode | undefined): Span | null {
  if (!n) return null;
  // The parser tracks node locations; recovery can leave them unset (NaN), then walk the tokens.
  const loc = n.location;
  if (loc && Number.isFinite(loc.startOffset) && Number.isFinite(loc.endOffset) && Number.isFinite(loc.startLine) && Number.isFinite(loc.endLine)) {
    return { from: loc.startOffset, to: loc.endOffset! + 1, line: loc.startLine!, column: loc.startColumn!, endLine: loc.endLine!, endColumn: loc.endColumn! + 1 };
  }
  const all: IToken[] = [];
  collect(n, all);
  if (all.length === 0) return null;
  let lo = all[0], hi = all[0];
  for (const t of all) {
    if (t.startOffset < lo.startOffset) lo = t;
    if (t.startOffset > hi.startOffset) hi = t;
  }
  return joinSpans(tokenSpan(lo), tokenSpan(hi));
}

const stitchSplit = new RegExp(`^(${STITCH_WORDS.join('|')})(\\d*)$`, 'i');
const unquote = (t: IToken) => t.image.slice(1, -1);

/**
 * A cache of round lines by their statement's CST, for the incremental
 * compiler: a round line depends only on its own statement and its place
 * among the round lines (`index`).
 */
export interface RoundLineMemo {
  get(cst: CstNode): { line: RoundLine; diagnostics: Diagnostic[] } | undefined;
  set(cst: CstNode, line: RoundLine, diagnostics: Diagnostic[]): void;
  /** The cached line at another index. */
  reindex(line: RoundLine, index: number): RoundLine;
  /** Ladder lines likewise (a ladder line depends only on its own statement; null: incomplete, not in the AST). */
  getLadder(cst: CstNode): { ladder: LadderLine | null; diagnostics: Diagnostic[] } | undefined;
  setLadder(cst: CstNode, ladder: LadderLine | null, diagnostics: Diagnostic[]): void;
}

/** Builds the AST from parsed statements; returns it with the diagnostics found on the way. */
export function buildAst(statements: readonly CstNode[], memo?: RoundLineMemo): { ast: PatternAst; diagnostics: Diagnostic[] } {
  const diagnostics: Diagnostic[] = [];
  const header: HeaderAst = { title: null, designer: null, item: null, sizes: null, sizesSpan: null, gauge: null, yarns: [], construction: null, floatLimit: null };
  const ast: PatternAst = { header, castOn: null, rounds: [], charts: [], ladders: [], comments: [] };
  const twice = (what: string, name: string, span: Span) => diagnostics.push(makeDiagnostic('LW206', span, { what, name }));

  const number = (t: IToken | undefined, what: string, whole: boolean): number | null => {
    if (!t) return null;
    const v = Number(t.image);
    if (whole && !Number.isInteger(v)) {
      diagnostics.push(makeDiagnostic('LW103', tokenSpan(t), { what, need: 'a whole number', value: t.image }));
      return Math.round(v);
    }
    return v;
  };
  const graded = (n: CstNode | undefined, what = 'a count'): Graded | null => {
    if (!n) return null;
    const values = toks(n, 'NumberLit').map((t) => number(t, what, true) ?? 0);
    const span = nodeSpan(n);
    return values.length && span ? { values, span } : null;
  };
  const name = (t: IToken | undefined): NameRef | null => (t ? { name: t.image, span: tokenSpan(t) } : null);
  const inYarn = (n: CstNode | undefined): NameRef | null => name(tok(sub(n, 'inYarn')[0], 'Name'));

  const toSpec = (n: CstNode | undefined): ToSpec | null => {
    if (!n) return null;
    if (tok(n, 'End')) return { kind: 'end' };
    if (tok(n, 'Last')) {
      const g = graded(sub(n, 'graded')[0]);
      return g ? { kind: 'last', n: g } : null;
    }
    if (tok(n, 'Marker')) return { kind: 'marker', name: name(tok(n, 'Name')) };
    return null;
  };

  const stitchOp = (n: CstNode, span: Span): Op | null => {
    const st = tok(n, 'Stitch');
    if (!st) return null;
    const m = stitchSplit.exec(st.image);
    const word = m ? m[1] : st.image;
    const suffix = m && m[2] ? Number(m[2]) : null;
    const mods = toks(n, 'Modifier');
    const info = resolveStitch(word, mods[0]?.image ?? null);
    if (!info || mods.length > 1) {
      diagnostics.push(makeDiagnostic('LW104', span, { text: [word, ...mods.map((x) => x.image)].join(' '), hint: 'tbl goes with k or p; wyif and wyib go with sl' }));
      return null;
    }
    let count: Graded | null = suffix !== null ? { values: [suffix], span: tokenSpan(st) } : null;
    let to: ToSpec | null = null;
    const amount = sub(n, 'amount')[0];
    if (amount) {
      const g = graded(sub(amount, 'graded')[0]);
      const t = toSpec(sub(amount, 'toSpec')[0]);
      if (count && (g || t)) {
        diagnostics.push(makeDiagnostic('LW102', span, { detail: `the count of ${st.image} is given twice`, hint: `write ${word} 5 or ${word}5, not both` }));
      } else {
        count = g ?? count;
        to = t;
      }
    }
    if (info.kind === 'cast-on' || info.kind === 'bind-off') {
      if (to) diagnostics.push(makeDiagnostic('LW102', span, { detail: `${word} takes a number of stitches, not "to ..."`, hint: `write ${word} 6` }));
      to = null;
    }
    return { type: 'stitch', stitch: info, count, to, yarn: inYarn(n), span };
  };

  const op = (n: CstNode): Op | null => {
    const [kind, inner] = Object.entries(n.children)[0] ?? [];
    const node = (inner as Element[] | undefined)?.[0];
    if (!kind || !node || isToken(node)) return null;
    const span = nodeSpan(node);
    if (!span) return null;
    switch (kind) {
      case 'stitchOp': return stitchOp(node, span);
      case 'group': {
        const ops = opList(sub(node, 'opList')[0]);
        let repeat: Repeat = { kind: 'once' };
        const times = graded(sub(node, 'graded')[0]);
        const to = toSpec(sub(node, 'toSpec')[0]);
        if (times) repeat = { kind: 'times', n: times };
        else if (to) repeat = to;
        return { type: 'group', ops, repeat, yarn: inYarn(node), span };
      }
      case 'chartOp': {
        const chart = name(tok(node, 'Name'));
        return chart ? { type: 'chart', chart, row: graded(sub(node, 'graded')[0], 'a chart row'), once: !!tok(node, 'Once'), span } : null;
      }
      case 'markOp': case 'unmarkOp': {
        const nm = name(tok(node, 'Name'));
        return nm ? { type: kind === 'markOp' ? 'mark' : 'unmark', name: nm, span } : null;
      }
      // sm: markers are slipped automatically; the word is accepted for the trade's habit and adds nothing.
      case 'slipMarkerOp': return null;
      case 'catchOp': case 'raiseOp': {
        const y = name(tok(node, 'Name'));
        return y ? { type: kind === 'catchOp' ? 'catch' : 'raise', yarn: y, span } : null;
      }
      case 'carryOp': return { type: 'carry', count: graded(sub(node, 'graded')[0]), span };
      case 'closeOp': {
        const how = tok(node, 'Stitch')?.image.toLowerCase() ?? 'k2tog';
        if (how !== 'k2tog' && how !== 'ssk') {
          diagnostics.push(makeDiagnostic('LW104', span, { text: `close ${how}`, hint: 'a backing stitch closes with k2tog or ssk' }));
          return null;
        }
        return { type: 'close', how, span };
      }
      case 'cableOp': {
        const held = number(tok(node, 'held'), 'a cable count', true) ?? 0;
        const worked = number(tok(node, 'worked'), 'a cable count', true) ?? 0;
        if (held < 1 || worked < 1) {
          diagnostics.push(makeDiagnostic('LW103', span, { what: 'each side of a cable', need: 'at least 1 stitch', value: `${held} over ${worked}` }));
          return null;
        }
        return { type: 'cable', held, worked, dir: tok(node, 'Left') ? 'left' : 'right', yarn: inYarn(node), span };
      }
      default: return null;
    }
  };
  const opList = (n: CstNode | undefined): Op[] => sub(n, 'op').map(op).filter((o): o is Op => o !== null);

  const chartBlock = (n: CstNode, span: Span): ChartBlock | null => {
    const nm = name(tok(n, 'Name'));
    if (!nm) return null;
    const keys: ChartKey[] = [];
    for (const k of sub(n, 'keyLine')) {
      const text = tok(k, 'Text');
      const kspan = nodeSpan(k);
      if (!text || !kspan) continue;
      const chars = Array.from(unquote(text));
      if (chars.length !== 1 || chars[0] === ' ' || chars[0] === '|') {
        diagnostics.push(makeDiagnostic('LW210', tokenSpan(text), { detail: `a chart key is one character (not a space or '|'), not ${text.image}` }));
        continue;
      }
      if (tok(k, 'None')) { keys.push({ char: chars[0], yarn: null, stitch: null, none: true, span: kspan }); continue; }
      const st = tok(k, 'Stitch');
      const stitch = st ? resolveStitch(st.image, tok(k, 'Modifier')?.image ?? null) : null;
      if (st && (!stitch || !['plain', 'increase', 'decrease', 'cable'].includes(stitch.kind))) {
        diagnostics.push(makeDiagnostic('LW104', tokenSpan(st), { text: st.image, hint: 'a chart key uses a stitch without a count (k, p, k2tog, yo, ...)' }));
        continue;
      }
      keys.push({ char: chars[0], yarn: name(tok(k, 'Name')), stitch: stitch ?? null, none: false, span: kspan });
    }
    const rows = toks(n, 'GridRow').map((t) => ({ cells: Array.from(t.image.slice(1, -1)).filter((c) => c !== ' ' && c !== '\t'), span: tokenSpan(t) }));
    return { name: nm, keys, rows, span };
  };

  const ladderLine = (n: CstNode, span: Span): LadderLine | null => {
    const yarn = name(tok(n, 'yarn'));
    const first = graded(sub(n, 'first')[0], 'a round number');
    const last = graded(sub(n, 'last')[0], 'a round number');
    if (!yarn || !first || !last) return null;
    const how = tok(n, 'Stitch')?.image.toLowerCase() ?? 'k2tog';
    if (how !== 'k2tog' && how !== 'ssk') {
      diagnostics.push(makeDiagnostic('LW104', span, { text: `close ${how}`, hint: 'a backing stitch closes with k2tog or ssk' }));
    }
    return {
      yarn, first, last, span,
      every: graded(sub(n, 'every')[0]),
      columns: sub(n, 'column').map((c) => graded(c)).filter((g): g is Graded => g !== null),
      segment: name(tok(n, 'segment')),
      close: how === 'ssk' ? 'ssk' : 'k2tog',
    };
  };

  for (const st of statements) {
    // `TRACED &&`: the studio's build has no incremental compiler, and drops the memo's branches.
    if (TRACED && memo && st.children.roundLine) {
      const hit = memo.get(st);
      if (hit) {
        ast.rounds.push(hit.line.index === ast.rounds.length ? hit.line : memo.reindex(hit.line, ast.rounds.length));
        diagnostics.push(...hit.diagnostics);
        continue;
      }
    }
    if (TRACED && memo && st.children.ladderLine) {
      const hit = memo.getLadder(st);
      if (hit) {
        if (hit.ladder) ast.ladders.push(hit.ladder);
        diagnostics.push(...hit.diagnostics);
        continue;
      }
    }
    const [kind, inner] = Object.entries(st.children)[0] ?? [];
    const n = (inner as Element[] | undefined)?.[0];
    if (!kind || !n || isToken(n)) continue;
    const span = nodeSpan(n);
    if (!span) continue;
    switch (kind) {
      case 'titleLine': case 'designerLine': {
        const t = tok(n, 'Text');
        if (!t) break;
        const key = kind === 'titleLine' ? 'title' : 'designer';
        if (header[key]) twice('the', key, span);
        header[key] = { value: unquote(t).trim(), span };
        break;
      }
      case 'itemLine': {
        const t = toks(n, 'item')[0];
        if (!t) break;
        if (header.item) twice('the', 'item', span);
        header.item = { word: t.image, span: tokenSpan(t) };
        break;
      }
      case 'sizesLine': {
        if (header.sizes) twice('the list of', 'sizes', span);
        const sizes = toks(n, 'size').map((t) => ({ name: t.tokenType.name === 'Text' ? unquote(t) : t.image, span: tokenSpan(t) }));
        const seen = new Set<string>();
        for (const s of sizes) { if (seen.has(s.name)) twice('size', s.name, s.span); seen.add(s.name); }
        header.sizes = sizes.filter((s, i) => sizes.findIndex((x) => x.name === s.name) === i);
        header.sizesSpan = span;
        break;
      }
      case 'gaugeLine': {
        const stitches = number(tok(n, 'stitches'), 'a gauge', false);
        const rows = number(tok(n, 'rows'), 'a gauge', false);
        const length = number(tok(n, 'length'), 'a gauge length', false);
        const unit = tok(sub(n, 'unit')[0], 'Cm') ? 'cm' : 'in';
        if (stitches !== null && rows !== null && length !== null) header.gauge = { stitches, rows, length, unit, span };
        break;
      }
      case 'yarnLine': {
        const nm = name(tok(n, 'Name'));
        const label = tok(n, 'Text');
        const colour = tok(n, 'Colour');
        if (!nm || !label || !colour) break;
        if (header.yarns.some((y) => y.name.name === nm.name)) { twice('yarn', nm.name, nm.span); break; }
        header.yarns.push({ name: nm, label: unquote(label), colour: colour.image.toLowerCase(), colourSpan: tokenSpan(colour), span });
        break;
      }
      case 'workLine':
        header.construction = { value: tok(n, 'Flat') ? 'flat' : 'round', span };
        break;
      case 'floatLine': {
        const v = number(tok(n, 'NumberLit'), 'a float limit', false);
        if (v !== null) header.floatLimit = { value: v, unit: tok(sub(n, 'unit')[0], 'Cm') ? 'cm' : 'in', span };
        break;
      }
      case 'castOnLine': {
        const count = graded(sub(n, 'graded')[0], 'a cast-on count');
        if (!count) break;
        if (ast.castOn) twice('the', 'cast on', span);
        ast.castOn = { count, yarn: inYarn(n), span };
        break;
      }
      case 'roundLine': {
        const before = diagnostics.length;
        const first = graded(sub(n, 'first')[0], 'a round number');
        const colon = tok(n, 'Colon');
        if (!first || !colon) break;
        const wordTok = toks(n, 'word')[0];
        const ord = tok(n, 'Ordinal');
        let every: number | null = tok(n, 'Other') ? 2 : null;
        if (ord) {
          every = Number.parseInt(ord.image, 10);
          if (!(every >= 1)) { diagnostics.push(makeDiagnostic('LW103', tokenSpan(ord), { what: '"every"', need: 'at least 1st', value: ord.image })); every = null; }
        }
        const note = tok(n, 'Text');
        const line: RoundLine = {
          index: ast.rounds.length,
          word: /^rows?$/i.test(wordTok?.image ?? '') ? 'row' : 'round',
          first, last: graded(sub(n, 'last')[0], 'a round number'), every,
          segment: name(tok(n, 'segment')), yarn: inYarn(n),
          ops: opList(sub(n, 'opList')[0]), note: note ? unquote(note) : null, span,
          headSpan: joinSpans(tokenSpan(wordTok ?? colon), tokenSpan(colon)),
        };
        ast.rounds.push(line);
        if (TRACED && memo) memo.set(st, line, diagnostics.slice(before));
        break;
      }
      case 'chartBlock': {
        const c = chartBlock(n, span);
        if (c) {
          if (ast.charts.some((x) => x.name.name === c.name.name)) twice('chart', c.name.name, c.name.span);
          else ast.charts.push(c);
        }
        break;
      }
      case 'ladderLine': {
        const before = diagnostics.length;
        const l = ladderLine(n, span);
        if (l) ast.ladders.push(l);
        if (TRACED && memo) memo.setLadder(st, l, diagnostics.slice(before));
        break;
      }
    }
  }
  return { ast, diagnostics };
}
