/** Account management for admins: GET /api/admin/users, PATCH /api/admin/users/:id. */
import { Router } from 'express';
import { adminUpdateUserBody } from '../../shared/api-schemas.ts';
import { authorizeAdmin } from '../services/access.ts';
import { listUsers, setRoles } from '../services/admin.ts';
import { intParam, parseBody } from './params.ts';

/** Admin-only account routes (403 for everyone else). */
export function adminRoutes(): Router {
  const r = Router();
  r.get('/admin/users', async (req, res) => {
    authorizeAdmin(req.user);
    res.json({ users: await listUsers() });
  });
  r.patch('/admin/users/:id', async (req, res) => {
    const admin = authorizeAdmin(req.user);
    const body = parseBody(adminUpdateUserBody, req.body);
    res.json({ user: await setRoles(admin, intParam(req.params.id), body.roles) });
  });
  return r;
}
