/**
 * The HTTP figure of `npm run bench`: p99 latency of `GET /api/patterns/:id`
 * (Bearer token, the Lantern Mitts demo pattern) against p99 of
 * `GET /api/health`, both at 100 connections with autocannon (in a child
 * process), against the same server in the same run.
 *
 * One tail latency of one short load is noisy on a shared 2-core machine
 * (a single GC pause or another process's burst moves a p99 by 2x). So the
 * routes are loaded in several rounds after a warm-up of both; each round
 * loads health and the pattern one after the other, alternating which goes
 * first, so both routes see the same spread of machine conditions. The
 * figure is the p99 of all answers of all rounds of the pattern read over
 * the same for health; the ratio of each round alone is reported beside it,
 * with the app's CPU time per request of each route.
 *
 * Everything is private and on loopback: its own MariaDB (`.data/bench`,
 * port 3319 unless BENCH_DB_PORT), a fake SMTP server on a free port, the
 * app on a free port. Everything started here is stopped at the end, also on
 * failure.
 */
import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:http';
import path from 'node:path';
import { promisify } from 'node:util';
import { createApp } from '../../server/app.ts';
import { createSequelize } from '../../server/db/connection.ts';
import { startPrivateMariaDB } from '../../server/db/launcher.ts';
import { migrate } from '../../server/db/migrate.ts';
import { startFakeSmtp } from '../../server/fakes/smtp.ts';
import { createMailer } from '../../server/mail/mailer.ts';

const root = path.resolve(import.meta.dirname, '..', '..');
const run = promisify(execFile);

/** One autocannon run, reduced to what the bench reports (latencies in ms). */
export interface LoadRun {
  path: string; p50: number; p99: number; requestsPerSecond: number; requests: number; non2xx: number; errors: number;
  /** CPU time of the app's process (this one; autocannon runs in a child) per request, in ms: less moved by other work on the machine than latency. */
  serverCpuMsPerRequest: number;
}

/** One round: health and the pattern loaded one after the other; `ratio` = pattern.p99 / health.p99. */
export interface ApiRound { first: 'health' | 'pattern'; health: LoadRun; pattern: LoadRun; ratio: number }

/** Settings of {@link measureApi}; defaults in {@link API_BENCH_DEFAULTS}. */
export interface ApiBenchOptions {
  /** Seconds of each measured load (per route per round). */
  seconds: number;
  /** Concurrent connections of each load. */
  connections: number;
  /** Measured rounds; the figure is the median of their ratios. */
  rounds: number;
  /** Seconds of the untimed warm-up load of each route before the first round. */
  warmupSeconds: number;
}

/**
 * 7 rounds of 4 s per route at 100 connections after 3 s of warm-up per route
 * (about 60 s of load). Seven short rounds rather than a few long ones: the
 * median then rests on more independent pairs, and a burst of other work
 * spoils one round instead of a whole figure.
 */
export const API_BENCH_DEFAULTS: ApiBenchOptions = { seconds: 4, connections: 100, rounds: 7, warmupSeconds: 3 };

/**
 * One route over all rounds: p50 and p99 of every 2xx answer of every round
 * taken together (ms), and medians over the rounds of requests per second
 * and app CPU per request.
 */
export interface RouteSummary { p50: number; p99: number; answers: number; requestsPerSecond: number; serverCpuMsPerRequest: number }

/** The API figure: pooled p99 of the pattern read over pooled p99 of health, the per-round ratios beside it, and every round. */
export interface ApiFigure {
  connections: number;
  seconds: number;
  rounds: ApiRound[];
  /** The headline `apiP99VsHealth`: pattern.p99 / health.p99, each over all rounds' answers together. */
  p99Ratio: number;
  /** The ratio of each round alone: median, lowest and highest (how much one round can say). */
  roundRatios: { median: number; min: number; max: number };
  /** Median over the rounds of the app's CPU per pattern request over its CPU per health request (a cross-check less moved by other work). */
  cpuRatio: number;
  health: RouteSummary;
  pattern: RouteSummary;
}

/** A running private stack with one designer and the Lantern Mitts pattern. */
export interface ApiStack { url: string; auth: Record<string, string>; patternPath: string; stop(): Promise<void> }

/** One load's summary and the response time of each of its 2xx answers (ms). */
export interface LoadResult { run: LoadRun; times: number[] }

const loadChild = path.join(import.meta.dirname, 'api-load.ts');

/**
 * One autocannon run in its own process (api-load.ts, started with this
 * process's own loader flags), so the load generator does not share the
 * server's event loop.
 */
export async function load(url: string, urlPath: string, seconds: number, connections: number, headers: Record<string, string>): Promise<LoadResult> {
  const cpu = process.cpuUsage();
  const { stdout } = await run(process.execPath, [...process.execArgv, loadChild, JSON.stringify({ url: url + urlPath, seconds, connections, headers })], { maxBuffer: 64 * 1024 * 1024 });
  const used = process.cpuUsage(cpu);
  const r = JSON.parse(stdout) as Omit<LoadRun, 'path' | 'serverCpuMsPerRequest'> & { times: number[] };
  const { times, ...rest } = r;
  return { run: { path: urlPath, ...rest, serverCpuMsPerRequest: (used.user + used.system) / 1000 / Math.max(1, r.requests) }, times };
}

async function json(res: Response): Promise<Record<string, unknown>> {
  const body = await res.json() as Record<string, unknown>;
  if (!res.ok) throw new Error(`bench seed: ${res.status} ${JSON.stringify(body)}`);
  return body;
}

async function stopAll(stops: (() => Promise<void>)[]): Promise<void> {
  for (const stop of stops.reverse()) {
    try { await stop(); } catch (err) { console.error(`bench: stopping failed: ${err instanceof Error ? err.message : String(err)}`); }
  }
}

/** Starts the private stack (database, SMTP, app) and seeds one designer and the Lantern Mitts pattern through the API. */
export async function startApiStack(): Promise<ApiStack> {
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
    const patternPath = `/api/patterns/${(created.pattern as { id: number }).id}`;
    const check = await fetch(url + patternPath, { headers: auth });
    if (check.status !== 200) throw new Error(`bench: GET ${patternPath} gave ${check.status}`);
    // The figure is for the real answer: source plus the compile summary of three sizes (about 10 KB).
    const body = await check.json() as { latestRevision?: { summary?: { sizes?: unknown[] } | null } };
    if (!body.latestRevision?.summary?.sizes?.length) throw new Error(`bench: GET ${patternPath} has no compile summary (did the compiler fail on the demo pattern?)`);
    return { url, auth, patternPath, stop: () => stopAll(stops) };
  } catch (err) {
    await stopAll(stops);
    throw err;
  }
}

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const mid = Math.floor(s.length / 2);
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
};

/** Fails the run when a load saw errors or non-2xx answers: its latencies would not be the route's. */
function checked(r: LoadResult): LoadResult {
  if (r.run.non2xx || r.run.errors) throw new Error(`bench: ${r.run.path} had ${r.run.non2xx} non-2xx answers and ${r.run.errors} errors or timeouts`);
  return r;
}

/** The value below which `q` (0..1) of the sorted `xs` lie (nearest rank). */
function quantile(sorted: Float64Array, q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
}

/** Runs the warm-up and the rounds against a running stack (see the module comment). */
export async function measureApiOn(stack: ApiStack, options: Partial<ApiBenchOptions> = {}): Promise<ApiFigure> {
  const o = { ...API_BENCH_DEFAULTS, ...options };
  const { url, auth, patternPath } = stack;
  const all = { health: [] as number[][], pattern: [] as number[][] };
  const health = () => load(url, '/api/health', o.seconds, o.connections, {}).then(checked).then((r) => { all.health.push(r.times); return r.run; });
  const pattern = () => load(url, patternPath, o.seconds, o.connections, auth).then(checked).then((r) => { all.pattern.push(r.times); return r.run; });
  if (o.warmupSeconds > 0) {
    await load(url, '/api/health', o.warmupSeconds, o.connections, {});
    await load(url, patternPath, o.warmupSeconds, o.connections, auth);
  }
  const rounds: ApiRound[] = [];
  for (let i = 0; i < o.rounds; i++) {
    // Alternate the order so that a slow drift of the machine's load does not favour one route.
    const first = i % 2 === 0 ? 'health' : 'pattern';
    const [h, p] = first === 'health' ? [await health(), await pattern()] : await pattern().then(async (p) => [await health(), p]);
    rounds.push({ first, health: h, pattern: p, ratio: p.p99 / h.p99 });
  }
  const ratios = rounds.map((r) => r.ratio);
  const pooled = (lists: number[][]) => {
    const sorted = Float64Array.from(lists.flat()).sort();
    return { p50: quantile(sorted, 0.5), p99: quantile(sorted, 0.99), answers: sorted.length };
  };
  const summary = (pick: (r: ApiRound) => LoadRun, times: number[][]): RouteSummary => ({
    ...pooled(times),
    requestsPerSecond: median(rounds.map((r) => pick(r).requestsPerSecond)),
    serverCpuMsPerRequest: median(rounds.map((r) => pick(r).serverCpuMsPerRequest)),
  });
  const h = summary((r) => r.health, all.health), p = summary((r) => r.pattern, all.pattern);
  return {
    connections: o.connections, seconds: o.seconds, rounds,
    p99Ratio: p.p99 / h.p99,
    roundRatios: { median: median(ratios), min: Math.min(...ratios), max: Math.max(...ratios) },
    cpuRatio: median(rounds.map((r) => r.pattern.serverCpuMsPerRequest / r.health.serverCpuMsPerRequest)),
    health: h, pattern: p,
  };
}

/** Starts the private stack, measures (see {@link measureApiOn}), stops everything. */
export async function measureApi(options: Partial<ApiBenchOptions> = {}): Promise<ApiFigure> {
  const stack = await startApiStack();
  try {
    return await measureApiOn(stack, options);
  } finally {
    await stack.stop();
  }
}

/** One line per round and the headline, for the printed bench output. */
export function formatApiFigure(f: ApiFigure): string {
  const run = (r: LoadRun) => `p99 ${r.p99} ms, p50 ${r.p50} ms, ${Math.round(r.requestsPerSecond)} req/s, app CPU ${r.serverCpuMsPerRequest.toFixed(2)} ms/req`;
  const all = (r: RouteSummary) => `p99 ${r.p99.toFixed(0)} ms, p50 ${r.p50.toFixed(0)} ms over ${r.answers} answers`;
  return [
    `API load: ${f.rounds.length} rounds of ${f.seconds} s per route at ${f.connections} connections, alternating which route goes first, after a warm-up of both`,
    ...f.rounds.map((r, i) => `  round ${i + 1} (${r.first} first): pattern ${run(r.pattern)} | health ${run(r.health)} | ratio ${r.ratio.toFixed(2)}`),
    `  all rounds together: pattern ${all(f.pattern)} | health ${all(f.health)}`,
    `apiP99VsHealth ${f.p99Ratio.toFixed(2)} (p99 of all rounds' answers of each route), goal <= 3; ` +
      `single rounds: median ${f.roundRatios.median.toFixed(2)}, ${f.roundRatios.min.toFixed(2)} to ${f.roundRatios.max.toFixed(2)}; ` +
      `app CPU per request, pattern over health: ${f.cpuRatio.toFixed(2)} (median)`,
  ].join('\n');
}
