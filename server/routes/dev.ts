/** Development-only routes (mounted only when NODE_ENV is development or test). */
import { Router } from 'express';
import type { Outbox } from '../fakes/smtp.ts';

/** GET /api/dev/outbox: mails caught by the local fake SMTP server, newest first. */
export function devRoutes(outbox: Outbox | null): Router {
  const r = Router();
  r.get('/dev/outbox', (_req, res) => {
    res.json({ messages: outbox ? outbox.list() : [] });
  });
  return r;
}
