/**
 * The AST of a Loopwright source (stage 3 output). Every node keeps the span
 * of the text it came from so diagnostics, charts and instructions can point
 * back at the line. Numbers are kept as written (graded lists unresolved);
 * the checker resolves them per size.
 */
import type { Span } from '../types';
import type { StitchInfo } from './stitches';

/** A name as written, with its place. */
export interface NameRef { readonly name: string; readonly span: Span }

/** A count: one number, or one per size ("96/112/128"). */
export interface Graded { readonly values: readonly number[]; readonly span: Span }

/** Where a repeat or a stitch run stops. */
export type ToSpec =
  | { readonly kind: 'end' }
  | { readonly kind: 'last'; readonly n: Graded }
  | { readonly kind: 'marker'; readonly name: NameRef | null };

/** How many times a group is worked. */
export type Repeat = { readonly kind: 'times'; readonly n: Graded } | { readonly kind: 'once' } | ToSpec;

/** One operation in a round's list. */
export type Op =
  | { readonly type: 'stitch'; readonly stitch: StitchInfo; readonly count: Graded | null; readonly to: ToSpec | null; readonly yarn: NameRef | null; readonly span: Span }
  | { readonly type: 'group'; readonly ops: readonly Op[]; readonly repeat: Repeat; readonly yarn: NameRef | null; readonly span: Span }
  | { readonly type: 'chart'; readonly chart: NameRef; readonly row: Graded | null; readonly once: boolean; readonly span: Span }
  | { readonly type: 'mark' | 'unmark'; readonly name: NameRef; readonly span: Span }
  | { readonly type: 'catch' | 'raise'; readonly yarn: NameRef; readonly span: Span }
  | { readonly type: 'carry'; readonly count: Graded | null; readonly span: Span }
  | { readonly type: 'close'; readonly how: 'k2tog' | 'ssk'; readonly span: Span }
  | { readonly type: 'cable'; readonly held: number; readonly worked: number; readonly dir: 'left' | 'right'; readonly yarn: NameRef | null; readonly span: Span };

/** A `round`/`rounds`/`row`/`rows` line. */
export interface RoundLine {
  /** Index among the round lines, in source order (later lines win). */
  readonly index: number;
  readonly word: 'round' | 'row';
  readonly first: Graded;
  readonly last: Graded | null;
  /** "every 3rd" -> 3; "every other" -> 2; null = every round in the range. */
  readonly every: number | null;
  readonly segment: NameRef | null;
  readonly yarn: NameRef | null;
  readonly ops: readonly Op[];
  readonly note: string | null;
  readonly span: Span;
  /** Span of the part before the colon ("rounds 5-20 at back:"). */
  readonly headSpan: Span;
}

/** One key entry of a chart: a character and what it stands for. */
export interface ChartKey {
  readonly char: string;
  /** null: no-stitch cell (skipped when working). */
  readonly yarn: NameRef | null;
  readonly stitch: StitchInfo | null;
  readonly none: boolean;
  readonly span: Span;
}

/** A chart block. Rows as written: the first written row is the top (highest number). */
export interface ChartBlock {
  readonly name: NameRef;
  readonly keys: readonly ChartKey[];
  readonly rows: readonly { readonly cells: readonly string[]; readonly span: Span }[];
  readonly span: Span;
}

/** A ladder line: automatic backing columns over a range of rounds. */
export interface LadderLine {
  readonly yarn: NameRef;
  readonly every: Graded | null;
  readonly columns: readonly Graded[];
  readonly first: Graded;
  readonly last: Graded;
  readonly segment: NameRef | null;
  readonly close: 'k2tog' | 'ssk';
  readonly span: Span;
}

/** The header as written (each entry with its span; null when absent). */
export interface HeaderAst {
  title: { value: string; span: Span } | null;
  designer: { value: string; span: Span } | null;
  /** What the pattern makes, as written (`item mitts`). */
  item: { word: string; span: Span } | null;
  sizes: NameRef[] | null;
  sizesSpan: Span | null;
  gauge: { stitches: number; rows: number; length: number; unit: 'cm' | 'in'; span: Span } | null;
  yarns: { name: NameRef; label: string; colour: string; colourSpan: Span; span: Span }[];
  construction: { value: 'round' | 'flat'; span: Span } | null;
  floatLimit: { value: number; unit: 'cm' | 'in'; span: Span } | null;
}

/** A whole source. */
export interface PatternAst {
  header: HeaderAst;
  castOn: { count: Graded; yarn: NameRef | null; span: Span } | null;
  rounds: RoundLine[];
  charts: ChartBlock[];
  ladders: LadderLine[];
  /** Spans of comments (for highlighting). */
  comments: Span[];
}
