/**
 * Read-only helpers over a compile answer: which rounds a source line
 * made, the float limit in stitches, and which rounds have problems.
 */
import type { Diagnostic, PatternHeader, RoundSummary } from '../../shared';
import type { CompiledView } from './protocol';

/** Rounds of one size made by a source line (several for a range of rounds). */
export interface SizeRounds {
  size: string;
  rounds: RoundSummary[];
}

/** For each size, the rounds whose span covers 1-based `line` (sizes with none are left out). */
export function roundsOnLine(view: CompiledView, line: number): SizeRounds[] {
  const out: SizeRounds[] = [];
  for (const s of view.sizes) {
    const rounds = s.rounds.filter((r) => r.span.line <= line && line <= Math.max(r.span.line, r.span.endLine));
    if (rounds.length) out.push({ size: s.name, rounds });
  }
  return out;
}

/** 1 in = 2.54 cm exactly (international inch). */
const CM_PER_IN = 2.54;

/**
 * The float limit in stitches at the declared gauge (a float longer than
 * this is too long), or null without a gauge. Gauge "per 4in" is over
 * 4 inches, "per 10cm" over 10 cm.
 */
export function floatLimitStitches(header: PatternHeader): number | null {
  const g = header.gauge;
  if (!g || g.stitches <= 0) return null;
  const perCm = g.per === '4in' ? g.stitches / (4 * CM_PER_IN) : g.stitches / 10;
  const limitCm = header.floatLimit.unit === 'cm' ? header.floatLimit.value : header.floatLimit.value * CM_PER_IN;
  return limitCm * perCm;
}

/** A float's length in the limit's unit, rounded to 0.1 (null without a gauge). */
export function floatLength(header: PatternHeader, stitches: number): string | null {
  const g = header.gauge;
  if (!g || g.stitches <= 0) return null;
  const perCm = g.per === '4in' ? g.stitches / (4 * CM_PER_IN) : g.stitches / 10;
  const cm = stitches / perCm;
  return header.floatLimit.unit === 'cm' ? `${cm.toFixed(1)} cm` : `${(cm / CM_PER_IN).toFixed(1)} in`;
}

/** Key for a (size, round number) pair. */
export function roundKey(size: string, round: number): string {
  return `${size}\u0000${round}`;
}

/**
 * The worst severity of diagnostics touching each round, per size. A
 * diagnostic without a size counts for every size; one belongs to a round
 * when its span starts inside the round's span.
 */
export function problemRounds(view: CompiledView): Map<string, Diagnostic['severity']> {
  const rank = { error: 3, warning: 2, info: 1 } as const;
  const out = new Map<string, Diagnostic['severity']>();
  for (const d of view.diagnostics) {
    for (const s of view.sizes) {
      if (d.size && d.size !== s.name) continue;
      for (const r of s.rounds) {
        if (d.span.from < r.span.from || d.span.from >= Math.max(r.span.to, r.span.from + 1)) continue;
        const k = roundKey(s.name, r.number);
        const prev = out.get(k);
        if (!prev || rank[d.severity] > rank[prev]) out.set(k, d.severity);
      }
    }
  }
  return out;
}
