/**
 * Syntax colouring for Loopwright sources, straight from the compiler's own
 * lexer (`highlightTokens` in shared/, run in the compile worker), so the
 * editor and the compiler never disagree about what a word is.
 *
 * Tokens arrive a moment after each edit; until then the previous colours
 * are mapped through the edit, so nothing flickers.
 */
import { RangeSetBuilder, StateEffect, StateField, type EditorState } from '@codemirror/state';
import { Decoration, EditorView, WidgetType, type DecorationSet } from '@codemirror/view';
import type { HighlightToken, TokensMessage } from './protocol';

const kinds: HighlightToken['kind'][] = ['keyword', 'stitch', 'number', 'comment', 'string', 'yarn', 'colour', 'name', 'punctuation', 'invalid'];
const marks = new Map(kinds.map((k) => [k, Decoration.mark({ class: `lw-${k}` })]));

/** Tokens sorted and clipped to `length` so decorations never overlap. */
export function normalizeTokens(tokens: readonly HighlightToken[], length: number): HighlightToken[] {
  const sorted = [...tokens].sort((a, b) => a.from - b.from || a.to - b.to);
  const out: HighlightToken[] = [];
  let end = 0;
  for (const t of sorted) {
    const from = Math.max(t.from, end);
    const to = Math.min(t.to, length);
    if (to > from) {
      out.push(from === t.from && to === t.to ? t : { ...t, from, to });
      end = to;
    }
  }
  return out;
}

/** Effect carrying the tokens of the current text. */
export const setTokens = StateEffect.define<HighlightToken[]>();

interface TokenState { tokens: HighlightToken[]; decorations: DecorationSet; fresh: boolean }

/** A small square of a yarn's colour shown before its #rrggbb (decorative). */
class Swatch extends WidgetType {
  constructor(readonly colour: string) { super(); }
  override eq(other: Swatch) { return other.colour === this.colour; }
  override toDOM() {
    const el = document.createElement('span');
    el.className = 'lw-swatch';
    el.style.backgroundColor = this.colour;
    el.setAttribute('aria-hidden', 'true');
    return el;
  }
}

function build(tokens: HighlightToken[], doc: EditorState['doc']): DecorationSet {
  const builder = new RangeSetBuilder<Decoration>();
  for (const t of tokens) {
    if (t.kind === 'colour') {
      const colour = doc.sliceString(t.from, t.to);
      if (/^#[0-9a-fA-F]{6}$/.test(colour)) builder.add(t.from, t.from, Decoration.widget({ widget: new Swatch(colour), side: -1 }));
    }
    builder.add(t.from, t.to, marks.get(t.kind)!);
  }
  return builder.finish();
}

/** Tokens and their decorations; `fresh` is false between an edit and its tokens. */
export const tokenField = StateField.define<TokenState>({
  create: () => ({ tokens: [], decorations: Decoration.none, fresh: false }),
  update(value, tr) {
    for (const e of tr.effects) {
      if (e.is(setTokens)) {
        const tokens = normalizeTokens(e.value, tr.state.doc.length);
        return { tokens, decorations: build(tokens, tr.state.doc), fresh: true };
      }
    }
    if (!tr.docChanged) return value;
    // Keep approximate tokens (for completion) until the worker's arrive.
    const tokens: HighlightToken[] = [];
    for (const t of value.tokens) {
      const from = tr.changes.mapPos(t.from, 1);
      const to = tr.changes.mapPos(t.to, -1);
      if (to > from) tokens.push({ from, to, kind: t.kind });
    }
    return { tokens, decorations: value.decorations.map(tr.changes), fresh: false };
  },
  provide: (f) => EditorView.decorations.from(f, (v) => v.decorations),
});

/** The highlighting extension. */
export const loopHighlighting = tokenField;

/** Apply a worker's tokens if they belong to the editor's current text. */
export function pushTokens(view: EditorView, m: TokensMessage): void {
  const doc = view.state.doc;
  if (doc.length !== m.source.length || doc.toString() !== m.source) return;
  view.dispatch({ effects: setTokens.of(m.tokens) });
}

/** The tokens of the current text (right after an edit: the previous ones, mapped through it). */
export function currentTokens(state: EditorState): HighlightToken[] {
  return state.field(tokenField, false)?.tokens ?? [];
}
