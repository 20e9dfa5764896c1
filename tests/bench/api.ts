/**
 * The HTTP figure of `npm run bench`: p99 latency of `GET /api/patterns/:id`
 * (Bearer token, the Lantern Mitts demo pattern) against p99 of
 * `GET /api/health`, both at 100 connections with autocannon (in a child
 * process), one after the other in the same run against the same server. Everything is private and
 * on loopback: its own MariaDB (`.data/bench`, port 3319 unless
 * BENCH_DB_PORT), a fake SMTP server on a free port, the app on a free port.
 * Everything started here is stopped at the end, also on failure.
 */
import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:http';
import { createRequire } from 'node:module';
import path from 'node:path';
import { promisify } from 'node:util';
import type autocannon from 'autocannon';
import { createApp } from '../../server/app.ts';
import { createSequelize } from '../../server/db/connection.ts';
import { startPrivateMariaDB } from '../../server/db/launcher.ts';
import { migrate } from '../../server/db/migrate.ts';
import { startFakeSmtp } from '../../server/fakes/smtp.ts';
import { createMailer } from '../../server/mail/mailer.ts';

const root = path.resolve(import.meta.dirname, '..', '..');
const run = promisify(execFile);
const cli = path.join(path.dirname(createRequire(import.meta.url).resolve('autocannon/package.json')), 'autocannon.js');

/** One autocannon run, reduced to what the bench reports (latencies in ms). */
export interface LoadRun { path: string; p50: number; p99: number; requestsPerSecond: number; requests: number; non2xx: number; errors: number }

/** The API figure with both runs. */
export interface ApiFigure { connections: number; seconds: number; pattern: LoadRun; health: LoadRun; p99Ratio: number }

/**
 * One autocannon run in its own process (the autocannon CLI with --json), so the load
 * generator does not share the server's event loop.
 */
async function load(url: string, urlPath: string, seconds: number, connections: number, headers: Record<string, string>): Promise<LoadRun> {
  const args = [cli, '-c', String(connections), '-d', String(seconds), '--json'];
  for (const [k, v] of Object.entries(headers)) args.push('-H', `${k}=${v}`);
  args.push(url + urlPath);
  const { stdout } = await run(process.execPath, args, { maxBuffer: 16 * 1024 * 1024 });
  const r = JSON.parse(stdout) as autocannon.Result;
  return {
    path: urlPath, p50: r.latency.p50, p99: r.latency.p99, requestsPerSecond: r.requests.average, requests: r.requests.total,
    non2xx: r.non2xx, errors: r.errors + r.timeouts,
  };
}

async function json(res: Response): Promise<Record<string, unknown>> {
  const body = await res.json() as Record<string, unknown>;
  if (!res.ok) throw new Error(`bench seed: ${res.status} ${JSON.stringify(body)}`);
  return body;
}

/** Starts the private stack, seeds one user and pattern, runs both loads, stops everything. */
export async function measureApi(seconds = 5, connections = 100): Promise<ApiFigure> {
  const stops: (() => Promise<void>)[] = [];
  try {
    const db = await startPrivateMariaDB({ name: 'bench', port: Number(process.env.BENCH_DB_PORT ?? 3319) });
    stops.push(() => db.stop());
    const sequelize = createSequelize({}, { host: db.host, port: db.port, user: db.user, password: db.password, database: db.database });
    stops.push(() => sequelize.close());
    await migrate(sequelize);
    const smtp = await startFakeSmtp({ port: 0, host: '127.0.0.1' });
    stops.push(() => smtp.close());
    const mailer = createMailer({ host: smtp.host, port: smtp.port });
    stops.push(async () => mailer.close());
    const generous = { windowMs: 60_000, limit: 1_000_000 };
    const app = createApp({
      sequelize, mailer, jwtSecret: randomBytes(32).toString('hex'), storageDir: path.join(root, '.data', 'bench', 'uploads'),
      env: 'test', distDir: null, bcryptCost: 10, rateLimits: { login: generous, register: generous, reset: generous },
    });
    // Count requests whose handler has not answered yet: autocannon stops at its deadline and
    // drops its sockets with requests still being handled, and those handlers must finish before
    // the database goes away (else they log errors at shutdown). A dropped socket does not stop
    // a handler, so count the handler's own res.end, not the socket.
    let inFlight = 0;
    const server = createServer((req, res) => {
      inFlight++;
      let done = false;
      const end = res.end.bind(res) as (...args: unknown[]) => typeof res;
      res.end = ((...args: unknown[]) => { if (!done) { done = true; inFlight--; } return end(...args); }) as typeof res.end;
      app(req, res);
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
    stops.push(async () => {
      server.close();
      for (let waited = 0; inFlight > 0 && waited < 15_000; waited += 50) await new Promise((r) => setTimeout(r, 50));
      server.closeAllConnections();
    });
    const address = server.address();
    if (!address || typeof address === 'string') throw new Error('bench server has no port');
    const url = `http://127.0.0.1:${address.port}`;

    // Seed through the API itself: a designer and the Lantern Mitts pattern.
    const email = `bench-${Date.now()}@saltmarsh.example`, password = 'bench-password-1';
    await json(await fetch(`${url}/api/auth/register`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password, name: 'Bench Designer' }) }));
    const login = await json(await fetch(`${url}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) }));
    const auth = { authorization: `Bearer ${String(login.token)}` };
    const source = readFileSync(path.join(root, 'examples', 'lantern-mitts.loop'), 'utf8');
    const created = await json(await fetch(`${url}/api/patterns`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify({ title: 'Lantern Mitts', source }) }));
    const id = (created.pattern as { id: number }).id;
    const check = await fetch(`${url}/api/patterns/${id}`, { headers: auth });
    if (check.status !== 200) throw new Error(`bench: GET /api/patterns/${id} gave ${check.status}`);

    // A short warm-up of both, then the measured runs side by side.
    await load(url, '/api/health', 1, connections, {});
    await load(url, `/api/patterns/${id}`, 1, connections, auth);
    const health = await load(url, '/api/health', seconds, connections, {});
    const pattern = await load(url, `/api/patterns/${id}`, seconds, connections, auth);
    return { connections, seconds, pattern, health, p99Ratio: pattern.p99 / health.p99 };
  } finally {
    for (const stop of stops.reverse()) {
      try { await stop(); } catch (err) { console.error(`bench: stopping failed: ${err instanceof Error ? err.message : String(err)}`); }
    }
  }
}
