/** Field-level messages from an API error answer (`error.details: {path, message}[]`). */
import { ApiError } from '../../api/client';

/** The server's message for body field `path`, or null when the error does not name that field. */
export function fieldError(err: unknown, path: string): string | null {
  if (!(err instanceof ApiError)) return null;
  const details = (err.body as { error?: { details?: unknown } } | null)?.error?.details;
  if (!Array.isArray(details)) return null;
  for (const d of details as { path?: unknown; message?: unknown }[]) {
    if (d.path === path && typeof d.message === 'string') return d.message;
  }
  return null;
}
