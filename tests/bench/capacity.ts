/**
 * The capacity numbers of `npm run bench` (docs/scaling.md, "When to grow"):
 * not goal figures but the two numbers that decide when Loopwright needs
 * more than one machine.
 * - Revision saves: `clients` designers, each saving their own copy of the
 *   Lantern Mitts demo pattern one save after another for `seconds`
 *   (save-load.ts, in its own process), against the private stack of the
 *   HTTP figure. Reported: saves per second, p50 and p99 of a save, and the
 *   CPU per save of the app process and of MariaDB (from /proc), from which
 *   the saves one core can take.
 * - Export CPU: each format (PDF, PNG, SVG, text) of each demo pattern,
 *   built by `runExport` in this process, CPU milliseconds of the fastest
 *   of three (the export worker thread runs the same function).
 */
import { execFile } from 'node:child_process';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { promisify } from 'node:util';
import { runExport, type ExportFormat } from '../../server/services/exports/build.ts';
import type { ApiStack } from './api.ts';
import { processCpuMs } from './process-cpu.ts';

const root = path.resolve(import.meta.dirname, '..', '..');
const run = promisify(execFile);
const saveChild = path.join(import.meta.dirname, 'save-load.ts');

/** Saves under load. */
export interface SaveCapacity {
  clients: number; seconds: number; saves: number; other: number;
  savesPerSecond: number; p50: number; p99: number;
  /** CPU per save in ms: the app's process, and MariaDB's (null when /proc cannot tell). */
  appCpuMsPerSave: number; dbCpuMsPerSave: number | null;
  /** 1000 / appCpuMsPerSave: saves one core of app CPU can take. */
  savesPerAppCore: number;
}

/** Export CPU per format, fastest of three, per demo pattern (ms). */
export interface ExportCapacity { pattern: string; format: ExportFormat; cpuMs: number; bytes: number }

function benchDbPid(): number | null {
  try {
    const pid = Number(readFileSync(path.join(root, '.data', 'bench', 'mysqld.pid'), 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

const quantile = (sorted: number[], q: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))] ?? NaN;

async function post(url: string, auth: string, body: unknown): Promise<Record<string, unknown>> {
  const res = await fetch(url, { method: 'POST', headers: { authorization: auth, 'content-type': 'application/json' }, body: JSON.stringify(body) });
  const json = await res.json() as Record<string, unknown>;
  if (res.status !== 201) throw new Error(`bench capacity: POST ${url} gave ${res.status} ${JSON.stringify(json)}`);
  return json;
}

/** Saves for `seconds` from `clients` designers at once, after a short warm-up (see the module comment). */
export async function measureSaves(stack: ApiStack, clients = 8, seconds = 6): Promise<SaveCapacity> {
  const auth = stack.auth.authorization;
  const source = readFileSync(path.join(root, 'examples', 'lantern-mitts.loop'), 'utf8');
  const patterns: { id: number; base: number }[] = [];
  for (let i = 0; i < clients; i++) {
    const created = await post(`${stack.url}/api/patterns`, auth, { title: `Lantern Mitts, bench copy ${i + 1}`, source });
    const id = (created.pattern as { id: number }).id;
    const read = await (await fetch(`${stack.url}/api/patterns/${id}`, { headers: stack.auth })).json() as { latestRevision: { number: number } };
    patterns.push({ id, base: read.latestRevision.number });
  }
  const load = async (secs: number) => {
    const { stdout } = await run(process.execPath, [...process.execArgv, saveChild, JSON.stringify({ url: stack.url, seconds: secs, auth, patterns, source })], { maxBuffer: 64 * 1024 * 1024 });
    const r = JSON.parse(stdout) as { saves: number; seconds: number; other: number; times: number[] };
    // The child's bases moved on; so must ours for the next load.
    const reread = await Promise.all(patterns.map(async (p) => (await (await fetch(`${stack.url}/api/patterns/${p.id}`, { headers: stack.auth })).json() as { latestRevision: { number: number } }).latestRevision.number));
    reread.forEach((n, i) => { patterns[i].base = n; });
    return r;
  };
  await load(2); // warm-up
  const dbPid = benchDbPid();
  const app0 = process.cpuUsage(), db0 = processCpuMs(dbPid);
  const r = await load(seconds);
  const app = process.cpuUsage(app0), db1 = processCpuMs(dbPid);
  if (r.saves === 0) throw new Error('bench capacity: no save succeeded');
  const sorted = [...r.times].sort((a, b) => a - b);
  const appCpuMsPerSave = (app.user + app.system) / 1000 / r.saves;
  return {
    clients, seconds: r.seconds, saves: r.saves, other: r.other,
    savesPerSecond: r.saves / r.seconds, p50: quantile(sorted, 0.5), p99: quantile(sorted, 0.99),
    appCpuMsPerSave, dbCpuMsPerSave: db0 !== null && db1 !== null ? (db1 - db0) / r.saves : null,
    savesPerAppCore: 1000 / appCpuMsPerSave,
  };
}

/** Every format of every demo pattern, fastest of `runs` (CPU ms of this process, native threads included). */
export async function measureExports(runs = 3): Promise<ExportCapacity[]> {
  const out: ExportCapacity[] = [];
  for (const file of ['lantern-mitts.loop', 'tidepool-cowl.loop', 'quarry-tote-panel.loop']) {
    const source = readFileSync(path.join(root, 'examples', file), 'utf8');
    const input = { source, title: file.replace(/\.loop$/, ''), designer: null, revision: 1, label: null, size: null, view: 'front' as const };
    for (const format of ['pdf', 'png', 'svg', 'txt'] as const) {
      let best = Infinity, bytes = 0;
      for (let i = 0; i < runs; i++) {
        const c = process.cpuUsage();
        const f = await runExport(input, format);
        const u = process.cpuUsage(c);
        best = Math.min(best, (u.user + u.system) / 1000);
        bytes = f.bytes.length;
      }
      out.push({ pattern: file, format, cpuMs: best, bytes });
    }
  }
  return out;
}

/** The printed lines. */
export function formatCapacity(s: SaveCapacity | null, e: ExportCapacity[] | null): string {
  const lines: string[] = [];
  if (s) {
    lines.push(
      `saves: ${s.clients} designers saving at once for ${s.seconds.toFixed(1)} s: ${s.saves} saves, ${s.savesPerSecond.toFixed(1)}/s, p50 ${s.p50.toFixed(0)} ms, p99 ${s.p99.toFixed(0)} ms` +
        `${s.other ? `, ${s.other} answers other than 201` : ''}`,
      `  CPU per save: app ${s.appCpuMsPerSave.toFixed(1)} ms (about ${s.savesPerAppCore.toFixed(0)} saves per second per core), MariaDB ${s.dbCpuMsPerSave === null ? 'unknown' : `${s.dbCpuMsPerSave.toFixed(1)} ms`}`,
    );
  }
  if (e) {
    const formats = ['pdf', 'png', 'svg', 'txt'] as const;
    for (const f of formats) {
      const xs = e.filter((x) => x.format === f).map((x) => x.cpuMs);
      lines.push(`export ${f.padEnd(3)}: ${Math.min(...xs).toFixed(0)} to ${Math.max(...xs).toFixed(0)} ms CPU over the demo patterns`);
    }
  }
  return lines.join('\n');
}
