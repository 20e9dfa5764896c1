/**
 * Private MariaDB launcher.
 *
 * `npm start` and `npm test` each run their own `mariadbd` from Debian's
 * `mariadb-server` package, with every file under `.data/<name>/`:
 *
 *   .data/<name>/mariadb/          data directory (initialised on first run)
 *   .data/<name>/mysqld.sock       socket
 *   .data/<name>/mysqld.pid        pid file written by mariadbd
 *   .data/<name>/mariadb.log       server error log
 *   .data/<name>/db-credentials.json  generated passwords (mode 0600)
 *   .data/<name>/launcher.json     which Node process owns the running server
 *
 * Invariants: one server per data directory. A second start while the owner
 * process is alive is refused with a clear message; a server left behind by
 * a killed owner is stopped; a stale pid file or socket is removed.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync, openSync, closeSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import mariadb from 'mariadb';

/** A running private MariaDB server and the application account on it. */
export interface PrivateMariaDB {
  host: string;
  port: number;
  socket: string;
  user: string;
  password: string;
  database: string;
  /** Stops the server and waits until the process is gone. Idempotent. */
  stop(): Promise<void>;
}

/** Options for {@link startPrivateMariaDB}. */
export interface LauncherOptions {
  /** Folder name under `.data/` (`start`, `test`, ...). */
  name: 'start' | 'test' | string;
  /** TCP port on 127.0.0.1. */
  port: number;
  /** Parent of the per-name folders; defaults to `<repo>/.data`. */
  baseDir?: string;
  /** Also stop on SIGINT/SIGTERM (then exit 130/143). Default false: callers usually own signal handling. */
  stopOnSignals?: boolean;
  /** Milliseconds to wait for the server to answer. Default 60 000. */
  readyTimeoutMs?: number;
}

/** Thrown when the launcher cannot start; `message` says what to do. */
export class LauncherError extends Error {
  override name = 'LauncherError';
}

const repoRoot = path.resolve(import.meta.dirname, '..', '..');
const MARIADBD = '/usr/sbin/mariadbd';
const INSTALL_DB = '/usr/bin/mariadb-install-db';
const APP_USER = 'loopwright';
const APP_DATABASE = 'loopwright';

interface Credentials { rootPassword: string; user: string; password: string; database: string }
/** Who runs a server: written to launcher.json on start. */
export interface OwnerRecord { ownerPid: number; serverPid: number; port: number; startedAt: string }

/** Paths used for one named instance. */
export function instancePaths(name: string, baseDir = path.join(repoRoot, '.data')) {
  const dir = path.join(baseDir, name);
  return {
    dir,
    dataDir: path.join(dir, 'mariadb'),
    socket: path.join(dir, 'mysqld.sock'),
    pidFile: path.join(dir, 'mysqld.pid'),
    logFile: path.join(dir, 'mariadb.log'),
    credentials: path.join(dir, 'db-credentials.json'),
    owner: path.join(dir, 'launcher.json'),
    initMarker: path.join(dir, 'mariadb', '.loopwright-initialised'),
  };
}

const isRoot = () => typeof process.getuid === 'function' && process.getuid() === 0;

/**
 * Makes sure Debian's mariadb-server binaries exist, installing them with
 * apt-get when running as root; otherwise throws with the exact command.
 * `binaries` and `asRoot` exist for tests.
 */
export function ensureMariaDBInstalled(binaries: readonly string[] = [MARIADBD, INSTALL_DB], asRoot: boolean = isRoot()): void {
  const missing = binaries.filter((b) => !existsSync(b));
  if (missing.length === 0) return;
  const command = 'apt-get update && apt-get install -y mariadb-server';
  if (!asRoot) {
    throw new LauncherError(`MariaDB is not installed (${missing.join(', ')} missing). Install it with:\n  sudo sh -c '${command}'`);
  }
  console.log(`MariaDB is missing; running: ${command}`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  for (const args of [['update'], ['install', '-y', 'mariadb-server']]) {
    const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
    if (r.status !== 0) throw new LauncherError(`apt-get ${args.join(' ')} failed (exit ${r.status}); run it by hand: ${command}`);
  }
  // Debian starts the system-wide service after install; we do not use it, but leave it alone.
  const still = binaries.filter((b) => !existsSync(b));
  if (still.length) throw new LauncherError(`${still.join(', ')} still missing after installing mariadb-server`);
}

/** True when a process with this pid exists and is a mariadbd. */
function isMariadbProcess(pid: number): boolean {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
  } catch {
    return false;
  }
  try {
    const cmd = readFileSync(`/proc/${pid}/cmdline`, 'utf8');
    return cmd.includes('mariadbd') || cmd.includes('mysqld');
  } catch {
    return true; // no /proc: assume it is ours rather than risk two servers on one directory
  }
}

function isAlive(pid: number): boolean {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function readJson<T>(file: string): T | null {
  try {
    return JSON.parse(readFileSync(file, 'utf8')) as T;
  } catch {
    return null;
  }
}

function readPid(file: string): number | null {
  try {
    const pid = Number(readFileSync(file, 'utf8').trim());
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

/** Resolves true when something accepts TCP connections on 127.0.0.1:port. */
export function isPortInUse(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port });
    const done = (inUse: boolean) => { socket.destroy(); resolve(inUse); };
    socket.once('connect', () => done(true));
    socket.once('error', () => done(false));
    socket.setTimeout(1000, () => done(false));
  });
}

async function waitForExit(pid: number, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (!isAlive(pid)) return true;
    await new Promise((r) => setTimeout(r, 100));
  }
  return !isAlive(pid);
}

/** Stops a server by pid: SIGTERM (clean InnoDB shutdown), then SIGKILL as a last resort. */
async function stopPid(pid: number): Promise<void> {
  if (!isAlive(pid)) return;
  try { process.kill(pid, 'SIGTERM'); } catch { return; }
  if (await waitForExit(pid, 30_000)) return;
  try { process.kill(pid, 'SIGKILL'); } catch { /* already gone */ }
  await waitForExit(pid, 5_000);
}

/**
 * The live owner of a running server for `name`, if any: the Node process
 * that started it and the mariadbd pid. Lets scripts refuse early (before a
 * client build, say) with the same facts the launcher would give.
 */
export function findRunningInstance(name: string, baseDir?: string): OwnerRecord | null {
  const p = instancePaths(name, baseDir);
  const owner = readJson<OwnerRecord>(p.owner);
  if (!owner || !isAlive(owner.ownerPid)) return null;
  const pid = readPid(p.pidFile) ?? owner.serverPid;
  return isMariadbProcess(pid) ? { ...owner, serverPid: pid } : null;
}

/**
 * Decides what to do with leftovers of earlier runs: refuse when another live
 * process owns a running server, stop an orphaned server, delete stale files.
 */
async function clearLeftovers(p: ReturnType<typeof instancePaths>, port: number, name: string): Promise<void> {
  const owner = readJson<OwnerRecord>(p.owner);
  const pid = readPid(p.pidFile) ?? owner?.serverPid ?? null;
  const serverAlive = pid !== null && isMariadbProcess(pid);
  if (serverAlive) {
    if (owner && owner.ownerPid !== undefined && isAlive(owner.ownerPid)) {
      throw new LauncherError(
        `The '${name}' database is already running (mariadbd pid ${pid}, port ${owner.port}, started by process ${owner.ownerPid}` +
          ` at ${owner.startedAt}). Stop that run first (Ctrl-C in its terminal, or kill ${owner.ownerPid}); ` +
          `starting a second server on ${p.dataDir} would corrupt it.`,
      );
    }
    // The Node process that started it is gone (killed hard): shut the orphan down cleanly.
    console.log(`Stopping a MariaDB server left behind by an earlier run (pid ${pid}).`);
    await stopPid(pid);
  }
  // Anything still here is stale: the pid is dead or not a mariadbd.
  for (const f of [p.pidFile, p.socket, `${p.socket}.lock`, p.owner]) rmSync(f, { force: true });
  if (await isPortInUse(port)) {
    throw new LauncherError(`Port ${port} on 127.0.0.1 is already in use by another program; stop it or choose another port.`);
  }
}

function loadOrCreateCredentials(file: string, fresh: boolean, dataDir: string): Credentials {
  const existing = readJson<Credentials>(file);
  if (existing?.rootPassword && existing.password) return existing;
  if (!fresh) {
    throw new LauncherError(`${file} is missing or unreadable, so the database in ${dataDir} cannot be opened. Delete ${path.dirname(file)} to start over (this deletes that data).`);
  }
  const creds: Credentials = {
    rootPassword: randomBytes(18).toString('base64url'),
    user: APP_USER,
    password: randomBytes(18).toString('base64url'),
    database: APP_DATABASE,
  };
  writeFileSync(file, JSON.stringify(creds, null, 2) + '\n', { mode: 0o600 });
  return creds;
}

function initialiseDataDir(p: ReturnType<typeof instancePaths>): boolean {
  if (existsSync(p.initMarker)) return false;
  // A half-initialised directory (interrupted first run) is useless: start over.
  rmSync(p.dataDir, { recursive: true, force: true });
  rmSync(p.credentials, { force: true });
  mkdirSync(p.dataDir, { recursive: true });
  const args = ['--no-defaults', `--datadir=${p.dataDir}`, '--auth-root-authentication-method=normal', '--skip-test-db'];
  if (isRoot()) args.push('--user=root');
  const r = spawnSync(INSTALL_DB, args, { encoding: 'utf8' });
  if (r.status !== 0) {
    throw new LauncherError(`mariadb-install-db failed (exit ${r.status}):\n${(r.stderr || r.stdout || '').slice(-2000)}`);
  }
  writeFileSync(p.initMarker, new Date().toISOString() + '\n');
  return true;
}

function tailLog(file: string): string {
  try {
    return readFileSync(file, 'utf8').split('\n').slice(-15).join('\n');
  } catch {
    return '(no log)';
  }
}

async function connectRoot(socket: string, password: string | undefined) {
  return mariadb.createConnection({ socketPath: socket, user: 'root', password, connectTimeout: 2000 });
}

async function waitUntilReady(child: ChildProcess, p: ReturnType<typeof instancePaths>, rootPassword: string, fresh: boolean, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  let lastError: unknown;
  while (Date.now() < deadline) {
    if (child.exitCode !== null || child.signalCode !== null) {
      throw new LauncherError(`mariadbd exited during start-up (code ${child.exitCode ?? child.signalCode}). Last log lines:\n${tailLog(p.logFile)}`);
    }
    if (existsSync(p.socket)) {
      try {
        // A freshly initialised server has a password-less root; later runs use the stored one.
        return await connectRoot(p.socket, fresh ? undefined : rootPassword);
      } catch (err) {
        lastError = err;
        if (fresh) {
          try { return await connectRoot(p.socket, rootPassword); } catch { /* not yet */ }
        }
      }
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new LauncherError(`mariadbd did not answer within ${timeoutMs} ms (${String(lastError)}). Log:\n${tailLog(p.logFile)}`);
}

const quote = (s: string) => `'${s.replace(/\\/g, '\\\\').replace(/'/g, "\\'")}'`;

/**
 * Starts (initialising on first run) a private MariaDB for `name` on
 * 127.0.0.1:`port`, creates its database and application user, and returns
 * the connection details. Throws {@link LauncherError} with advice when it
 * cannot (binaries missing without root, already running, port taken).
 */
export async function startPrivateMariaDB(opts: LauncherOptions): Promise<PrivateMariaDB> {
  ensureMariaDBInstalled();
  const p = instancePaths(opts.name, opts.baseDir);
  mkdirSync(p.dir, { recursive: true });
  await clearLeftovers(p, opts.port, opts.name);
  const fresh = initialiseDataDir(p);
  const creds = loadOrCreateCredentials(p.credentials, fresh, p.dataDir);

  const args = [
    '--no-defaults',
    `--datadir=${p.dataDir}`,
    `--socket=${p.socket}`,
    `--pid-file=${p.pidFile}`,
    `--port=${opts.port}`,
    '--bind-address=127.0.0.1',
    '--skip-networking=0',
    `--log-error=${p.logFile}`,
    '--character-set-server=utf8mb4',
    '--collation-server=utf8mb4_unicode_ci',
    '--innodb-buffer-pool-size=64M',
    '--max-allowed-packet=16M',
    '--skip-name-resolve',
  ];
  if (isRoot()) args.push('--user=root');
  const logFd = openSync(p.logFile, 'a');
  // Detached: Ctrl-C reaches only Node, which then stops the server in order.
  const child = spawn(MARIADBD, args, { detached: true, stdio: ['ignore', logFd, logFd] });
  closeSync(logFd);
  const serverPid = child.pid;
  if (serverPid === undefined) throw new LauncherError('could not spawn mariadbd');
  const record: OwnerRecord = { ownerPid: process.pid, serverPid, port: opts.port, startedAt: new Date().toISOString() };
  writeFileSync(p.owner, JSON.stringify(record) + '\n');

  let stopped = false;
  const onExit = () => { if (!stopped) { try { process.kill(serverPid, 'SIGTERM'); } catch { /* gone */ } } };
  process.on('exit', onExit);

  const stop = async () => {
    if (stopped) return;
    stopped = true;
    process.off('exit', onExit);
    await stopPid(serverPid);
    for (const f of [p.owner, p.socket, p.pidFile]) rmSync(f, { force: true });
  };

  try {
    const conn = await waitUntilReady(child, p, creds.rootPassword, fresh, opts.readyTimeoutMs ?? 60_000);
    try {
      if (fresh) {
        // Only the socket root remains, with a generated password.
        await conn.query("DELETE FROM mysql.global_priv WHERE User = 'root' AND Host <> 'localhost'");
        await conn.query("DELETE FROM mysql.global_priv WHERE User = ''");
        await conn.query('FLUSH PRIVILEGES');
        await conn.query(`ALTER USER 'root'@'localhost' IDENTIFIED BY ${quote(creds.rootPassword)}`);
      }
      await conn.query(`CREATE DATABASE IF NOT EXISTS \`${creds.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
      for (const host of ['127.0.0.1', 'localhost']) {
        await conn.query(`CREATE USER IF NOT EXISTS ${quote(creds.user)}@${quote(host)} IDENTIFIED BY ${quote(creds.password)}`);
        await conn.query(`ALTER USER ${quote(creds.user)}@${quote(host)} IDENTIFIED BY ${quote(creds.password)}`);
        await conn.query(`GRANT ALL PRIVILEGES ON \`${creds.database}\`.* TO ${quote(creds.user)}@${quote(host)}`);
      }
    } finally {
      await conn.end();
    }
  } catch (err) {
    await stop();
    throw err;
  }

  if (opts.stopOnSignals) {
    for (const [sig, code] of [['SIGINT', 130], ['SIGTERM', 143]] as const) {
      process.once(sig, () => { void stop().then(() => process.exit(code)); });
    }
  }

  return { host: '127.0.0.1', port: opts.port, socket: p.socket, user: creds.user, password: creds.password, database: creds.database, stop };
}
