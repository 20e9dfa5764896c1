/**
 * Browser-test harness: the real Express app (server/app.ts) on a free
 * loopback port, backed by the test MariaDB from the env that
 * scripts/test.ts sets, serving the built client from dist/ (rebuilt when
 * stale), and Debian's Chromium driven by playwright-core.
 */
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import type { Sequelize } from 'sequelize';
import { createApp } from '../../server/app.ts';
import { createSequelize } from '../../server/db/connection.ts';
import { migrate } from '../../server/db/migrate.ts';
import { DEMO_PASSWORD, seedDemo } from '../../server/db/seed.ts';
import { startFakeSmtp, type FakeSmtp } from '../../server/fakes/smtp.ts';
import { createMailer, type Mailer } from '../../server/mail/mailer.ts';
import { buildClient, staleReason } from '../../scripts/client-build.ts';

export const repoRoot = path.resolve(import.meta.dirname, '..', '..');
export const screenshotDir = path.join(repoRoot, '.data', 'screenshots');
export const DESIGNER = { email: 'designer@saltmarsh.example', password: DEMO_PASSWORD, name: 'Maren Tolley' };

/** A running app plus a browser. */
export interface Harness {
  baseUrl: string;
  context: BrowserContext;
  /** Signs in over HTTP and returns a Bearer token (for arranging data). */
  apiToken(email: string, password: string): Promise<string>;
  /** JSON request to the API with a Bearer token. */
  api<T>(token: string, method: string, url: string, body?: unknown): Promise<{ status: number; body: T }>;
  stop(): Promise<void>;
}

/** Starts database connection, app, fake SMTP and Chromium; builds dist/ first when stale. */
export async function startHarness(): Promise<Harness> {
  const reason = staleReason();
  if (reason) {
    console.log(`building the client (${reason})`);
    if (!(await buildClient())) throw new Error('vite build failed');
  }
  mkdirSync(screenshotDir, { recursive: true });

  const sequelize: Sequelize = createSequelize(process.env);
  await migrate(sequelize);
  await seedDemo(sequelize);
  const smtp: FakeSmtp = await startFakeSmtp({ port: 0 });
  const mailer: Mailer = createMailer({ host: smtp.host, port: smtp.port });
  // Listen first, so mailed links can point at this server's own port.
  const server: Server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const app = createApp({
    publicUrl: baseUrl,
    sequelize,
    mailer,
    jwtSecret: process.env.JWT_SECRET ?? 'e2e-secret',
    env: 'test',
    outbox: smtp,
    distDir: path.join(repoRoot, 'dist'),
    storageDir: path.join(repoRoot, '.data', 'test', 'uploads'),
    bcryptCost: 10,
  });
  server.on('request', app);

  const userDataDir = mkdtempSync(path.join(os.tmpdir(), 'loopwright-e2e-'));
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
    viewport: { width: 1280, height: 800 },
  });

  const api = async <T>(token: string, method: string, url: string, body?: unknown) => {
    const res = await fetch(baseUrl + url, {
      method,
      headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await res.text();
    return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
  };

  return {
    baseUrl,
    context,
    api,
    async apiToken(email, password) {
      const res = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password }) });
      if (res.status !== 200) throw new Error(`login failed: ${res.status} ${await res.text()}`);
      return ((await res.json()) as { token: string }).token;
    },
    async stop() {
      await context.close().catch(() => {});
      rmSync(userDataDir, { recursive: true, force: true });
      await new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); });
      mailer.close();
      await smtp.close();
      await sequelize.close();
    },
  };
}

/** Signs in through the sign-in page and waits for the pattern library. */
export async function signIn(page: Page, baseUrl: string, who = DESIGNER): Promise<void> {
  await page.goto(`${baseUrl}/patterns`);
  await page.waitForURL(/\/sign-in/);
  await page.getByLabel('E-mail').fill(who.email);
  await page.getByLabel('Password').fill(who.password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL(/\/patterns$/);
}

/**
 * Replaces 1-based `line` of the editor with `text`, typing it as a person
 * would (the editor's own keymap moves and selects).
 */
export async function replaceEditorLine(page: Page, line: number, text: string): Promise<void> {
  const content = page.locator('.cm-content');
  await content.click();
  await page.keyboard.press('Control+Home');
  for (let i = 1; i < line; i++) await page.keyboard.press('ArrowDown');
  await page.keyboard.press('Home');
  await page.keyboard.press('Shift+End');
  await page.keyboard.insertText(text);
  await page.keyboard.press('Escape'); // close any completion list
}

/** Saves a screenshot under .data/screenshots/. */
export async function shot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`) });
}
