/**
 * The newest compile answer, held in the editor state so hover and other
 * extensions can read it. Set by the workspace with {@link setCompiled}.
 */
import { StateEffect, StateField } from '@codemirror/state';
import type { CompiledView } from './protocol';

/** Effect carrying a new compile answer. */
export const setCompiled = StateEffect.define<CompiledView>();

/** The latest compile answer (null until the first arrives). */
export const compiledField = StateField.define<CompiledView | null>({
  create: () => null,
  update(value, tr) {
    for (const e of tr.effects) if (e.is(setCompiled)) return e.value;
    return value;
  },
});
