/**
 * Quick fixes: concrete edits offered for a diagnostic.
 *
 * A fix comes from the compiler in one of two forms:
 * - explicit edits on the diagnostic (`fixes: [{label, from, to, insert}]`,
 *   an additive field of the diagnostic shape), used as given;
 * - a hint that is nothing but one exact replacement word ("did you mean
 *   B?", "write rows", "use `k2tog`"): the fix replaces the diagnostic's
 *   span with it.
 * Anything vaguer (advice, a choice between several edits) offers no fix.
 */
import type { Diagnostic } from '../../shared';

/** One edit a person can apply with a click. Offsets refer to the compiled source. */
export interface QuickFix {
  label: string;
  from: number;
  to: number;
  insert: string;
}

interface ExplicitFix { label?: unknown; from?: unknown; to?: unknown; insert?: unknown }

/** A hint that is exactly one replacement: "did you mean B?", "write rows", "use `k2tog`". */
const replacementPattern = /^(?:did you mean|write|use|replace (?:it )?with|change (?:it )?to)\s+[`'"“‘]?([^\s`'"”’?]{1,80})[`'"”’]?\s*\??$/i;

/** The fixes for `d` against `source` (empty when none is concrete). */
export function quickFixesFor(d: Diagnostic, source: string): QuickFix[] {
  const explicit = (d as Diagnostic & { fixes?: ExplicitFix[] }).fixes;
  if (Array.isArray(explicit)) {
    return explicit
      .filter((f) => typeof f.from === 'number' && typeof f.to === 'number' && typeof f.insert === 'string')
      .filter((f) => (f.from as number) >= 0 && (f.to as number) <= source.length && (f.from as number) <= (f.to as number))
      .map((f) => ({
        label: typeof f.label === 'string' ? f.label : `Replace with “${f.insert as string}”`,
        from: f.from as number,
        to: f.to as number,
        insert: f.insert as string,
      }));
  }
  if (!d.hint) return [];
  const m = replacementPattern.exec(d.hint);
  if (!m) return [];
  const insert = m[1];
  const { from, to } = d.span;
  if (to <= from || to > source.length) return [];
  const current = source.slice(from, to);
  // Only a word-for-word swap: the flagged text is one word and so is the
  // suggestion ("write round/rounds" offers a choice, so it is advice).
  if (current === insert || !/^[\w-]+$/.test(current) || !/^[\w-]+$/.test(insert)) return [];
  return [{ label: `Replace “${current}” with “${insert}”`, from, to, insert }];
}
