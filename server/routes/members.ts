/** Members and invitations: /api/patterns/:id/members, /api/invitations/:token. */
import { Router } from 'express';
import { acceptInvitationBody, inviteMemberBody } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { requireUser } from '../services/access.ts';
import { acceptInvitation, describeInvitation, inviteMember, listMembers, removeMember } from '../services/members.ts';
import { startSession } from './auth.ts';
import { intParam, parseBody } from './params.ts';

/** Member list, invitations by mail, acceptance and removal. */
export function memberRoutes(ctx: ServerContext): Router {
  const r = Router();

  r.get('/patterns/:id/members', async (req, res) => {
    res.json(await listMembers(req.user, intParam(req.params.id)));
  });

  r.post('/patterns/:id/members', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(inviteMemberBody, req.body);
    res.status(201).json(await inviteMember(ctx, req.user, intParam(req.params.id), body.email, body.role));
  });

  r.delete('/patterns/:id/members/:userId', async (req, res) => {
    await removeMember(req.user, intParam(req.params.id), intParam(req.params.userId));
    res.status(204).end();
  });

  r.get('/invitations/:token', async (req, res) => {
    res.json({ invitation: await describeInvitation(String(req.params.token)) });
  });

  /**
   * Accepts an invitation. New account: 201, signed in (cookie + token).
   * Existing account: 200; signed in only if the caller already is that account.
   */
  r.post('/invitations/:token/accept', async (req, res) => {
    const body = parseBody(acceptInvitationBody, req.body);
    const result = await acceptInvitation(ctx, String(req.params.token), body);
    const payload = { user: result.apiUser, patternId: result.patternId, role: result.role };
    if (result.created) {
      const token = startSession(ctx, res, result.user);
      res.status(201).json({ ...payload, token });
    } else {
      res.json({ ...payload, signedIn: req.user?.id === result.user.id });
    }
  });

  return r;
}
