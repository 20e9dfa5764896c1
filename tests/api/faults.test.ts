/**
 * Faults: the database goes away under a running app.
 *
 * This file starts its own private MariaDB through the launcher (its own
 * data directory and port), so stopping and killing it never disturbs the
 * shared test database. One app (one createApp, listening once) lives
 * through every stop and restart:
 *  - while the database is down the API answers 503 with a clear message
 *    (RFC 9110 section 15.6.4: 503 Service Unavailable, with Retry-After),
 *    including requests already in flight when it stops, and never a 500;
 *  - when the database is back the same app serves again (no restart);
 *  - a save that fails after its revision row was inserted, inside the
 *    transaction (a thrown hook, a killed connection, a crashed server),
 *    leaves no revision behind and does not move the pattern's counter.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import type { Server } from 'node:http';
import net from 'node:net';
import path from 'node:path';
import mariadb from 'mariadb';
import { QueryTypes, type Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createSequelize } from '../../server/db/connection.ts';
import { instancePaths, startPrivateMariaDB, type PrivateMariaDB } from '../../server/db/launcher.ts';
import { migrate } from '../../server/db/migrate.ts';
import { startFakeSmtp, type FakeSmtp } from '../../server/fakes/smtp.ts';
import { createMailer, type Mailer } from '../../server/mail/mailer.ts';
import { Pattern, Revision } from '../../server/models/index.ts';
import { buildApp, makeUser, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

const baseDir = path.join(process.env.LOOPWRIGHT_DATA_DIR ?? '.data/test', 'faults');
const NAME = 'faults-db';

let db: PrivateMariaDB;
let port: number;
let sequelize: Sequelize;
let smtp: FakeSmtp;
let mailer: Mailer;
let storageDir: string;
let server: Server;
let designer: TestUser;

async function freePort(): Promise<number> {
  const s = net.createServer();
  await new Promise<void>((resolve) => s.listen(0, '127.0.0.1', resolve));
  const p = (s.address() as net.AddressInfo).port;
  await new Promise<void>((resolve) => s.close(() => resolve()));
  return p;
}

const startDb = () => startPrivateMariaDB({ name: NAME, port, baseDir });

/** Polls GET /api/health until it says up (the pool reconnects on its own). */
async function waitUntilHealthy(timeoutMs = 20_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await request(server).get('/api/health');
    if (res.status === 200) return;
    if (Date.now() > deadline) throw new Error(`health still ${res.status} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

async function newPattern(title: string): Promise<number> {
  const res = await request(server).post('/api/patterns').set('Authorization', designer.auth).send({ title, source: sampleSource() });
  expect(res.status).toBe(201);
  return res.body.pattern.id as number;
}

const save = (id: number, baseRevision: number, message = 'edit') =>
  request(server).post(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth)
    .send({ source: sampleSource(message), baseRevision, message });

/** What the database holds for a pattern, read straight from the tables. */
async function stored(id: number): Promise<{ latest: number; numbers: number[] }> {
  const pattern = await Pattern.findByPk(id);
  const revisions = await Revision.findAll({ where: { patternId: id }, attributes: ['number'], order: [['number', 'ASC']] });
  return { latest: pattern!.latestRevision, numbers: revisions.map((r) => r.number) };
}

beforeAll(async () => {
  port = await freePort();
  db = await startDb();
  sequelize = createSequelize(process.env, { host: db.host, port: db.port, user: db.user, password: db.password, database: db.database });
  await migrate(sequelize);
  smtp = await startFakeSmtp({ port: 0 });
  mailer = createMailer({ host: smtp.host, port: smtp.port });
  storageDir = mkdtempSync(path.join(process.env.LOOPWRIGHT_DATA_DIR ?? '.data/test', 'uploads-'));
  const app = buildApp({ sequelize, smtp, mailer, storageDir });
  server = await new Promise<Server>((resolve) => { const s = app.listen(0, '127.0.0.1', () => resolve(s)); });
  designer = await makeUser(app, 'faults-designer');
});

afterAll(async () => {
  await new Promise<void>((resolve) => server?.close(() => resolve()));
  mailer?.close();
  await smtp?.close();
  await sequelize?.close();
  await db?.stop();
  if (storageDir) rmSync(storageDir, { recursive: true, force: true });
});

describe('the database stops under a running app', () => {
  it('answers 503 with a clear message while it is down, also to requests in flight, and recovers without a restart', async () => {
    const id = await newPattern('Faults: Tidepool Cowl');
    expect((await request(server).get(`/api/patterns/${id}`).set('Authorization', designer.auth)).status).toBe(200);

    // Requests in flight while the server shuts down: each one either
    // completes or gets a 503, never a 500 and never a hang.
    const inFlight = Array.from({ length: 24 }, (_, i) =>
      i % 3 === 0
        ? save(id, 1, `in flight ${i}`)
        : request(server).get(`/api/patterns/${id}`).set('Authorization', designer.auth));
    const stopping = db.stop();
    const answers = await Promise.all(inFlight);
    await stopping;
    for (const res of answers) {
      expect([200, 201, 409, 503], JSON.stringify(res.body)).toContain(res.status);
      if (res.status === 503) expect(res.body.error.code).toBe('database-unavailable');
    }

    // Fully down: every route that needs the database says so.
    const health = await request(server).get('/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ ok: false, db: 'down' });
    const read = await request(server).get(`/api/patterns/${id}`).set('Authorization', designer.auth);
    expect(read.status).toBe(503);
    expect(read.headers['retry-after']).toBe('5');
    expect(read.body).toEqual({ error: { code: 'database-unavailable', message: expect.stringMatching(/database is not answering.*try again/i) } });
    const list = await request(server).get('/api/patterns').set('Authorization', designer.auth);
    expect(list.status).toBe(503);
    const login = await request(server).post('/api/auth/login').send({ email: designer.email, password: 'whatever it is' });
    expect(login.status).toBe(503);
    const writing = await save(id, 1, 'while down');
    expect(writing.status).toBe(503);
    expect(writing.body.error.message).not.toMatch(/SQL|ECONNREFUSED|sequelize/i);

    // Back up on the same port and data directory: the same app serves again.
    db = await startDb();
    await waitUntilHealthy();
    const again = await request(server).get(`/api/patterns/${id}`).set('Authorization', designer.auth);
    expect(again.status).toBe(200);
    const latest = again.body.pattern.latestRevision as number;
    const after = await save(id, latest, 'after the restart');
    expect(after.status).toBe(201);
    expect(after.body.revision.number).toBe(latest + 1);
    // Whatever got in before the stop is whole: numbers run 1..latest without gaps.
    const s = await stored(id);
    expect(s.numbers).toEqual(Array.from({ length: s.latest }, (_, i) => i + 1));
  }, 120_000);
});

describe('a revision save that fails half way leaves nothing behind', () => {
  it('a failure thrown after the revision insert, inside the transaction, rolls the insert back', async () => {
    const id = await newPattern('Faults: thrown after insert');
    const before = await stored(id);
    let inserted = 0;
    Revision.addHook('afterCreate', 'fault-injection', () => {
      inserted++;
      throw new Error('injected fault after the revision insert');
    });
    try {
      const res = await save(id, 1, 'doomed');
      expect(res.status).toBe(500);
      expect(res.body.error.code).toBe('internal');
    } finally {
      Revision.removeHook('afterCreate', 'fault-injection');
    }
    expect(inserted).toBe(1); // the insert really ran before the failure
    expect(await stored(id)).toEqual(before);
    // Nothing half-written blocks the next save: it gets number 2.
    const next = await save(id, 1, 'retry');
    expect(next.status).toBe(201);
    expect(next.body.revision.number).toBe(2);
  });

  it('a connection killed after the revision insert answers 503 and the insert is gone', async () => {
    const id = await newPattern('Faults: connection killed');
    const before = await stored(id);
    // The application account may end its own connections (MariaDB KILL).
    const admin = await mariadb.createConnection({ host: db.host, port: db.port, user: db.user, password: db.password, database: db.database });
    let killed = 0;
    Revision.addHook('afterCreate', 'fault-injection', async (_rev, options) => {
      const rows = await sequelize.query<{ id: number }>('SELECT CONNECTION_ID() AS id', { transaction: options.transaction, type: QueryTypes.SELECT });
      await admin.query(`KILL CONNECTION ${Number(rows[0].id)}`);
      killed++;
    });
    try {
      const res = await save(id, 1, 'doomed');
      expect(res.status).toBe(503);
      expect(res.body.error.code).toBe('database-unavailable');
    } finally {
      Revision.removeHook('afterCreate', 'fault-injection');
      await admin.end();
    }
    expect(killed).toBe(1);
    expect(await stored(id)).toEqual(before);
    const next = await save(id, 1, 'retry');
    expect(next.status).toBe(201);
    expect(next.body.revision.number).toBe(2);
  });

  it('a database crash (SIGKILL) after the revision insert loses only the uncommitted revision', async () => {
    const id = await newPattern('Faults: server crash');
    const ok = await save(id, 1, 'committed before the crash');
    expect(ok.status).toBe(201);
    const before = await stored(id);
    expect(before).toEqual({ latest: 2, numbers: [1, 2] });
    const pidFile = instancePaths(NAME, baseDir).pidFile;
    let crashed = false;
    Revision.addHook('afterCreate', 'fault-injection', async () => {
      // The row is inserted but not committed: crash the server hard, as a power cut would.
      process.kill(Number(readFileSync(pidFile, 'utf8').trim()), 'SIGKILL');
      crashed = true;
      await new Promise((r) => setTimeout(r, 300));
    });
    try {
      const res = await save(id, 2, 'lost in the crash');
      expect(res.status).toBe(503);
    } finally {
      Revision.removeHook('afterCreate', 'fault-injection');
    }
    expect(crashed).toBe(true);
    await db.stop(); // the process is gone; this clears its files
    db = await startDb(); // InnoDB crash recovery rolls back the open transaction
    await waitUntilHealthy();
    expect(await stored(id)).toEqual(before);
    const next = await save(id, 2, 'after recovery');
    expect(next.status).toBe(201);
    expect(next.body.revision.number).toBe(3);
  }, 120_000);
});
