/**
 * Request authentication and the cross-site check.
 *
 * A request is signed in by `Authorization: Bearer <token>` or by the
 * `lw_session` cookie (httpOnly, SameSite=Lax). Requests that use the cookie
 * and an unsafe method must carry an Origin (or, failing that, Referer)
 * matching the host or an allowed origin; Bearer requests are exempt, since a
 * browser never adds that header on its own.
 */
import type { NextFunction, Request, Response } from 'express';
import type { ServerContext } from '../context.ts';
import type { User } from '../models/index.ts';
import { userFromToken } from '../services/auth.ts';
import { AppError } from '../services/errors.ts';

/** Name of the session cookie. */
export const SESSION_COOKIE = 'lw_session';

declare module 'express-serve-static-core' {
  interface Request {
    /** The signed-in user, or null. Set by {@link authenticate}. */
    user: User | null;
    /** How the request was signed in. */
    authVia: 'bearer' | 'cookie' | null;
  }
}

/** Reads the token from the Authorization header or the cookie and loads the user. */
export function authenticate(ctx: ServerContext) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    req.user = null;
    req.authVia = null;
    const header = req.headers.authorization;
    if (header?.startsWith('Bearer ')) {
      req.user = await userFromToken(ctx, header.slice(7).trim());
      req.authVia = req.user ? 'bearer' : null;
      return next();
    }
    const cookie = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
    if (cookie) {
      req.user = await userFromToken(ctx, cookie);
      req.authVia = req.user ? 'cookie' : null;
    }
    next();
  };
}

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses (403 `bad-origin`) unsafe requests that carry the session cookie
 * but no matching Origin. `allowedOrigins` adds origins besides the request's
 * own host (e.g. the Vite dev server).
 */
export function checkOrigin(allowedOrigins: readonly string[]) {
  return (req: Request, _res: Response, next: NextFunction) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const hasCookie = Boolean((req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE]);
    const bearer = req.headers.authorization?.startsWith('Bearer ');
    if (!hasCookie || bearer) return next();
    const origin = req.headers.origin ?? originOf(req.headers.referer);
    if (!origin) return next(new AppError(403, 'bad-origin', 'This request needs an Origin header (browsers send one).'));
    let host: string;
    try {
      host = new URL(origin).host;
    } catch {
      return next(new AppError(403, 'bad-origin', 'The Origin header is not a valid URL.'));
    }
    if (host === req.headers.host || allowedOrigins.includes(origin)) return next();
    next(new AppError(403, 'bad-origin', 'Requests from other sites are not accepted.'));
  };
}

function originOf(referer: string | undefined): string | undefined {
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return undefined;
  }
}
