/**
 * Past one machine (docs/scaling.md): app instances keep no session or
 * pattern state of their own, so any number can run behind a load balancer
 * on one database. Two instances here: two createApp calls, each listening
 * on its own port, on the same database (and the same upload store, as an
 * object store would be shared). A token from one works on the other, a
 * save on one is seen on the other, a stale save across instances gets 409
 * (RFC 9110 section 15.5.10) with nothing overwritten, and a password reset
 * through one ends the sessions on both.
 */
import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApp, makeUser, PASSWORD, startHarness, tokenFromLink, type ApiHarness, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let servers: Server[] = [];
let a: string;
let b: string;
let designer: TestUser;

async function listen(): Promise<{ server: Server; url: string }> {
  const app = buildApp(h);
  const server = await new Promise<Server>((resolve) => { const s = app.listen(0, '127.0.0.1', () => resolve(s)); });
  const address = server.address();
  if (!address || typeof address === 'string') throw new Error('no port');
  return { server, url: `http://127.0.0.1:${address.port}` };
}

beforeAll(async () => {
  h = await startHarness();
  const one = await listen();
  const two = await listen();
  servers = [one.server, two.server];
  a = one.url;
  b = two.url;
  designer = await makeUser(h.app, 'scale-designer');
});
afterAll(async () => {
  for (const s of servers) await new Promise<void>((resolve) => s.close(() => resolve()));
  await h.close();
});

describe('two app instances on one database', () => {
  it('listen on different ports', () => {
    expect(a).not.toBe(b);
  });

  it('a token (Bearer or cookie) issued by one instance works on the other', async () => {
    const login = await request(a).post('/api/auth/login').send({ email: designer.email, password: PASSWORD });
    expect(login.status).toBe(200);
    const cookie = (login.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('lw_session='))!.split(';')[0];
    const bearer = await request(b).get('/api/me').set('Authorization', `Bearer ${login.body.token}`);
    expect(bearer.status).toBe(200);
    expect(bearer.body.user.email).toBe(designer.email);
    const viaCookie = await request(b).get('/api/me').set('Cookie', cookie);
    expect(viaCookie.status).toBe(200);
    // An unsafe cookie request to instance B with B's own origin passes the Origin check there too.
    const created = await request(b).post('/api/patterns').set('Cookie', cookie).set('Origin', b).send({ title: 'Made on B with A\'s cookie', source: sampleSource('b') });
    expect(created.status).toBe(201);
  });

  it('a save on one instance is seen on the other at once', async () => {
    const created = await request(a).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Scaling: Lantern Mitts', source: sampleSource('r1') });
    const id = created.body.pattern.id as number;
    const saved = await request(a).post(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth).send({ source: sampleSource('r2 on A'), baseRevision: 1, message: 'on A' });
    expect(saved.status).toBe(201);
    const seen = await request(b).get(`/api/patterns/${id}`).set('Authorization', designer.auth);
    expect(seen.status).toBe(200);
    expect(seen.body.pattern.latestRevision).toBe(2);
    expect(seen.body.latestRevision.source).toBe(sampleSource('r2 on A'));
    const list = await request(b).get(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth);
    expect(list.body.revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
  });

  it('a stale save across instances gets 409 with the latest revision, and nothing is overwritten', async () => {
    const created = await request(a).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Scaling: Quarry Tote panel', source: sampleSource('base') });
    const id = created.body.pattern.id as number;
    // Both editors opened revision 1; A saves first, B saves on the old base.
    const first = await request(a).post(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth).send({ source: sampleSource('from A'), baseRevision: 1, message: 'A' });
    expect(first.status).toBe(201);
    const stale = await request(b).post(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth).send({ source: sampleSource('from B'), baseRevision: 1, message: 'B' });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale-revision');
    expect(stale.body.latest.number).toBe(2);
    expect(stale.body.latest.source).toBe(sampleSource('from A'));
    const after = await request(a).get(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth);
    expect(after.body.revisions.map((r: { number: number }) => r.number)).toEqual([2, 1]);
  });

  it('simultaneous saves on the same base through both instances: exactly one wins, the other gets 409', async () => {
    const created = await request(a).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Scaling: race', source: sampleSource('race') });
    const id = created.body.pattern.id as number;
    for (let round = 1; round <= 3; round++) {
      const results = await Promise.all([a, b, a, b].map((url, i) =>
        request(url).post(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth).send({ source: sampleSource(`round ${round} writer ${i}`), baseRevision: round, message: `writer ${i}` })));
      expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409, 409]);
    }
    const revisions = await request(b).get(`/api/patterns/${id}/revisions`).set('Authorization', designer.auth);
    expect(revisions.body.revisions.map((r: { number: number }) => r.number)).toEqual([4, 3, 2, 1]);
  });

  it('a password reset through one instance ends the sessions on the other (revocation lives in the database)', async () => {
    const user = await makeUser(h.app, 'scale-reset');
    expect((await request(b).get('/api/me').set('Authorization', user.auth)).status).toBe(200);
    await request(a).post('/api/auth/password-reset').send({ email: user.email });
    let link: string | undefined;
    for (let i = 0; i < 50 && !link; i++) {
      const outbox = await request(b).get('/api/dev/outbox');
      link = (outbox.body.messages as { to: string; links: string[] }[]).find((m) => m.to.includes(user.email))?.links.find((l) => l.includes('/reset-password/'));
      if (!link) await new Promise((r) => setTimeout(r, 100));
    }
    expect(link).toBeDefined();
    const reset = await request(b).post(`/api/auth/password-reset/${tokenFromLink(link!, 'reset-password')}`).send({ password: 'a brand new passphrase' });
    expect(reset.status).toBe(204);
    expect((await request(a).get('/api/me').set('Authorization', user.auth)).status).toBe(401);
    expect((await request(b).get('/api/me').set('Authorization', user.auth)).status).toBe(401);
  });
});
