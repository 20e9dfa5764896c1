/**
 * Accounts and sessions: register, login, logout, /me, cookies, Bearer
 * tokens, the Origin check, validation and rate limits.
 * Status codes per RFC 9110 (HTTP semantics) and RFC 6585 (429); cookie
 * attributes per RFC 6265bis; bcrypt cost >= 10 per the OWASP Password
 * Storage Cheat Sheet (from memory).
 */
import bcrypt from 'bcryptjs';
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '../../server/models/index.ts';
import { JWT_SECRET, PASSWORD, STUDIO_ORIGIN, buildApp, startHarness, uniqueEmail, type ApiHarness } from './helpers.ts';

let h: ApiHarness;
beforeAll(async () => { h = await startHarness(); });
afterAll(async () => { await h.close(); });

const sessionCookie = (res: request.Response) => ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('lw_session='));

describe('register', () => {
  it('creates an account (201), sets an httpOnly SameSite=Lax cookie and stores a bcrypt hash of cost >= 10', async () => {
    const email = uniqueEmail('reg');
    const res = await request(h.app).post('/api/auth/register').send({ email: email.toUpperCase(), password: PASSWORD, name: 'Wren Hollis' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, name: 'Wren Hollis', roles: ['designer'] });
    expect(res.body.user.passwordHash).toBeUndefined();
    const cookie = sessionCookie(res);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const user = await User.findOne({ where: { email } });
    expect(user).not.toBeNull();
    expect(bcrypt.getRounds(user!.passwordHash)).toBeGreaterThanOrEqual(10);
    expect(await bcrypt.compare(PASSWORD, user!.passwordHash)).toBe(true);
  });

  it('refuses a second account with the same e-mail (409) and bad input (400 with details)', async () => {
    const email = uniqueEmail('dup');
    expect((await request(h.app).post('/api/auth/register').send({ email, password: PASSWORD, name: 'A' })).status).toBe(201);
    const again = await request(h.app).post('/api/auth/register').send({ email, password: PASSWORD, name: 'B' });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('email-taken');
    const bad = await request(h.app).post('/api/auth/register').send({ email: 'not-an-email', password: 'short', name: '' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.code).toBe('invalid-request');
    const paths = (bad.body.error.details as { path: string }[]).map((d) => d.path).sort();
    expect(paths).toEqual(['email', 'name', 'password']);
  });

  it('answers malformed JSON with 400 invalid-json and never leaks a stack trace', async () => {
    const res = await request(h.app).post('/api/auth/register').set('Content-Type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: { code: 'invalid-json', message: expect.any(String) } });
    expect(res.text).not.toMatch(/at .*\.ts:\d+/);
  });
});

describe('login, /me, logout', () => {
  const email = uniqueEmail('login');
  beforeAll(async () => {
    await request(h.app).post('/api/auth/register').send({ email, password: PASSWORD, name: 'Lark Penrose' });
  });

  it('returns the user and a JWT (RFC 7519) whose subject is the user id, plus the cookie', async () => {
    const res = await request(h.app).post('/api/auth/login').send({ email, password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(email);
    const payload = jwt.verify(res.body.token as string, JWT_SECRET) as jwt.JwtPayload;
    expect(payload.sub).toBe(String(res.body.user.id));
    expect(sessionCookie(res)).toBeDefined();
  });

  it('gives the same 401 for a wrong password and an unknown e-mail', async () => {
    const wrong = await request(h.app).post('/api/auth/login').send({ email, password: 'wrong password!' });
    const unknown = await request(h.app).post('/api/auth/login').send({ email: uniqueEmail('nobody'), password: PASSWORD });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('GET /api/me works with the cookie and with a Bearer token, and is 401 without either or with a forged token', async () => {
    const agent = request.agent(h.app);
    const login = await agent.post('/api/auth/login').send({ email, password: PASSWORD });
    expect((await agent.get('/api/me')).body.user.email).toBe(email);
    expect((await request(h.app).get('/api/me').set('Authorization', `Bearer ${login.body.token}`)).status).toBe(200);
    expect((await request(h.app).get('/api/me')).status).toBe(401);
    const forged = jwt.sign({ sv: 0 }, 'some other secret', { subject: String(login.body.user.id) });
    expect((await request(h.app).get('/api/me').set('Authorization', `Bearer ${forged}`)).status).toBe(401);
  });

  it('logout answers 204 and clears the cookie', async () => {
    const agent = request.agent(h.app);
    await agent.post('/api/auth/login').send({ email, password: PASSWORD });
    const out = await agent.post('/api/auth/logout').set('Origin', STUDIO_ORIGIN);
    expect(out.status).toBe(204);
    expect(sessionCookie(out)).toMatch(/Expires=Thu, 01 Jan 1970/);
    expect((await agent.get('/api/me')).status).toBe(401);
  });
});

describe('Origin check on cookie-authenticated unsafe requests', () => {
  it('refuses a cookie POST without Origin or from another site, accepts a same-host Origin and Bearer requests', async () => {
    const email = uniqueEmail('origin');
    const agent = request.agent(h.app);
    const reg = await agent.post('/api/auth/register').send({ email, password: PASSWORD, name: 'Origin Test' });
    expect(reg.status).toBe(201);
    const none = await agent.post('/api/patterns').send({ title: 'No origin' });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('bad-origin');
    const evil = await agent.post('/api/patterns').set('Origin', 'http://evil.example').send({ title: 'Cross site' });
    expect(evil.status).toBe(403);
    const same = await agent.post('/api/patterns').set('Host', 'studio.example:4310').set('Origin', 'http://studio.example:4310').send({ title: 'Same host' });
    expect(same.status).toBe(201);
    const allowed = await agent.post('/api/patterns').set('Origin', STUDIO_ORIGIN).send({ title: 'Allowed origin' });
    expect(allowed.status).toBe(201);
    const login = await request(h.app).post('/api/auth/login').send({ email, password: PASSWORD });
    const bearer = await request(h.app).post('/api/patterns').set('Authorization', `Bearer ${login.body.token}`).send({ title: 'Script' });
    expect(bearer.status).toBe(201);
  });
});

describe('rate limits', () => {
  it('answers 429 after the configured number of sign-in attempts (limit 3 here)', async () => {
    const limited = buildApp(h, { rateLimits: { login: { windowMs: 60_000, limit: 3 } } });
    const codes: number[] = [];
    for (let i = 0; i < 5; i++) {
      codes.push((await request(limited).post('/api/auth/login').send({ email: uniqueEmail('rl'), password: PASSWORD })).status);
    }
    expect(codes).toEqual([401, 401, 401, 429, 429]);
    const last = await request(limited).post('/api/auth/login').send({ email: uniqueEmail('rl'), password: PASSWORD });
    expect(last.body.error.code).toBe('rate-limited');
  });

  it('limits registration and password resets too', async () => {
    const limited = buildApp(h, { rateLimits: { register: { windowMs: 60_000, limit: 1 }, reset: { windowMs: 60_000, limit: 1 } } });
    expect((await request(limited).post('/api/auth/register').send({ email: uniqueEmail('r1'), password: PASSWORD, name: 'R' })).status).toBe(201);
    expect((await request(limited).post('/api/auth/register').send({ email: uniqueEmail('r2'), password: PASSWORD, name: 'R' })).status).toBe(429);
    expect((await request(limited).post('/api/auth/password-reset').send({ email: uniqueEmail('r3') })).status).toBe(202);
    expect((await request(limited).post('/api/auth/password-reset').send({ email: uniqueEmail('r4') })).status).toBe(429);
  });
});

describe('security headers', () => {
  it('sends helmet headers (nosniff, CSP) and no X-Powered-By', async () => {
    const res = await request(h.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
