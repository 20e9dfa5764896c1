/** /api/patterns: patterns, revisions and review status. */
import { Router } from 'express';
import { changeStatusBody, createPatternBody, saveRevisionBody } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { authorizeCreatePattern, requireUser } from '../services/access.ts';
import { readPattern, patternReadBody } from '../services/pattern-read.ts';
import { createPattern, getRevision, listPatterns, listRevisions, saveRevision } from '../services/patterns.ts';
import { changeStatusByTarget } from '../services/review.ts';
import { intParam, parseBody } from './params.ts';

/** Pattern and revision routes; every pattern route goes through the access policy. */
export function patternRoutes(ctx: ServerContext): Router {
  const r = Router();

  r.get('/patterns', async (req, res) => {
    const user = requireUser(req.user);
    res.json({ patterns: await listPatterns(user) });
  });

  r.post('/patterns', async (req, res) => {
    const user = authorizeCreatePattern(req.user);
    const body = parseBody(createPatternBody, req.body);
    res.status(201).json(await createPattern(ctx, user, body.title, body.source ?? ''));
  });

  r.get('/patterns/:id', async (req, res) => {
    // The body is built as text: the stored summary goes in without a parse and re-serialise (pattern-read.ts).
    res.type('json').send(patternReadBody(await readPattern(ctx.sequelize, req.user, intParam(req.params.id))));
  });

  r.post('/patterns/:id/revisions', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(saveRevisionBody, req.body);
    res.status(201).json({ revision: await saveRevision(ctx, req.user, intParam(req.params.id), body) });
  });

  r.get('/patterns/:id/revisions', async (req, res) => {
    res.json({ revisions: await listRevisions(req.user, intParam(req.params.id)) });
  });

  r.get('/patterns/:id/revisions/:number', async (req, res) => {
    res.json({ revision: await getRevision(req.user, intParam(req.params.id), intParam(req.params.number)) });
  });

  r.post('/patterns/:id/status', async (req, res) => {
    requireUser(req.user);
    const body = parseBody(changeStatusBody, req.body);
    // One status machine for both this route and the review routes (services/review-status.ts).
    const { status, ...input } = body;
    res.json(await changeStatusByTarget(ctx, req.user, intParam(req.params.id), status, input));
  });

  return r;
}
