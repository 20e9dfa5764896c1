/**
 * Completion for Loopwright sources: stitch names and keywords from the
 * compiler's own tables (sent by the compile worker, see
 * {@link setVocabulary}), and the yarn, chart, segment and marker names the
 * document already uses (the lexer's `yarn` and `name` tokens).
 */
import { autocompletion, type Completion, type CompletionContext, type CompletionResult } from '@codemirror/autocomplete';
import { compiledField } from './compile-state';
import { currentTokens } from './highlight';

let stitchOptions: Completion[] = [];
let keywordOptions: Completion[] = [];

/** Install the compiler's stitch words and keywords (the same for every editor). */
export function setVocabulary(stitches: readonly string[], keywords: readonly string[]): void {
  stitchOptions = [...new Set(stitches)].filter((s) => /^[A-Za-z]/.test(s)).map((label) => ({ label, type: 'function', detail: 'stitch', boost: 2 }));
  keywordOptions = [...new Set(keywords)].map((label) => ({ label, type: 'keyword', boost: 1 }));
}

/** Completion source: the word at the cursor, with the document's own names first. */
export function loopCompletions(context: CompletionContext): CompletionResult | null {
  const word = context.matchBefore(/[A-Za-z_][A-Za-z0-9_-]*/);
  if (!word && !context.explicit) return null;
  const from = word ? word.from : context.pos;
  const tokens = currentTokens(context.state);
  // Inside a comment or quoted text there is nothing to complete.
  const here = tokens.find((t) => t.from < context.pos && context.pos <= t.to);
  if (here && (here.kind === 'comment' || here.kind === 'string')) return null;

  const doc = context.state.doc;
  const names = new Map<string, Completion>();
  const compiled = context.state.field(compiledField, false);
  for (const y of compiled?.header.yarns ?? []) {
    names.set(y.name, { label: y.name, type: 'variable', detail: `yarn · ${y.label}`, boost: 3 });
  }
  for (const t of tokens) {
    if (t.kind !== 'yarn' && t.kind !== 'name') continue;
    if (word && t.from === word.from) continue; // the word being typed
    const text = doc.sliceString(t.from, t.to);
    if (!/^[A-Za-z_][A-Za-z0-9_-]*$/.test(text) || names.has(text)) continue;
    names.set(text, { label: text, type: t.kind === 'yarn' ? 'variable' : 'constant', detail: t.kind === 'yarn' ? 'yarn' : 'name', boost: 3 });
  }
  return {
    from,
    options: [...names.values(), ...stitchOptions, ...keywordOptions],
    validFor: /^[A-Za-z0-9_-]*$/,
  };
}

/** The completion extension. */
export const loopCompletion = autocompletion({ override: [loopCompletions], activateOnTyping: true, icons: false });
