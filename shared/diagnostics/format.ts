/**
 * The one diagnostic formatter: facts in, {@link Diagnostic} out, and a
 * plain-text rendering for the command line.
 */
import type { Diagnostic, Span } from '../types';
import { CODES, type Facts } from './codes';

/**
 * Builds a diagnostic from its code and facts. The severity comes from the
 * catalogue unless overridden. Throws only for an unknown code (a programmer
 * error).
 */
export function makeDiagnostic(
  code: string,
  span: Span,
  facts: Facts = {},
  extra: { size?: string; related?: { span: Span; message: string }[] } = {},
): Diagnostic {
  const info = CODES.get(code);
  if (!info) throw new Error(`unknown diagnostic code ${code}`);
  const d: Diagnostic = { code, severity: info.severity, span, message: info.message(facts) };
  if (extra.size !== undefined) d.size = extra.size;
  const hint = info.hint?.(facts);
  if (hint) d.hint = hint;
  if (extra.related?.length) d.related = extra.related;
  return d;
}

/** "file:12:5 error LW301 message\n  hint: ..." for terminals and logs. */
export function formatDiagnosticText(d: Diagnostic, file = ''): string {
  const head = `${file ? `${file}:` : ''}${d.span.line}:${d.span.column} ${d.severity} ${d.code} ${d.message}`;
  const lines = [head];
  if (d.hint) lines.push(`  hint: ${d.hint}`);
  for (const r of d.related ?? []) lines.push(`  ${r.span.line}:${r.span.column} ${r.message}`);
  return lines.join('\n');
}

/** Orders diagnostics by position, then code (stable, for deterministic output). */
export function sortDiagnostics(list: Diagnostic[]): Diagnostic[] {
  return list
    .map((d, i) => ({ d, i }))
    .sort((a, b) => a.d.span.from - b.d.span.from || a.d.span.to - b.d.span.to || (a.d.code < b.d.code ? -1 : a.d.code > b.d.code ? 1 : 0) || a.i - b.i)
    .map((x) => x.d);
}

/** Edit distance for "did you mean" hints (small strings only). */
export function closestName(name: string, known: Iterable<string>): string | undefined {
  let best: string | undefined;
  let bestD = Infinity;
  for (const k of known) {
    const d = distance(name.toLowerCase(), k.toLowerCase());
    if (d < bestD) { bestD = d; best = k; }
  }
  // Close enough to be a slip (a swap of two letters counts 2), and not a different short name altogether.
  return bestD <= Math.max(2, Math.floor(name.length / 3)) && bestD < name.length ? best : undefined;
}

function distance(a: string, b: string): number {
  if (a.length > 64 || b.length > 64) return Infinity;
  let prev = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    const cur = [i];
    for (let j = 1; j <= b.length; j++) cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + (a[i - 1] === b[j - 1] ? 0 : 1));
    prev = cur;
  }
  return prev[b.length];
}
