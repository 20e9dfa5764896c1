/** Review routes: /api/patterns/:id/review (state and log) and its steps; see services/review.ts. */
import { Router } from 'express';
import { approveBody, requestChangesBody, requestReviewBody } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { requireUser } from '../services/access.ts';
import { getReview, takeReviewStep } from '../services/review.ts';
import { intParam, parseBody } from './params.ts';

/** Review state, log and steps (ask, withdraw, approve, ask for changes). Releasing is in releases.ts. */
export function reviewRoutes(ctx: ServerContext): Router {
  const r = Router();
  r.get('/patterns/:id/review', async (req, res) => {
    res.json(await getReview(req.user, intParam(req.params.id)));
  });
  r.post('/patterns/:id/review/request', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(requestReviewBody, req.body);
    res.json(await takeReviewStep(ctx, req.user, intParam(req.params.id), 'submit', body));
  });
  r.post('/patterns/:id/review/withdraw', async (req, res) => {
    requireUser(req.user);
    res.json(await takeReviewStep(ctx, req.user, intParam(req.params.id), 'withdraw'));
  });
  r.post('/patterns/:id/review/approve', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(approveBody, req.body);
    res.json(await takeReviewStep(ctx, req.user, intParam(req.params.id), 'approve', body));
  });
  r.post('/patterns/:id/review/request-changes', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(requestChangesBody, req.body);
    res.json(await takeReviewStep(ctx, req.user, intParam(req.params.id), 'request-changes', body));
  });
  return r;
}
