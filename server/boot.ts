/**
 * Starts the whole local back end for `npm start` and `npm run dev`: the
 * private MariaDB, migrations, the demo seed, the fake SMTP server, the
 * local payment stand-in (unless STRIPE_SECRET_KEY points at the real
 * service) and the Express app on 127.0.0.1. `stop()` shuts everything down in reverse order.
 */
import type { Server } from 'node:http';
import path from 'node:path';
import type { Sequelize } from 'sequelize';
import { createApp } from './app.ts';
import { createSequelize } from './db/connection.ts';
import { startPrivateMariaDB, type PrivateMariaDB } from './db/launcher.ts';
import { migrate } from './db/migrate.ts';
import { changedDemoExamples, DEMO_ACCOUNTS, DEMO_PASSWORD, seedDemo } from './db/seed.ts';
import { seedReviewDemo } from './db/seed-review.ts';
import { seedShopDemo } from './db/seed-shop.ts';
import { startFakePayments } from './fakes/payments.ts';
import { startFakeSmtp, type FakeSmtp } from './fakes/smtp.ts';
import { createMailer, type Mailer } from './mail/mailer.ts';
import { resolveJwtSecret } from './secrets.ts';
import { paymentsConfigFromEnv, type PaymentsConfig } from './services/payments.ts';

const repoRoot = path.resolve(import.meta.dirname, '..');

/** Options of {@link startLocalBackend}; defaults are the `npm start` contract. */
export interface LocalBackendOptions {
  name?: string;       // default 'start'
  dbPort?: number;     // default 3316
  appPort?: number;    // default PORT or 4310
  smtpPort?: number;   // default 2526
  paymentsPort?: number; // default PAYMENTS_FAKE_PORT or 4320 (the local payment stand-in)
  distDir?: string | null;
  /** Base URL for mailed links; default PUBLIC_URL or the app URL (dev passes the Vite URL). */
  publicUrl?: string;
}

/** A running local back end. */
export interface LocalBackend { url: string; stop(): Promise<void> }

/** Starts every piece; on failure stops what already started and rethrows. */
export async function startLocalBackend(opts: LocalBackendOptions = {}): Promise<LocalBackend> {
  const name = opts.name ?? 'start';
  const dataDir = path.join(repoRoot, '.data', name);
  const appPort = opts.appPort ?? Number(process.env.PORT ?? 4310);
  const url = `http://127.0.0.1:${appPort}`;
  const stack: (() => Promise<void> | void)[] = [];
  const stop = async () => {
    while (stack.length) {
      const step = stack.pop()!;
      try { await step(); } catch (err) { console.error('while stopping:', err instanceof Error ? err.message : err); }
    }
  };
  try {
    console.log(`Starting MariaDB (data in ${path.relative(repoRoot, dataDir)}/mariadb) ...`);
    const db: PrivateMariaDB = await startPrivateMariaDB({ name, port: opts.dbPort ?? 3316 });
    stack.push(() => db.stop());
    const sequelize: Sequelize = createSequelize({}, { host: db.host, port: db.port, user: db.user, password: db.password, database: db.database });
    stack.push(() => sequelize.close());
    await migrate(sequelize);
    const seeded = await seedDemo(sequelize);
    if (seeded.users || seeded.patterns) console.log(`Demo data: ${seeded.users} account(s) and ${seeded.patterns} pattern(s) added.`);
    const changed = await changedDemoExamples();
    if (changed.length) {
      console.log(`Demo data: ${changed.map((f) => `examples/${f}`).join(', ')} changed since the demo patterns were made from ${changed.length === 1 ? 'it' : 'them'}. ` +
        'To see the new text, stop and run `npm run demo:reset` (it deletes all local data in .data/start, your own changes too), then `npm start`.');
    }
    await seedReviewDemo(sequelize);
    await seedShopDemo(sequelize);

    let smtp: FakeSmtp | null = null;
    let mailer: Mailer;
    if (process.env.SMTP_URL) {
      mailer = createMailer({ url: process.env.SMTP_URL });
    } else {
      smtp = await startFakeSmtp({ port: opts.smtpPort ?? 2526, outboxDir: path.join(dataDir, 'outbox') });
      stack.push(() => smtp!.close());
      mailer = createMailer({ host: smtp.host, port: smtp.port });
    }
    stack.push(() => mailer.close());

    // Payments: the real provider when STRIPE_* is set, else the local stand-in with throwaway keys.
    let payments: PaymentsConfig | null = paymentsConfigFromEnv();
    if (!payments) {
      const fake = await startFakePayments({ port: opts.paymentsPort ?? Number(process.env.PAYMENTS_FAKE_PORT ?? 4320) });
      stack.push(() => fake.close());
      fake.setWebhookUrl(`${url}/api/payments/webhook`);
      payments = { secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port, protocol: 'http' };
      console.log(`Payments: local stand-in on ${fake.url} (no real money).`);
    }

    const app = createApp({
      sequelize,
      mailer,
      jwtSecret: resolveJwtSecret(dataDir),
      storageDir: path.join(dataDir, 'uploads'),
      publicUrl: process.env.PUBLIC_URL ?? opts.publicUrl ?? url,
      outbox: smtp,
      distDir: opts.distDir,
      payments,
    });
    const server: Server = await new Promise((resolve, reject) => {
      const s = app.listen(appPort, '127.0.0.1', () => resolve(s));
      s.once('error', (err: NodeJS.ErrnoException) =>
        reject(err.code === 'EADDRINUSE' ? new Error(`Port ${appPort} is in use; set PORT to another port.`) : err));
    });
    stack.push(() => new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); }));
    return { url, stop };
  } catch (err) {
    await stop();
    throw err;
  }
}

/** The lines printed after start: URL and demo sign-ins. */
export function describeDemo(url: string): string {
  const accounts = DEMO_ACCOUNTS.map((a) => `    ${a.email.padEnd(30)} ${a.name} (${a.note})`).join('\n');
  return `\nLoopwright is running at ${url}\n\n  Demo sign-ins (local demo data only), password "${DEMO_PASSWORD}":\n${accounts}\n\n  Shop: ${url}/shop (payments go to the local stand-in unless STRIPE_SECRET_KEY is set)\n  Mail outbox (development): ${url}/api/dev/outbox\n  Press Ctrl-C to stop (MariaDB stops too).\n`;
}

/** Runs `stop` once on SIGINT/SIGTERM, then exits (130/143). */
export function stopOnSignals(stop: () => Promise<void>): void {
  let stopping = false;
  for (const [signal, code] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
    process.on(signal, () => {
      if (stopping) return;
      stopping = true;
      console.log(`\nStopping (${signal}) ...`);
      void stop().then(() => process.exit(code), () => process.exit(1));
    });
  }
}
