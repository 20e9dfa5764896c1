/**
 * Messages between the workspace and its compile worker.
 *
 * The compiler (and its lexer library) lives only in the worker, so the
 * page's own bundle stays small. The page sends every new text; the worker
 * answers at once with the tokens for colouring, and after a quiet spell
 * (debounced) with a {@link CompiledView}: the parts of the compile result
 * the studio shows (header, diagnostics, per-round counts), not the
 * stitch-level model, so the answer stays small to copy between threads
 * even for a 300-round pattern in several sizes.
 */
import type { Diagnostic, PatternHeader, RoundSummary } from '../../shared';
import type { Instructions } from '../../shared/render/instructions';
import type { PatternSummary } from '../../shared/render/summary';
import type { PlanResult } from '../../shared/render/planner';

/** One coloured token (offsets into the source, `to` exclusive). Kinds as `highlightTokens` reports them. */
export interface HighlightToken {
  from: number;
  to: number;
  kind: 'keyword' | 'stitch' | 'number' | 'comment' | 'string' | 'yarn' | 'colour' | 'name' | 'punctuation' | 'invalid';
}

/** Page → worker: a new text. `id` increases with every message; `delayMs` is the compile debounce. */
export interface SourceMessage {
  type: 'source';
  id: number;
  source: string;
  delayMs: number;
}

/** Worker → page, once at start: the words completion offers. */
export interface VocabularyMessage {
  type: 'vocabulary';
  stitches: readonly string[];
  keywords: readonly string[];
}

/** Worker → page, right after each text: its tokens. */
export interface TokensMessage {
  type: 'tokens';
  id: number;
  source: string;
  tokens: HighlightToken[];
}

/** Per-size counts as the panes show them. */
export interface SizeCounts {
  name: string;
  castOn: number;
  rounds: RoundSummary[];
}

/** Worker → page after the debounce: what the studio reads of one compile. Spans refer to `source`. */
export interface CompiledView {
  type: 'compiled';
  /** The message this answers. */
  id: number;
  /** The exact text that was compiled (so spans can be trusted against it). */
  source: string;
  ok: boolean;
  header: PatternHeader;
  diagnostics: Diagnostic[];
  sizes: SizeCounts[];
  /** Wall time of the compile in the worker, in milliseconds. */
  elapsedMs: number;
  /** Set when the compiler itself failed (a bug, never a user error). */
  crash?: string;
}

/** Which views the page shows; the worker renders them after each compile (null: not shown, not rendered). */
export interface ViewSettings {
  /** Chart of one size (null size: the first), front or back of the work, cell size in px. */
  chart: { size: string | null; side: 'front' | 'back'; cell: number } | null;
  /** Written instructions of one size (null: the first). */
  instructions: { size: string | null } | null;
}

/** Page → worker: the views to render from now on. */
export interface SettingsMessage {
  type: 'settings';
  settings: ViewSettings;
}

/** Worker → page: a rendered chart (an SVG document as text, all text escaped by the renderer). */
export interface ChartMessage {
  type: 'chart';
  /** The source message whose compile this was drawn from. */
  id: number;
  size: string;
  side: 'front' | 'back';
  cell: number;
  svg: string | null;
  /** Why there is no chart, in plain words. */
  problem?: string;
}

/** Worker → page: written instructions of one size (structured; the page lays them out). */
export interface InstructionsMessage {
  type: 'instructions';
  id: number;
  size: string;
  instructions: Instructions | null;
  /** Why there are none, in plain words. */
  problem?: string;
}

/**
 * Page → summary worker: summarise this text (sent after each compile of
 * the main worker while the summary pane shows).
 */
export interface SummarySourceMessage {
  type: 'summarize';
  id: number;
  source: string;
}

/** Summary worker → page: the summary of text `id`. */
export interface SummaryMessage {
  type: 'summary';
  id: number;
  summary: PatternSummary | null;
  problem?: string;
}

/** Page → summary worker: propose backing columns for rounds `first`–`last` of the newest text it was sent. */
export interface PlanMessage {
  type: 'plan';
  request: number;
  first: number;
  last: number;
  segment?: string;
}

/** Summary worker → page: the planner's proposal, for the text `source`. */
export interface PlanAnswer {
  type: 'plan';
  request: number;
  source: string;
  plan: PlanResult | null;
  problem?: string;
}

export type { Instructions, PatternSummary, PlanResult };
export type WorkerMessage = SourceMessage | SettingsMessage;
export type WorkerAnswer = VocabularyMessage | TokensMessage | CompiledView | ChartMessage | InstructionsMessage;
export type SummaryWorkerMessage = SummarySourceMessage | PlanMessage;
export type SummaryWorkerAnswer = SummaryMessage | PlanAnswer;
