/** Account management for admins. */
import type { ApiUser } from '../../shared/api-schemas.ts';
import { User, type GlobalRole } from '../models/index.ts';
import { badRequest, notFound } from './errors.ts';
import { toApiUser } from './serialize.ts';

/** Every account, oldest first. */
export async function listUsers(): Promise<ApiUser[]> {
  const users = await User.findAll({ order: [['id', 'ASC']] });
  return users.map(toApiUser);
}

/** Replaces an account's global roles. An admin cannot drop their own admin role (avoids locking everyone out). */
export async function setRoles(actor: User, userId: number, roles: GlobalRole[]): Promise<ApiUser> {
  const user = Number.isSafeInteger(userId) ? await User.findByPk(userId) : null;
  if (!user) throw notFound('That account');
  if (user.id === actor.id && !roles.includes('admin')) throw badRequest('own-admin-role', 'You cannot remove your own admin role.');
  user.roles = roles;
  await user.save();
  return toApiUser(user);
}
