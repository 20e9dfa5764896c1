/**
 * GET /api/health (contract: {"ok":true,"db":"up"} or 503 {"ok":false,"db":"down"})
 * and the single error format for unknown routes and oversized bodies
 * (RFC 9110: 404, 413, 503).
 */
import net from 'node:net';
import { Sequelize } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp, startHarness, type ApiHarness } from './helpers.ts';

let h: ApiHarness;
beforeAll(async () => { h = await startHarness(); });
afterAll(async () => { await h.close(); });

/** A TCP port on 127.0.0.1 that nothing listens on (bound, then released). */
async function closedPort(): Promise<number> {
  const server = net.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const port = (server.address() as net.AddressInfo).port;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe('health', () => {
  it('reports the database up', async () => {
    const res = await request(h.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: 'up' });
  });

  it('reports 503 with db "down" when the database does not answer', async () => {
    // A connection that is not bound to the models, pointing at a closed port.
    const dead = new Sequelize('loopwright', 'nobody', 'x', { host: '127.0.0.1', port: await closedPort(), dialect: 'mariadb', logging: false, dialectOptions: { connectTimeout: 1000 }, pool: { acquire: 1500 } });
    try {
      const app = buildApp(h, { sequelize: dead });
      const res = await request(app).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ ok: false, db: 'down' });
    } finally {
      await dead.close();
    }
  });
});

describe('error format', () => {
  it('answers an unknown API route with a JSON 404', async () => {
    const res = await request(h.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not-found');
    expect(res.headers['content-type']).toMatch(/application\/json/);
  });

  it('answers a JSON body over the request limit with 413 in the same format', async () => {
    const res = await request(h.app).post('/api/auth/login').set('Content-Type', 'application/json').send(JSON.stringify({ email: 'a@b.example', password: 'x'.repeat(4 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body).toEqual({ error: { code: 'too-large', message: expect.any(String) } });
  });
});
