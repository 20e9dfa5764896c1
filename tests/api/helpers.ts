/**
 * Shared set-up for the API tests: a Sequelize connection from the env the
 * test runner sets (DB_HOST, DB_PORT, DB_USER, DB_PASSWORD, DB_NAME),
 * migrations, a fake SMTP server on a free port, and the Express app with
 * generous rate limits (the rate-limit test builds its own app). Each file
 * creates its own users with unique e-mails, so files do not depend on one
 * another.
 */
import { randomBytes } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { Express } from 'express';
import type { Sequelize } from 'sequelize';
import request from 'supertest';
import { createApp, type AppOptions } from '../../server/app.ts';
import { createSequelize } from '../../server/db/connection.ts';
import { migrate } from '../../server/db/migrate.ts';
import { startFakeSmtp, type FakeSmtp } from '../../server/fakes/smtp.ts';
import { createMailer, type Mailer } from '../../server/mail/mailer.ts';
import { User, type GlobalRole } from '../../server/models/index.ts';

export const PUBLIC_URL = 'http://loopwright.test';
export const JWT_SECRET = process.env.JWT_SECRET ?? 'api-tests-secret';
export const PASSWORD = 'correct horse battery';
/** An extra origin the test app accepts for cookie-authenticated writes (like the Vite dev server). */
export const STUDIO_ORIGIN = 'http://studio.test';

/** Everything a test file needs; call `close()` in afterAll. */
export interface ApiHarness {
  app: Express;
  sequelize: Sequelize;
  smtp: FakeSmtp;
  mailer: Mailer;
  storageDir: string;
  close(): Promise<void>;
}

/** Connects, migrates, starts a fake SMTP server and builds the app. */
export async function startHarness(overrides: Partial<AppOptions> = {}): Promise<ApiHarness> {
  if (!process.env.DB_PORT) throw new Error('DB_* variables are missing: run the API tests through `npm test`.');
  const sequelize = createSequelize(process.env);
  await migrate(sequelize);
  const smtp = await startFakeSmtp({ port: 0 });
  const mailer = createMailer({ host: smtp.host, port: smtp.port });
  const base = process.env.LOOPWRIGHT_DATA_DIR ?? os.tmpdir();
  const storageDir = mkdtempSync(path.join(base, 'uploads-'));
  const harness = { sequelize, smtp, mailer, storageDir };
  return {
    ...harness,
    app: buildApp(harness, overrides),
    async close() {
      mailer.close();
      await smtp.close();
      await sequelize.close();
      rmSync(storageDir, { recursive: true, force: true });
    },
  };
}

/**
 * A further app on the same connection, mailer and outbox (models are bound
 * to one Sequelize instance per process, so a second connection must not be
 * opened in the same file).
 */
export function buildApp(h: Pick<ApiHarness, 'sequelize' | 'smtp' | 'mailer' | 'storageDir'>, overrides: Partial<AppOptions> = {}): Express {
  return createApp({
    sequelize: h.sequelize,
    mailer: h.mailer,
    jwtSecret: JWT_SECRET,
    storageDir: h.storageDir,
    publicUrl: PUBLIC_URL,
    outbox: h.smtp,
    env: 'test',
    distDir: null,
    allowedOrigins: [STUDIO_ORIGIN],
    bcryptCost: 10,
    rateLimits: { login: { windowMs: 60_000, limit: 10_000 }, register: { windowMs: 60_000, limit: 10_000 }, reset: { windowMs: 60_000, limit: 10_000 } },
    ...overrides,
  });
}

/** An e-mail address no other test uses. */
export function uniqueEmail(label: string): string {
  return `${label}-${randomBytes(5).toString('hex')}@test.example`;
}

/** A signed-in test account. `auth` is the Bearer header value. */
export interface TestUser { id: number; email: string; name: string; token: string; auth: string }

/** Registers through the API, then sets global roles directly (e.g. admin) when asked. */
export async function makeUser(app: Express, label: string, roles?: GlobalRole[]): Promise<TestUser> {
  const email = uniqueEmail(label);
  const name = `Test ${label}`;
  const reg = await request(app).post('/api/auth/register').send({ email, password: PASSWORD, name });
  if (reg.status !== 201) throw new Error(`register failed: ${reg.status} ${JSON.stringify(reg.body)}`);
  if (roles) {
    const user = await User.findByPk(reg.body.user.id as number);
    user!.roles = roles;
    await user!.save();
  }
  const login = await request(app).post('/api/auth/login').send({ email, password: PASSWORD });
  if (login.status !== 200) throw new Error(`login failed: ${login.status}`);
  return { id: reg.body.user.id, email, name, token: login.body.token, auth: `Bearer ${login.body.token}` };
}

/** Extracts the token from a mailed link ending in `/<prefix>/<token>`. */
export function tokenFromLink(link: string, prefix: string): string {
  const m = new RegExp(`/${prefix}/([A-Za-z0-9_-]+)$`).exec(link);
  if (!m?.[1]) throw new Error(`no ${prefix} token in ${link}`);
  return m[1];
}
