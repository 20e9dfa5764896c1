/**
 * Starts the API server against an existing database (production-style):
 * DB_* variables for MariaDB, SMTP_URL for mail, JWT_SECRET, PORT (default
 * 4310), HOST (default 127.0.0.1), PUBLIC_URL for mailed links,
 * LOOPWRIGHT_DATA_DIR for uploads and the generated secret (default
 * .data/start), STRIPE_SECRET_KEY / STRIPE_WEBHOOK_SECRET (and STRIPE_API_HOST,
 * STRIPE_API_PORT, STRIPE_API_PROTOCOL for a stand-in) for the shop. Runs migrations first. For local demo runs use `npm start`.
 */
import path from 'node:path';
import { createApp } from './app.ts';
import { createSequelize } from './db/connection.ts';
import { migrate } from './db/migrate.ts';
import { createMailer, mailerTargetFromEnv } from './mail/mailer.ts';
import { resolveJwtSecret } from './secrets.ts';
import { paymentsConfigFromEnv } from './services/payments.ts';

const dataDir = path.resolve(process.env.LOOPWRIGHT_DATA_DIR ?? path.join(import.meta.dirname, '..', '.data', 'start'));
const port = Number(process.env.PORT ?? 4310);
const host = process.env.HOST ?? '127.0.0.1';

const sequelize = createSequelize();
await migrate(sequelize);
const mailer = createMailer(mailerTargetFromEnv());
const app = createApp({
  sequelize,
  mailer,
  jwtSecret: resolveJwtSecret(dataDir),
  storageDir: path.join(dataDir, 'uploads'),
  publicUrl: process.env.PUBLIC_URL ?? `http://${host}:${port}`,
  payments: paymentsConfigFromEnv(),
  // e.g. TRUST_PROXY=1 behind one reverse proxy, so rate limits see the client address.
  trustProxy: process.env.TRUST_PROXY ? (/^\d+$/.test(process.env.TRUST_PROXY) ? Number(process.env.TRUST_PROXY) : process.env.TRUST_PROXY) : false,
});
const server = app.listen(port, host, () => console.log(`Loopwright API on http://${host}:${port}`));
const shutdown = () => server.close(() => { mailer.close(); void sequelize.close().then(() => process.exit(0)); });
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
