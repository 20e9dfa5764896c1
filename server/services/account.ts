/**
 * Account settings of the signed-in person: the display name and a password
 * change that needs the current password. A password change ends every other
 * session the same way a mailed reset does (the session version goes up, so
 * older tokens stop working); the caller issues a fresh token for the
 * session that asked.
 */
import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import type { ServerContext } from '../context.ts';
import { PasswordReset, User } from '../models/index.ts';
import { AppError, notFound } from './errors.ts';
import { hashPassword, notifyPasswordChanged } from './auth.ts';

/** Message of the 403 `wrong-password` answer. */
export const WRONG_PASSWORD = 'The current password is not right, so nothing was changed.';

/** Sets the display name (already trimmed and checked by the route's schema). */
export async function renameUser(userId: number, name: string): Promise<User> {
  const user = await User.findByPk(userId);
  if (!user) throw notFound('That account');
  user.name = name;
  await user.save();
  return user;
}

/**
 * Replaces the password when `current` matches the stored hash.
 * 403 `wrong-password` otherwise (the account is unchanged). On success the
 * session version is bumped (every token issued before stops working) and
 * open reset links of the account are closed, as after a mailed reset, and
 * the account's address is told of the change.
 */
export async function changePassword(ctx: ServerContext, userId: number, current: string, next: string): Promise<User> {
  const nextHash = await hashPassword(ctx, next);
  const changed = await ctx.sequelize.transaction(async (transaction) => {
    // Locked, so two changes at once cannot both pass the check against the same old hash.
    const user = await User.findByPk(userId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!user) throw notFound('That account');
    if (!(await bcrypt.compare(current, user.passwordHash))) {
      throw new AppError(403, 'wrong-password', WRONG_PASSWORD, [{ path: 'currentPassword', message: WRONG_PASSWORD }]);
    }
    user.passwordHash = nextHash;
    user.sessionVersion = (user.sessionVersion ?? 0) + 1;
    await user.save({ transaction });
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: { [Op.is]: null } }, transaction });
    return user;
  });
  notifyPasswordChanged(ctx, changed, 'settings');
  return changed;
}
