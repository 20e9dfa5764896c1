/**
 * Types shared by every stage of the compiler and by its callers (the
 * contract in shared/index.ts re-exports them).
 */

/**
 * A place in the source. `from`/`to` are 0-based UTF-16 offsets, `to`
 * exclusive; line/column are 1-based; endLine/endColumn point just past the
 * last character (exclusive).
 */
export interface Span { from: number; to: number; line: number; column: number; endLine: number; endColumn: number }

export type Severity = 'error' | 'warning' | 'info';

/** One finding of the compiler: a stable code, where, and what, in the trade's words. */
export interface Diagnostic {
  code: string;
  severity: Severity;
  span: Span;
  /** The size the finding applies to; absent when it holds for every size or none. */
  size?: string;
  message: string;
  hint?: string;
  related?: { span: Span; message: string }[];
}

/** The longest float of a round: which yarn and over how many front stitches. */
export interface FloatInfo { yarn: string; stitches: number }

/** Counts of one worked round (or row) after it is worked. */
export interface RoundSummary {
  /** Round or row number as the source numbers it (1-based). */
  number: number;
  /** Which side faces the knitter: always RS in the round; flat, odd rows RS. */
  side: 'RS' | 'WS';
  /** Front (fabric) stitches on the needle after the round. */
  front: number;
  /** Backing stitches on the needle after the round. */
  backing: number;
  /** front + backing. */
  total: number;
  longestFloat: FloatInfo | null;
  /** The source line(s) that gave the round its instructions. */
  span: Span;
}

/** The pattern header as declared (defaults filled in). */
export interface PatternHeader {
  title: string | null;
  designer: string | null;
  /** What the pattern makes, when the `item` line says: a hat, or a mitt/glove (worn on the hand). */
  item: 'hat' | 'hand' | null;
  sizes: string[];
  construction: 'round' | 'flat';
  gauge: { stitches: number; rows: number; per: '10cm' | '4in' } | null;
  yarns: { name: string; label: string; colour: string }[];
  floatLimit: { value: number; unit: 'in' | 'cm' };
}
