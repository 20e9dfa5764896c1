/**
 * Messages between the workspace and its compile worker.
 *
 * The worker answers with a {@link CompiledView}: the parts of the compile
 * result the studio shows (header, diagnostics, per-round counts), not the
 * stitch-level model, so the answer stays small to copy between threads even
 * for a 300-round pattern in several sizes.
 */
import type { Diagnostic, PatternHeader, RoundSummary } from '../../shared';

/** Ask the worker to compile `source`; `id` increases with every request. */
export interface CompileRequest {
  id: number;
  source: string;
}

/** Per-size counts as the panes show them. */
export interface SizeCounts {
  name: string;
  castOn: number;
  rounds: RoundSummary[];
}

/** What the studio reads of one compile. Spans refer to `source`. */
export interface CompiledView {
  /** The request this answers. */
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
