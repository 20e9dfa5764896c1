/**
 * Runs the shared compiler on a source being stored and reduces the result
 * to the stored summary. The server never trusts counts sent by a client.
 */
import { compile, summarizeForStorage } from '../../shared/index.ts';
import type { StoredSummary } from '../models/revision.ts';

/** Summary plus the two counts kept in their own columns for listing. A compiler crash (a bug, never user error) stores no summary rather than losing the source. */
export function summarizeSource(source: string): { summary: StoredSummary | null; errors: number; warnings: number } {
  try {
    const summary = summarizeForStorage(compile(source));
    return { summary, errors: summary.errors, warnings: summary.warnings };
  } catch (err) {
    console.error('compiler failed on a stored source:', err instanceof Error ? err.stack : err);
    return { summary: null, errors: 0, warnings: 0 };
  }
}

/** The pattern title declared in the source header, if the compiler finds one. */
export function titleFromSource(source: string): string | null {
  try {
    const title = compile(source).header.title?.trim();
    return title ? title.slice(0, 200) : null;
  } catch {
    return null;
  }
}
