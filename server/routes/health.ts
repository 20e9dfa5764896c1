/** GET /api/health: is the app up and does the database answer? */
import { Router } from 'express';
import type { Sequelize } from 'sequelize';

/** How long the database may take to answer the health check, in ms. */
export const HEALTH_DB_TIMEOUT_MS = 2000;

/** Resolves true when `sequelize.authenticate()` succeeds within `timeoutMs`. */
export async function isDatabaseUp(sequelize: Sequelize, timeoutMs = HEALTH_DB_TIMEOUT_MS): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<boolean>((resolve) => { timer = setTimeout(() => resolve(false), timeoutMs); });
  try {
    return await Promise.race([sequelize.authenticate().then(() => true, () => false), timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/** GET /health: 200 `{ok:true,db:"up"}` or 503 `{ok:false,db:"down"}`. */
export function healthRoutes(sequelize: Sequelize): Router {
  const r = Router();
  r.get('/health', async (_req, res) => {
    if (await isDatabaseUp(sequelize)) res.json({ ok: true, db: 'up' });
    else res.status(503).json({ ok: false, db: 'down' });
  });
  return r;
}
