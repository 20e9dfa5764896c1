/**
 * The whole purchase in Debian's Chromium, against the real app, the test
 * MariaDB, the fake SMTP server and the local payment stand-in (reached by
 * the app through the official SDK): a signed-out visitor browses the shop,
 * signs in as the demo knitter, buys, pays on the stand-in's page, comes
 * back to the thank-you page, finds the pattern in the library and can read
 * and export the released revision; the receipt arrives at the fake SMTP server. Then
 * the designer sees the order in the sales table and downloads the CSV.
 */
import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdtempSync, rmSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';
import type { Sequelize } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildClient, staleReason } from '../../scripts/client-build.ts';
import { createApp } from '../../server/app.ts';
import { createSequelize } from '../../server/db/connection.ts';
import { migrate } from '../../server/db/migrate.ts';
import { DEMO_PASSWORD, seedDemo } from '../../server/db/seed.ts';
import { startFakePayments, type FakePayments } from '../../server/fakes/payments.ts';
import { startFakeSmtp, type FakeSmtp } from '../../server/fakes/smtp.ts';
import { createMailer, type Mailer } from '../../server/mail/mailer.ts';
import { Pattern, User } from '../../server/models/index.ts';
import { repoRoot, screenshotDir, shot } from './harness.ts';

const KNITTER = { email: 'knitter@saltmarsh.example', password: DEMO_PASSWORD };
/** A designer of this test's own (the demo designer's patterns are reset by the seed test, and orders keep their patterns). */
const SELLER = { email: `shop-seller-${randomBytes(4).toString('hex')}@test.example`, password: 'shop seller password', name: 'Maren Tolley (shop test)' };
const SOURCE = [
  'title "Tidepool Cowl"', 'designer "Maren Tolley"', 'sizes S M L', 'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Sea lavender" #6a5397', 'yarn B "Foam" #eeeae0', 'work in the round', 'cast on 84/96/108 in A',
  'rounds 1-4: (k1, p1) to end', 'rounds 5-12: (k3 in A, k1 in B) to end', 'rounds 13-20: (k1 in A, k3 in B) to end', '',
].join('\n');

let sequelize: Sequelize;
let smtp: FakeSmtp;
let mailer: Mailer;
let fake: FakePayments;
let server: Server;
let context: BrowserContext;
let userDataDir: string;
let baseUrl: string;
let title: string;
let patternId: number;
let listingId: number;

async function api<T>(token: string, method: string, url: string, body?: unknown): Promise<{ status: number; body: T }> {
  const res = await fetch(baseUrl + url, { method, headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' }, body: body === undefined ? undefined : JSON.stringify(body) });
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : null) as T };
}
async function token(email: string, password: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password }) });
  return ((await res.json()) as { token: string }).token;
}

beforeAll(async () => {
  const reason = staleReason();
  if (reason && !(await buildClient())) throw new Error('vite build failed');
  sequelize = createSequelize(process.env);
  await migrate(sequelize);
  await seedDemo(sequelize);
  smtp = await startFakeSmtp({ port: 0 });
  mailer = createMailer({ host: smtp.host, port: smtp.port });
  fake = await startFakePayments({ port: 0 });
  // Listen first: the app's public URL (for the payment page's return links) is its own address.
  server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const app = createApp({
    sequelize, mailer, jwtSecret: process.env.JWT_SECRET ?? 'e2e-secret', env: 'test', outbox: smtp, publicUrl: baseUrl,
    distDir: path.join(repoRoot, 'dist'), storageDir: path.join(repoRoot, '.data', 'test', 'uploads'), bcryptCost: 10,
    payments: { secretKey: fake.secretKey, webhookSecret: fake.webhookSecret, host: fake.host, port: fake.port, protocol: 'http' },
  });
  server.on('request', app);
  fake.setWebhookUrl(`${baseUrl}/api/payments/webhook`);

  // Arrange: a fresh released pattern of a fresh designer, on sale (release set directly; the review flow has its own tests).
  const reg = await fetch(`${baseUrl}/api/auth/register`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify(SELLER) });
  expect(reg.status).toBe(201);
  await User.update({ roles: ['designer'] }, { where: { email: SELLER.email } });
  const designer = await token(SELLER.email, SELLER.password);
  title = `Tidepool Cowl ${randomBytes(3).toString('hex')}`;
  const created = await api<{ pattern: { id: number } }>(designer, 'POST', '/api/patterns', { title, source: SOURCE });
  patternId = created.body.pattern.id;
  await Pattern.update({ status: 'released', releasedRevision: 1, approvedRevision: 1 }, { where: { id: patternId } });
  const listed = await api<{ listing: { id: number } }>(designer, 'PUT', `/api/patterns/${patternId}/listing`, {
    currency: 'EUR', amount: 650, taxInclusive: true, description: 'A two-colour wave cowl worked in the round, three sizes.', photoIds: [], active: true,
  });
  expect(listed.status).toBe(200);
  listingId = listed.body.listing.id;

  userDataDir = mkdtempSync(path.join(os.tmpdir(), 'loopwright-shop-e2e-'));
  context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: '/usr/bin/chromium', headless: true, viewport: { width: 1280, height: 800 },
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run', '--disable-quic'],
  });
}, 240_000);

afterAll(async () => {
  await context?.close().catch(() => {});
  if (userDataDir) rmSync(userDataDir, { recursive: true, force: true });
  await fake?.close();
  if (server) await new Promise<void>((resolve) => { server.closeAllConnections(); server.close(() => resolve()); });
  mailer?.close();
  await smtp?.close();
  await sequelize?.close();
});

describe('buying a pattern in Chromium', () => {
  it('browse signed out, sign in, buy, pay on the payment page, find it in the library, receive the receipt', async () => {
    const page = await context.newPage();
    await page.goto(`${baseUrl}/shop`);
    const card = page.getByRole('link', { name: new RegExp(title) });
    await card.waitFor();
    await expect.poll(() => card.textContent()).toContain('€6.50');
    await shot(page, 'shop-browse');
    await card.click();
    await page.getByRole('heading', { name: title }).waitFor();
    await page.getByRole('link', { name: 'Sign in to buy' }).click();
    await page.getByLabel('E-mail').fill(KNITTER.email);
    await page.getByLabel('Password').fill(KNITTER.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(new RegExp(`/shop/${listingId}$`));
    await page.getByRole('button', { name: 'Buy this pattern' }).waitFor();
    await shot(page, 'shop-listing');

    smtp.clear();
    await page.getByRole('button', { name: 'Buy this pattern' }).click();
    await page.waitForURL((u) => u.toString().startsWith(`${fake.url}/pay/cs_test_`));
    await page.getByRole('heading', { name: title }).waitFor();
    await shot(page, 'shop-payment-page');
    await page.getByRole('button', { name: /^Pay / }).click();

    await page.waitForURL(/\/shop\/thanks\?order=\d+/);
    await page.getByRole('heading', { name: 'Thank you' }).waitFor({ timeout: 15_000 });
    await shot(page, 'shop-thanks');

    await page.getByRole('link', { name: 'Your patterns' }).click();
    await page.waitForURL(/\/patterns$/);
    await page.getByRole('link', { name: title }).waitFor();
    await shot(page, 'shop-library');

    const receipt = await smtp.waitFor(KNITTER.email, 10_000);
    expect(receipt.subject).toContain(title);
    expect(receipt.text).toContain('€6.50');
    expect(receipt.links).toContain(`${baseUrl}/patterns/${patternId}`);

    // The knitter may now read the released revision (what an export starts from).
    const knitter = await token(KNITTER.email, KNITTER.password);
    const revision = await api<{ revision: { number: number; source: string } }>(knitter, 'GET', `/api/patterns/${patternId}/revisions/1`);
    expect(revision.status).toBe(200);
    expect(revision.body.revision.source).toContain('rounds 5-12');
    // ... and export it (the export route follows the same access policy).
    const exported = await fetch(`${baseUrl}/api/patterns/${patternId}/revisions/1/export?format=txt`, { headers: { Authorization: `Bearer ${knitter}` } });
    expect(exported.status).toBe(200);
    expect(await exported.text()).toMatch(/cast on/i);
    await page.close();
  }, 120_000);

  it('shows the order to the designer in the sales table with a CSV download', async () => {
    const page = await context.newPage();
    await page.goto(`${baseUrl}/account`);
    // Sign the knitter out, then in as the designer.
    await page.evaluate(() => fetch('/api/auth/logout', { method: 'POST', credentials: 'include' }));
    await page.goto(`${baseUrl}/sales`);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(SELLER.email);
    await page.getByLabel('Password').fill(SELLER.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/sales$/);
    const row = page.getByRole('row', { name: new RegExp(title) }).filter({ hasText: 'Sorrel Quayle' });
    await row.waitFor();
    await expect.poll(() => row.textContent()).toMatch(/Paid/);
    await shot(page, 'shop-sales');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download CSV' }).click()]);
    const file = path.join(screenshotDir, 'sales.csv');
    await download.saveAs(file);
    const { readFileSync } = await import('node:fs');
    expect(readFileSync(file, 'utf8')).toContain(title);
    await page.close();
  }, 60_000);
});
