/** /api/auth/* and /api/me: accounts, sessions, password resets. */
import { Router, type Response } from 'express';
import type { RequestHandler } from 'express';
import { loginBody, passwordResetBody, passwordResetRequestBody, registerBody } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { SESSION_COOKIE } from '../middleware/auth.ts';
import type { User } from '../models/index.ts';
import { issueToken, login, register, requestPasswordReset, resetPassword } from '../services/auth.ts';
import { unauthorized } from '../services/errors.ts';
import { toApiUser } from '../services/serialize.ts';
import { parseBody } from './params.ts';

/** Sets the httpOnly SameSite=Lax session cookie and returns the token. */
export function startSession(ctx: ServerContext, res: Response, user: User): string {
  const token = issueToken(ctx, user);
  res.cookie(SESSION_COOKIE, token, {
    httpOnly: true,
    sameSite: 'lax',
    secure: ctx.config.cookieSecure,
    path: '/',
    maxAge: ctx.config.sessionSeconds * 1000,
  });
  return token;
}

/** Rate limiters for the sign-in, register and reset routes. */
export interface AuthLimiters { login: RequestHandler; register: RequestHandler; reset: RequestHandler }

/** Register, sign in/out, /me and password resets; `limiters` guard the first three kinds. */
export function authRoutes(ctx: ServerContext, limiters: AuthLimiters): Router {
  const r = Router();

  r.post('/auth/register', limiters.register, async (req, res) => {
    const body = parseBody(registerBody, req.body);
    const user = await register(ctx, body);
    startSession(ctx, res, user);
    res.status(201).json({ user: toApiUser(user) });
  });

  r.post('/auth/login', limiters.login, async (req, res) => {
    const body = parseBody(loginBody, req.body);
    const user = await login(ctx, body.email, body.password);
    const token = startSession(ctx, res, user);
    res.json({ user: toApiUser(user), token });
  });

  r.post('/auth/logout', (_req, res) => {
    res.clearCookie(SESSION_COOKIE, { httpOnly: true, sameSite: 'lax', secure: ctx.config.cookieSecure, path: '/' });
    res.status(204).end();
  });

  r.get('/me', (req, res) => {
    if (!req.user) throw unauthorized();
    res.json({ user: toApiUser(req.user) });
  });

  r.post('/auth/password-reset', limiters.reset, async (req, res) => {
    const body = parseBody(passwordResetRequestBody, req.body);
    await requestPasswordReset(ctx, body.email);
    res.status(202).json({ message: 'If an account uses that e-mail, a link to choose a new password is on its way.' });
  });

  r.post('/auth/password-reset/:token', limiters.reset, async (req, res) => {
    const body = parseBody(passwordResetBody, req.body);
    await resetPassword(ctx, String(req.params.token), body.password);
    res.status(204).end();
  });

  return r;
}
