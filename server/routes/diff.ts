/** GET /api/patterns/:id/diff?from=N&to=M[&size=NAME]: semantic and text diff of two revisions. */
import { Router } from 'express';
import { diffQuery } from '../../shared/api-schemas.ts';
import { requireUser } from '../services/access.ts';
import { diffPatternRevisions } from '../services/diff.ts';
import type { ExportQueue } from '../services/exports/jobs.ts';
import { intParam, parseBody } from './params.ts';

/** The diff route; 400 on bad query parameters, 404 on a revision the caller cannot read. */
export function diffRoutes(queue: ExportQueue): Router {
  const r = Router();
  r.get('/patterns/:id/diff', async (req, res) => {
    requireUser(req.user);
    const q = parseBody(diffQuery, req.query);
    res.json(await diffPatternRevisions(queue, req.user, intParam(req.params.id), q.from, q.to, q.size));
  });
  return r;
}
