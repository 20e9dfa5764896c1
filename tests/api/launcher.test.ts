/**
 * The private MariaDB launcher: it starts a server that answers with the
 * generated application account, refuses a second start on the same data
 * directory while the first runs, cleans up a stale pid file and socket left
 * by a killed run, stops a server whose owner died, refuses a port taken by
 * another program, and leaves no mariadbd behind after stop().
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import mariadb from 'mariadb';
import { afterAll, describe, expect, it } from 'vitest';
import { ensureMariaDBInstalled, findRunningInstance, instancePaths, startPrivateMariaDB, type PrivateMariaDB } from '../../server/db/launcher.ts';

const baseDir = path.join(process.env.LOOPWRIGHT_DATA_DIR ?? path.join(os.tmpdir(), 'loopwright'), 'launcher');
const name = 'lt';
const paths = instancePaths(name, baseDir);
const running: PrivateMariaDB[] = [];
afterAll(async () => { for (const db of running) await db.stop(); });

async function freePort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as net.AddressInfo).port;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

const alive = (pid: number) => { try { process.kill(pid, 0); return true; } catch { return false; } };
/** A pid that certainly belongs to no process: one that has just exited. */
const deadPid = () => spawnSync('true').pid!;
const serverPid = () => Number(readFileSync(paths.pidFile, 'utf8').trim());

async function start(port: number): Promise<PrivateMariaDB> {
  const db = await startPrivateMariaDB({ name, port, baseDir });
  running.push(db);
  return db;
}

async function stop(db: PrivateMariaDB) {
  await db.stop();
  running.splice(running.indexOf(db), 1);
}

describe('private MariaDB launcher', () => {
  it('starts, answers with the application account over TCP, and stops without leaving a process', async () => {
    const port = await freePort();
    const db = await start(port);
    const conn = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: db.database });
    const [row] = await conn.query('SELECT DATABASE() AS db, CURRENT_USER() AS who');
    await conn.end();
    expect(row.db).toBe(db.database);
    expect(row.who).toMatch(new RegExp(`^${db.user}@`));
    // Root may not log in over TCP without the generated password.
    await expect(mariadb.createConnection({ host: db.host, port: db.port, user: 'root', password: '', connectTimeout: 2000 })).rejects.toThrow();
    const pid = serverPid();
    expect(alive(pid)).toBe(true);
    await stop(db);
    expect(alive(pid)).toBe(false);
    expect(existsSync(paths.pidFile)).toBe(false);
    expect(existsSync(paths.socket)).toBe(false);
  });

  it('refuses a second start on the same data directory while one runs', async () => {
    const db = await start(await freePort());
    expect(findRunningInstance(name, baseDir)?.ownerPid).toBe(process.pid);
    await expect(startPrivateMariaDB({ name, port: await freePort(), baseDir })).rejects.toThrow(/already running/);
    // The first one is unharmed.
    const conn = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password });
    expect((await conn.query('SELECT 1 AS one'))[0].one).toBe(1);
    await conn.end();
    await stop(db);
    expect(findRunningInstance(name, baseDir)).toBeNull();
  });

  it('cleans up a stale pid file and socket from a killed run', async () => {
    writeFileSync(paths.pidFile, `${deadPid()}\n`);
    writeFileSync(paths.socket, '');
    writeFileSync(paths.owner, JSON.stringify({ ownerPid: deadPid(), serverPid: deadPid(), port: 1, startedAt: 'earlier' }));
    const db = await start(await freePort());
    expect(serverPid()).not.toBe(0);
    await stop(db);
  });

  it('stops a server whose owning process died, then starts a fresh one', async () => {
    const db = await start(await freePort());
    const orphan = serverPid();
    // Pretend the process that started it was killed hard.
    const record = JSON.parse(readFileSync(paths.owner, 'utf8')) as { ownerPid: number };
    record.ownerPid = deadPid();
    writeFileSync(paths.owner, JSON.stringify(record));
    const fresh = await start(await freePort());
    expect(alive(orphan)).toBe(false);
    expect(serverPid()).not.toBe(orphan);
    await stop(db); // a no-op now: its server is already gone
    await stop(fresh);
  });

  it('without the binaries and without root, fails with the exact apt-get command', () => {
    expect(() => ensureMariaDBInstalled(['/nonexistent/mariadbd'], false)).toThrow(/missing\)\. Install it with:\n {2}sudo sh -c 'apt-get update && apt-get install -y mariadb-server'/);
    // With the real binaries present nothing happens.
    expect(() => ensureMariaDBInstalled()).not.toThrow();
  });

  it('refuses a port that another program uses', async () => {
    const blocker = net.createServer();
    await new Promise<void>((resolve) => blocker.listen(0, '127.0.0.1', resolve));
    const port = (blocker.address() as net.AddressInfo).port;
    try {
      await expect(startPrivateMariaDB({ name, port, baseDir })).rejects.toThrow(/in use/);
    } finally {
      await new Promise<void>((resolve) => blocker.close(() => resolve()));
    }
  });
});
