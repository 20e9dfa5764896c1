/**
 * Syntax colouring for Loopwright sources, straight from the compiler's own
 * lexer (`highlightTokens` in shared/), so the editor and the compiler can
 * never disagree about what a word is.
 *
 * The whole text is re-lexed on each change (the lexer is linear and fast),
 * but decorations are built only for the visible ranges.
 */
import { RangeSetBuilder } from '@codemirror/state';
import { Decoration, EditorView, ViewPlugin, type DecorationSet, type ViewUpdate } from '@codemirror/view';
import { highlightTokens } from '../../shared';

/** One coloured token: offsets into the document, `to` exclusive. */
export type HighlightToken = ReturnType<typeof highlightTokens>[number];
/** The closed set of token kinds the lexer reports. */
export type TokenKind = HighlightToken['kind'];

const kinds: TokenKind[] = ['keyword', 'stitch', 'number', 'comment', 'string', 'yarn', 'colour', 'name', 'punctuation', 'invalid'];
const marks = new Map(kinds.map((k) => [k, Decoration.mark({ class: `lw-${k}` })]));

/** Tokens of `text`, sorted and clipped so decorations never overlap. */
export function tokensOf(text: string): HighlightToken[] {
  let tokens: HighlightToken[];
  try {
    tokens = highlightTokens(text);
  } catch {
    return []; // colouring is a nicety; never let it break editing
  }
  const sorted = [...tokens].sort((a, b) => a.from - b.from || a.to - b.to);
  const out: HighlightToken[] = [];
  let end = 0;
  for (const t of sorted) {
    const from = Math.max(t.from, end);
    const to = Math.min(t.to, text.length);
    if (to > from) {
      out.push(from === t.from && to === t.to ? t : { ...t, from, to });
      end = to;
    }
  }
  return out;
}

/** Index of the first token ending after `pos` (binary search). */
function firstAfter(tokens: HighlightToken[], pos: number): number {
  let lo = 0;
  let hi = tokens.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (tokens[mid].to <= pos) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

class LoopHighlighter {
  tokens: HighlightToken[];
  decorations: DecorationSet;

  constructor(view: EditorView) {
    this.tokens = tokensOf(view.state.doc.toString());
    this.decorations = this.build(view);
  }

  update(u: ViewUpdate): void {
    if (u.docChanged) this.tokens = tokensOf(u.state.doc.toString());
    if (u.docChanged || u.viewportChanged) this.decorations = this.build(u.view);
  }

  build(view: EditorView): DecorationSet {
    const builder = new RangeSetBuilder<Decoration>();
    for (const range of view.visibleRanges) {
      for (let i = firstAfter(this.tokens, range.from); i < this.tokens.length; i++) {
        const t = this.tokens[i];
        if (t.from >= range.to) break;
        const mark = marks.get(t.kind);
        if (mark) builder.add(t.from, t.to, mark);
      }
    }
    return builder.finish();
  }
}

/** The highlighting extension. */
export const loopHighlighting = ViewPlugin.fromClass(LoopHighlighter, { decorations: (p) => p.decorations });

/** The tokens the highlighter holds for `view` (for completion), or an empty list. */
export function currentTokens(view: EditorView): HighlightToken[] {
  return view.plugin(loopHighlighting)?.tokens ?? [];
}
