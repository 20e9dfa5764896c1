/**
 * The one error handler: every failure leaves as
 * `{"error":{"code","message","details?"}}` (plus extra fields such as
 * `latest` on a 409). Stack traces and SQL never reach the client; a
 * database that cannot be reached gives 503 `database-unavailable`; unknown
 * errors are logged and answered with 500 `internal`.
 */
import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import { ConnectionError, DatabaseError } from 'sequelize';
import { ZodError } from 'zod';
import { AppError } from '../services/errors.ts';

interface BodyParserError { type?: string; status?: number; statusCode?: number; expose?: boolean }

/**
 * True when the database could not be reached or dropped the connection:
 * Sequelize's ConnectionError family (refused, timed out, no connection
 * from the pool), or a query error the mariadb driver marks `fatal` (the
 * socket closed under a running query) or that says the server is shutting
 * down or killed the connection. Either way nothing was committed.
 */
export function isDatabaseUnavailable(err: unknown): boolean {
  if (err instanceof ConnectionError) return true;
  if (!(err instanceof DatabaseError)) return false;
  const parent = err.parent as { fatal?: boolean; code?: string } | undefined;
  return parent?.fatal === true || DROPPED_CONNECTION_CODES.has(parent?.code ?? '');
}

/** Server-side codes for "this connection is going away" (shutdown, KILL), which the driver may not mark fatal. */
const DROPPED_CONNECTION_CODES = new Set(['ER_SERVER_SHUTDOWN', 'ER_CONNECTION_KILLED', 'ER_QUERY_INTERRUPTED', 'ECONNRESET', 'EPIPE']);

const DB_DOWN_MESSAGE = 'The database is not answering right now, so nothing was read or saved. Please try again in a moment.';

/** Turns a thrown value into status + body. Exported for tests. */
export function toErrorResponse(err: unknown): { status: number; body: Record<string, unknown> } {
  if (err instanceof AppError) {
    const error: Record<string, unknown> = { code: err.code, message: err.message };
    if (err.details !== undefined) error.details = err.details;
    return { status: err.status, body: { error, ...err.extra } };
  }
  if (err instanceof ZodError) {
    const details = err.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
    const first = details[0];
    const message = first ? `${first.path ? `${first.path}: ` : ''}${first.message}` : 'The request is not valid.';
    return { status: 400, body: { error: { code: 'invalid-request', message, details } } };
  }
  if (err instanceof multer.MulterError) {
    if (err.code === 'LIMIT_FILE_SIZE') return { status: 413, body: { error: { code: 'too-large', message: 'The file is larger than allowed.' } } };
    return { status: 400, body: { error: { code: 'invalid-upload', message: `The upload is not valid (${err.code}); send one file in the field "file".` } } };
  }
  if (isDatabaseUnavailable(err)) return { status: 503, body: { error: { code: 'database-unavailable', message: DB_DOWN_MESSAGE } } };
  const bp = err as BodyParserError;
  if (bp && typeof bp === 'object' && typeof bp.type === 'string') {
    if (bp.type === 'entity.too.large') return { status: 413, body: { error: { code: 'too-large', message: 'The request body is larger than allowed.' } } };
    if (bp.type === 'entity.parse.failed') return { status: 400, body: { error: { code: 'invalid-json', message: 'The request body is not valid JSON.' } } };
    const status = bp.status ?? bp.statusCode ?? 400;
    if (status >= 400 && status < 500) return { status, body: { error: { code: 'invalid-request', message: 'The request body could not be read.' } } };
  }
  return { status: 500, body: { error: { code: 'internal', message: 'Something went wrong on our side. Nothing you sent was lost; please try again.' } } };
}

/** Express error middleware (four arguments). */
export function errorHandler(err: unknown, req: Request, res: Response, _next: NextFunction): void {
  const { status, body } = toErrorResponse(err);
  if (status === 503) console.error(`${req.method} ${req.originalUrl}: database unavailable (${err instanceof Error ? err.message : String(err)})`);
  else if (status >= 500) console.error(`${req.method} ${req.originalUrl} failed:`, err);
  if (res.headersSent) {
    res.end();
    return;
  }
  // Clients may retry a 503 after a short wait (RFC 9110 section 10.2.3).
  if (status === 503) res.setHeader('Retry-After', '5');
  res.status(status).json(body);
}
