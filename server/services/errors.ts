/**
 * The one error type services throw for expected failures. The error
 * handler turns it into `{"error":{"code","message","details?"}, ...extra}`
 * with `status`. Anything else becomes a 500 with a generic message.
 */
export class AppError extends Error {
  override name = 'AppError';
  constructor(
    /** HTTP status. */
    readonly status: number,
    /** Stable machine-readable code, kebab-case. */
    readonly code: string,
    message: string,
    /** Optional structured details (validation issues, limits). */
    readonly details?: unknown,
    /** Extra top-level fields of the error body (e.g. `latest` on a 409). */
    readonly extra?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const badRequest = (code: string, message: string, details?: unknown) => new AppError(400, code, message, details);
export const unauthorized = (message = 'Sign in first.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'You do not have permission to do that.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'That') => new AppError(404, 'not-found', `${what} was not found.`);
export const conflict = (code: string, message: string, extra?: Record<string, unknown>) => new AppError(409, code, message, undefined, extra);
export const gone = (code: string, message: string) => new AppError(410, code, message);
export const tooLarge = (message: string, limitBytes: number) => new AppError(413, 'too-large', message, { limitBytes });
export const unsupportedType = (message: string) => new AppError(415, 'unsupported-type', message);
