/** Releases and the knitter's side: /api/patterns/:id/releases[/:label/{progress,errata}]. */
import { Router } from 'express';
import { erratumBody, progressBody, releaseBody } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { requireUser } from '../services/access.ts';
import { getProgress, reportErratum, saveProgress } from '../services/knitting.ts';
import { listReleases, takeReviewStep } from '../services/review.ts';
import { intParam, parseBody } from './params.ts';

const sizeQuery = (q: unknown): string | undefined => (typeof q === 'string' ? q : undefined);
const labelParam = (v: string | string[] | undefined): string => (Array.isArray(v) ? v[0] ?? '' : v ?? '');

/** Release list, releasing, progress and errata. */
export function releaseRoutes(ctx: ServerContext): Router {
  const r = Router();
  r.get('/patterns/:id/releases', async (req, res) => {
    res.json({ releases: await listReleases(req.user, intParam(req.params.id)) });
  });
  r.post('/patterns/:id/releases', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(releaseBody, req.body);
    res.status(201).json(await takeReviewStep(ctx, req.user, intParam(req.params.id), 'release', body));
  });
  r.get('/patterns/:id/releases/:label/progress', async (req, res) => {
    res.json({ progress: await getProgress(req.user, intParam(req.params.id), labelParam(req.params.label), sizeQuery(req.query.size)) });
  });
  r.put('/patterns/:id/releases/:label/progress', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(progressBody, req.body);
    res.json({ progress: await saveProgress(ctx, req.user, intParam(req.params.id), labelParam(req.params.label), sizeQuery(req.query.size), body) });
  });
  r.post('/patterns/:id/releases/:label/errata', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(erratumBody, req.body);
    res.status(201).json(await reportErratum(ctx, req.user, intParam(req.params.id), labelParam(req.params.label), body));
  });
  return r;
}
