/**
 * Accounts and sessions: registration, sign-in, session tokens (JWT, HS256),
 * password resets by mail. Passwords are hashed with bcryptjs (cost from
 * config, at least 10).
 */
import { createSecretKey, type KeyObject } from 'node:crypto';
import bcrypt from 'bcryptjs';
import jwt from 'jsonwebtoken';
import { Op, UniqueConstraintError } from 'sequelize';
import type { ServerContext } from '../context.ts';
import { passwordChangedMail, passwordResetMail } from '../mail/templates.ts';
import { PasswordReset, User, type GlobalRole } from '../models/index.ts';
import { AppError, conflict, gone, notFound } from './errors.ts';
import { hashToken, newToken } from './tokens.ts';

/** Password reset links are valid this long. */
export const RESET_TTL_MS = 60 * 60 * 1000;
const INVALID_CREDENTIALS = 'That e-mail and password do not match an account.';

/** Hashes a password with the configured cost (never below 10). */
export function hashPassword(ctx: ServerContext, password: string): Promise<string> {
  return bcrypt.hash(password, Math.max(10, ctx.config.bcryptCost));
}

/** Creates an account. 409 `email-taken` when the e-mail is in use. */
export async function register(ctx: ServerContext, body: { email: string; password: string; name: string }, roles: GlobalRole[] = ['designer']): Promise<User> {
  const passwordHash = await hashPassword(ctx, body.password);
  try {
    return await User.create({ email: body.email, name: body.name, passwordHash, roles });
  } catch (err) {
    if (err instanceof UniqueConstraintError) throw conflict('email-taken', 'An account with that e-mail already exists. Sign in, or reset the password.');
    throw err;
  }
}

// Compared against when the e-mail is unknown, so both failures cost the same time.
let dummyHash: string | null = null;

/** Checks credentials; unknown e-mail and wrong password give the same 401. */
export async function login(ctx: ServerContext, email: string, password: string): Promise<User> {
  const user = await User.findOne({ where: { email } });
  dummyHash ??= await bcrypt.hash('not-a-real-password', Math.max(10, ctx.config.bcryptCost));
  const ok = await bcrypt.compare(password, user?.passwordHash ?? dummyHash);
  if (!user || !ok) throw new AppError(401, 'invalid-credentials', INVALID_CREDENTIALS);
  return user;
}

// The HMAC key object of each secret, made once. Given the secret as a string, jsonwebtoken
// first tries to read it as a public key on every call, which was a quarter of the app's CPU
// under load (bench: apiP99VsHealth); the key object is the same secret, UTF-8 encoded.
const keys = new Map<string, KeyObject>();
function secretKey(secret: string): KeyObject {
  let key = keys.get(secret);
  if (!key) {
    key = createSecretKey(Buffer.from(secret, 'utf8'));
    keys.set(secret, key);
  }
  return key;
}

/** Signs a session token for `user` (subject = id, `sv` = session version). */
export function issueToken(ctx: ServerContext, user: User): string {
  return jwt.sign({ sv: user.sessionVersion ?? 0 }, secretKey(ctx.config.jwtSecret), {
    algorithm: 'HS256',
    subject: String(user.id),
    expiresIn: ctx.config.sessionSeconds,
  });
}

/** The user a token belongs to, or null when it is invalid, expired or revoked by a password change. */
export async function userFromToken(ctx: ServerContext, token: string): Promise<User | null> {
  let payload: jwt.JwtPayload;
  try {
    const decoded = jwt.verify(token, secretKey(ctx.config.jwtSecret), { algorithms: ['HS256'] });
    if (typeof decoded === 'string') return null;
    payload = decoded;
  } catch {
    return null;
  }
  const id = Number(payload.sub);
  if (!Number.isSafeInteger(id)) return null;
  const user = await User.findByPk(id);
  if (!user || user.sessionVersion !== payload.sv) return null;
  return user;
}

/**
 * Starts a password reset: when an account has this e-mail, stores a
 * one-use token and mails a link. Says nothing about whether it exists.
 */
export async function requestPasswordReset(ctx: ServerContext, email: string): Promise<void> {
  const user = await User.findOne({ where: { email } });
  if (!user) return;
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + RESET_TTL_MS);
  await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt });
  const link = `${ctx.config.publicUrl}/reset-password/${token}`;
  // Not awaited: the answer must take the same time and say the same thing
  // whether or not the account exists, so a send (or its failure) happens after it.
  ctx.mailer.send(passwordResetMail({ to: user.email, name: user.name, link, expiresAt })).catch((err: unknown) => {
    console.error('password reset mail could not be sent:', err instanceof Error ? err.message : err);
  });
}

/**
 * Sets a new password with a reset token. The token works once; every other
 * open reset of that account is closed and existing sessions end; the
 * account's address is told of the change (notifyPasswordChanged).
 * 404 unknown token, 410 used or expired.
 */
export async function resetPassword(ctx: ServerContext, token: string, password: string): Promise<void> {
  const passwordHash = await hashPassword(ctx, password);
  const user = await ctx.sequelize.transaction(async (transaction) => {
    const reset = await PasswordReset.findOne({ where: { tokenHash: hashToken(token) }, lock: transaction.LOCK.UPDATE, transaction });
    if (!reset) throw notFound('That reset link');
    if (reset.usedAt) throw gone('token-used', 'That reset link has already been used. Ask for a new one.');
    if (reset.expiresAt.getTime() < Date.now()) throw gone('token-expired', 'That reset link has expired. Ask for a new one.');
    const user = await User.findByPk(reset.userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('That account');
    user.passwordHash = passwordHash;
    user.sessionVersion = (user.sessionVersion ?? 0) + 1;
    await user.save({ transaction });
    const now = new Date();
    await PasswordReset.update({ usedAt: now }, { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction });
    return user;
  });
  notifyPasswordChanged(ctx, user, 'reset');
}

/**
 * Mails the account's address that its password changed (after the change
 * is committed). Not awaited: a mail server that is down must not undo or
 * delay the change; a failed send is logged.
 */
export function notifyPasswordChanged(ctx: ServerContext, user: User, how: 'settings' | 'reset'): void {
  const message = passwordChangedMail({ to: user.email, name: user.name, at: new Date(), how, resetPage: `${ctx.config.publicUrl}/reset-password` });
  ctx.mailer.send(message).catch((err: unknown) => {
    console.error('password change notice could not be sent:', err instanceof Error ? err.message : err);
  });
}
