/**
 * Members of a pattern and invitations by e-mail. An invitation carries a
 * one-use token (stored hashed) valid for {@link INVITATION_TTL_MS}; on
 * acceptance the account is created when the e-mail has none.
 */
import type { ApiInvitation, ApiMember, ApiUser, MemberRoleName } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { invitationMail } from '../mail/templates.ts';
import { Invitation, Membership, Pattern, User, type GlobalRole } from '../models/index.ts';
import { authorizePattern } from './access.ts';
import { hashPassword } from './auth.ts';
import { badRequest, conflict, gone, notFound } from './errors.ts';
import { toApiUser } from './serialize.ts';
import { hashToken, newToken } from './tokens.ts';

/** Invitations are valid for 7 days. */
export const INVITATION_TTL_MS = 7 * 24 * 3600 * 1000;

const globalRoleFor = (role: MemberRoleName): GlobalRole => (role === 'editor' ? 'editor' : 'knitter');

const toApiInvitation = (i: Invitation): ApiInvitation => ({
  id: i.id,
  email: i.email,
  role: i.role,
  expiresAt: i.expiresAt.toISOString(),
  acceptedAt: i.acceptedAt ? i.acceptedAt.toISOString() : null,
  createdAt: i.createdAt.toISOString(),
});

/**
 * Invites `email` to the pattern with `role` and mails the link. 400 when it
 * is the owner's own address, 409 when that person is already a member.
 * `delivered` is false when the mail could not be handed to the SMTP server
 * (the invitation is kept; the owner can invite again).
 */
export async function inviteMember(ctx: ServerContext, user: User | null, patternId: number, email: string, role: MemberRoleName): Promise<{ invitation: ApiInvitation; delivered: boolean }> {
  const { pattern } = await authorizePattern(user, patternId, 'manage-members');
  const inviter = user as User;
  if (email === inviter.email) throw badRequest('cannot-invite-owner', 'You own this pattern already.');
  const existing = await User.findOne({ where: { email } });
  if (existing && (await Membership.findOne({ where: { patternId: pattern.id, userId: existing.id } }))) {
    throw conflict('already-member', `${email} is already on this pattern.`);
  }
  const { token, hash } = newToken();
  const invitation = await Invitation.create({
    patternId: pattern.id,
    email,
    role,
    tokenHash: hash,
    invitedById: inviter.id,
    expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
  });
  let delivered = true;
  try {
    await ctx.mailer.send(invitationMail({
      to: email,
      inviter: inviter.name,
      patternTitle: pattern.title,
      role,
      link: `${ctx.config.publicUrl}/invitations/${token}`,
      expiresAt: invitation.expiresAt,
    }));
  } catch (err) {
    delivered = false;
    console.error('invitation mail could not be sent:', err instanceof Error ? err.message : err);
  }
  return { invitation: toApiInvitation(invitation), delivered };
}

async function findOpenInvitation(token: string, lock?: { transaction: import('sequelize').Transaction }): Promise<Invitation> {
  const invitation = await Invitation.findOne({
    where: { tokenHash: hashToken(token) },
    ...(lock ? { transaction: lock.transaction, lock: lock.transaction.LOCK.UPDATE } : {}),
  });
  if (!invitation) throw notFound('That invitation');
  if (invitation.acceptedAt) throw gone('invitation-used', 'That invitation has already been accepted. Sign in to open the pattern.');
  if (invitation.expiresAt.getTime() < Date.now()) throw gone('invitation-expired', 'That invitation has expired. Ask the designer to invite you again.');
  return invitation;
}

/** What the invitation page shows before accepting. 404 unknown, 410 used or expired. */
export async function describeInvitation(token: string): Promise<{ email: string; role: MemberRoleName; patternTitle: string; invitedBy: string; accountExists: boolean; expiresAt: string }> {
  const invitation = await findOpenInvitation(token);
  const pattern = await Pattern.findByPk(invitation.patternId);
  const inviter = await User.findByPk(invitation.invitedById);
  const account = await User.findOne({ where: { email: invitation.email } });
  return {
    email: invitation.email,
    role: invitation.role,
    patternTitle: pattern?.title ?? '',
    invitedBy: inviter?.name ?? '',
    accountExists: Boolean(account),
    expiresAt: invitation.expiresAt.toISOString(),
  };
}

/**
 * Accepts an invitation (once). When the invited e-mail has no account,
 * `name` and `password` are required and the account is created
 * (`created: true`). The membership is added, or its role updated.
 */
export async function acceptInvitation(ctx: ServerContext, token: string, body: { name?: string; password?: string }): Promise<{ user: User; apiUser: ApiUser; patternId: number; role: MemberRoleName; created: boolean }> {
  // Hash before the transaction: bcrypt is slow and must not hold row locks.
  const passwordHash = body.password ? await hashPassword(ctx, body.password) : null;
  return ctx.sequelize.transaction(async (transaction) => {
    const invitation = await findOpenInvitation(token, { transaction });
    let user = await User.findOne({ where: { email: invitation.email }, transaction });
    let created = false;
    if (!user) {
      if (!body.name || !passwordHash) {
        throw badRequest('account-details-required', 'There is no account for this e-mail yet: choose a name and a password (at least 10 characters).');
      }
      user = await User.create({ email: invitation.email, name: body.name, passwordHash, roles: [globalRoleFor(invitation.role)] }, { transaction });
      created = true;
    } else if (!user.roles.includes(globalRoleFor(invitation.role))) {
      user.roles = [...user.roles, globalRoleFor(invitation.role)];
      await user.save({ transaction });
    }
    const pattern = await Pattern.findByPk(invitation.patternId, { transaction });
    if (!pattern) throw notFound('Pattern');
    if (pattern.ownerId !== user.id) {
      const membership = await Membership.findOne({ where: { patternId: pattern.id, userId: user.id }, transaction });
      if (membership) {
        membership.role = invitation.role;
        await membership.save({ transaction });
      } else {
        await Membership.create({ patternId: pattern.id, userId: user.id, role: invitation.role }, { transaction });
      }
    }
    invitation.acceptedAt = new Date();
    invitation.acceptedById = user.id;
    await invitation.save({ transaction });
    return { user, apiUser: toApiUser(user), patternId: pattern.id, role: invitation.role, created };
  });
}

/** Owner and members (owner first); the owner also sees open invitations. */
export async function listMembers(user: User | null, patternId: number): Promise<{ members: ApiMember[]; invitations: ApiInvitation[] }> {
  const { pattern, role } = await authorizePattern(user, patternId, 'list-members');
  const owner = await User.findByPk(pattern.ownerId);
  const memberships = await Membership.findAll({ where: { patternId: pattern.id }, include: [{ model: User, as: 'user' }], order: [['id', 'ASC']] });
  const members: ApiMember[] = [];
  if (owner) members.push({ user: { id: owner.id, name: owner.name, email: owner.email }, role: 'owner', since: pattern.createdAt.toISOString() });
  for (const m of memberships) {
    if (m.user) members.push({ user: { id: m.user.id, name: m.user.name, email: m.user.email }, role: m.role, since: m.createdAt.toISOString() });
  }
  let invitations: ApiInvitation[] = [];
  if (role === 'owner') {
    const open = await Invitation.findAll({ where: { patternId: pattern.id, acceptedAt: null }, order: [['id', 'DESC']] });
    invitations = open.filter((i) => i.expiresAt.getTime() > Date.now()).map(toApiInvitation);
  }
  return { members, invitations };
}

/** Removes a member. The owner removes anyone; a member may remove themselves (leave). */
export async function removeMember(user: User | null, patternId: number, userId: number): Promise<void> {
  const self = user !== null && user.id === userId;
  const { pattern } = await authorizePattern(user, patternId, self ? 'view' : 'manage-members');
  const removed = await Membership.destroy({ where: { patternId: pattern.id, userId } });
  if (removed === 0) throw notFound('That member');
}
