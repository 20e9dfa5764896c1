/**
 * Diagnostics introduced and fixed. Two diagnostics are the same finding
 * when code, severity, size and message agree, where the message is
 * compared without line numbers ("line 12" -> "line #") and with every
 * round or row number replaced by its pairing token (see size-diff.ts),
 * so that moving text or inserting a round above does not make old
 * findings look new. Multisets: a finding reported twice before and once
 * after counts as one fixed.
 */
import type { Diagnostic } from '../types';
import type { RoundPairing } from './size-diff';
import type { DiagnosticRef } from './types';

// "round 14", "rows 5-9, 12": the word, then numbers and ranges. Not "chart wave row 3" (a chart row).
const ROUND_REF = /(?<!\bchart \S+ )\b(rounds?|rows?) (\d+(?:-\d+)?(?:, \d+(?:-\d+)?)*)/g;
const LINE_REF = /\blines? \d+(?::\d+)?/g;

/** Token maps per size, plus one for findings without a size (a round paired the same way in every size). */
export interface RoundTokens { bySize: Map<string, RoundPairing>; common: { old: Map<number, string>; new: Map<number, string> } }

/** Builds the maps for findings that name no size: keep a round's token only when every size agrees on it. */
export function commonTokens(pairings: RoundPairing[]): RoundTokens['common'] {
  const merge = (maps: Map<number, string>[]): Map<number, string> => {
    if (maps.length === 0) return new Map();
    const out = new Map(maps[0]);
    for (const m of maps.slice(1)) for (const [k, v] of out) if (m.get(k) !== v) out.delete(k);
    return out;
  };
  return { old: merge(pairings.map((p) => p.oldToken)), new: merge(pairings.map((p) => p.newToken)) };
}

function keyOf(d: Diagnostic, side: 'old' | 'new', tokens: RoundTokens): string {
  const pairing = d.size !== undefined ? tokens.bySize.get(d.size) : undefined;
  const map = pairing ? (side === 'old' ? pairing.oldToken : pairing.newToken) : tokens.common[side];
  const unpaired = side === 'old' ? 'o' : 'n';
  const message = d.message
    .replace(LINE_REF, 'line #')
    .replace(ROUND_REF, (_m, word: string, list: string) => `${word} ${list.replace(/\d+/g, (num) => map.get(Number(num)) ?? `${unpaired}${num}`)}`);
  return `${d.code}|${d.severity}|${d.size ?? ''}|${message}`;
}

function ref(d: Diagnostic): DiagnosticRef {
  return {
    code: d.code, severity: d.severity, size: d.size ?? null, message: d.message,
    line: d.span.line, column: d.span.column, endLine: d.span.endLine, endColumn: d.span.endColumn,
  };
}

/** Findings only in `next` (introduced) and only in `prev` (fixed), each in its revision's order. */
export function diffDiagnostics(prev: Diagnostic[], next: Diagnostic[], tokens: RoundTokens): { introduced: DiagnosticRef[]; fixed: DiagnosticRef[]; unchanged: number } {
  const left = new Map<string, number>();
  for (const d of prev) { const k = keyOf(d, 'old', tokens); left.set(k, (left.get(k) ?? 0) + 1); }
  const introduced: DiagnosticRef[] = [];
  let unchanged = 0;
  for (const d of next) {
    const k = keyOf(d, 'new', tokens);
    const n = left.get(k) ?? 0;
    if (n > 0) { left.set(k, n - 1); unchanged++; } else introduced.push(ref(d));
  }
  // Fixed: the earliest occurrences of a key are the ones still matched, mirroring the loop above.
  const fixed: DiagnosticRef[] = [];
  const seen = new Map<string, number>();
  const total = new Map<string, number>();
  for (const d of next) { const k = keyOf(d, 'new', tokens); total.set(k, (total.get(k) ?? 0) + 1); }
  for (const d of prev) {
    const k = keyOf(d, 'old', tokens);
    const s = (seen.get(k) ?? 0) + 1;
    seen.set(k, s);
    if (s > (total.get(k) ?? 0)) fixed.push(ref(d));
  }
  return { introduced, fixed, unchanged };
}
