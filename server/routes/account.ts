/**
 * /api/me (PATCH) and /api/me/password: the signed-in person changes their
 * display name or their password.
 *
 * - `PATCH /api/me {name}` -> 200 `{user}`; a blank or over-long name -> 400.
 * - `POST /api/me/password {currentPassword, newPassword}` -> 200 `{user, token}`
 *   and a fresh session cookie (when the request came with the cookie). The
 *   new password follows the sign-up rule (10 characters to 72 bytes) and
 *   must differ from the current one (400); a wrong current password -> 403
 *   `wrong-password`. Every other session and token of the account stops
 *   working. Rate-limited per account with the sign-in limit; only failed
 *   attempts count.
 * Both need a session (401 without one) and, as every unsafe cookie request,
 * a matching Origin (403 `bad-origin`, see middleware/auth.ts).
 */
import { Router, type NextFunction, type Request, type Response } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import { z } from 'zod';
import { registerBody } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { changePassword, renameUser } from '../services/account.ts';
import { AppError, unauthorized } from '../services/errors.ts';
import { toApiUser } from '../services/serialize.ts';
import { startSession } from './auth.ts';
import { parseBody } from './params.ts';

/** The sign-up rules for names and passwords (shared/api-schemas.ts), reused so both forms agree. */
const { name, password } = registerBody.shape;

/** Body of `PATCH /api/me`. */
export const renameBody = z.object({ name });

/** Body of `POST /api/me/password`; the new password must differ from the current one. */
export const changePasswordBody = z.object({
  currentPassword: z.string().min(1, { message: 'Enter your current password.' }).max(200),
  newPassword: password,
}).refine((b) => b.newPassword !== b.currentPassword, {
  path: ['newPassword'],
  message: 'Choose a new password that differs from the current one.',
});

/** A rate limit: at most `limit` failed attempts per `windowMs` for one account. */
export interface AccountLimit { windowMs: number; limit: number }

const DEFAULT_LIMIT: AccountLimit = { windowMs: 15 * 60 * 1000, limit: 20 };

function requireUser(req: Request, _res: Response, next: NextFunction) {
  next(req.user ? undefined : unauthorized());
}

/** Account settings routes; `passwordLimit` defaults to the sign-in limit (20 per 15 minutes). */
export function accountRoutes(ctx: ServerContext, passwordLimit: AccountLimit = DEFAULT_LIMIT): Router {
  const r = Router();
  const limiter = rateLimit({
    windowMs: passwordLimit.windowMs,
    limit: passwordLimit.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Guessing the current password with a stolen session is what this stops, so the count is
    // per account (from any address), and a successful change does not use it up.
    skipSuccessfulRequests: true,
    keyGenerator: (req) => (req.user ? `user:${req.user.id}` : ipKeyGenerator(req.ip ?? '')),
    handler: (_req, _res, next) => next(new AppError(429, 'rate-limited', 'Too many wrong attempts at the current password. Wait a few minutes and try again.')),
  });

  r.patch('/me', requireUser, async (req, res) => {
    const body = parseBody(renameBody, req.body);
    const user = await renameUser(req.user!.id, body.name);
    res.json({ user: toApiUser(user) });
  });

  r.post('/me/password', requireUser, limiter, async (req, res) => {
    const body = parseBody(changePasswordBody, req.body);
    const user = await changePassword(ctx, req.user!.id, body.currentPassword, body.newPassword);
    // The old token was revoked with every other one; this session carries on with a new one.
    const token = startSession(ctx, res, user);
    res.json({ user: toApiUser(user), token });
  });

  return r;
}
