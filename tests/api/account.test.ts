/**
 * Account settings: PATCH /api/me (display name) and POST /api/me/password
 * (change with the current password). Sources for the expectations:
 * status codes per RFC 9110 (400 bad input, 401 no session, 403 refused)
 * and RFC 6585 (429); ending the other sessions after a password change
 * follows the OWASP Session Management and Authentication Cheat Sheets
 * (from memory: "invalidate sessions after a password change", "require the
 * current password to change it"); the password rule is the sign-up rule
 * of shared/api-schemas.ts (10 characters up to bcrypt's 72 bytes).
 */
import bcrypt from 'bcryptjs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PasswordReset, User } from '../../server/models/index.ts';
import { PASSWORD, PUBLIC_URL, STUDIO_ORIGIN, buildApp, makeUser, startHarness, type ApiHarness } from './helpers.ts';

let h: ApiHarness;
beforeAll(async () => { h = await startHarness(); });
afterAll(async () => { await h.close(); });

const NEW_PASSWORD = 'ebb tide at the quay';

/**
 * The password-changed notice mailed to `email` (waits up to 5 s). Telling
 * the owner of every password change is common practice (from memory: the
 * OWASP Authentication Cheat Sheet asks for a notice on account changes).
 */
async function noticeFor(email: string) {
  for (let waited = 0; waited < 5000; waited += 50) {
    const found = h.smtp.list().find((m) => m.to.includes(email) && /password was changed/i.test(m.subject));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no password-changed notice to ${email}`);
}

/** A browser-like session: cookie jar plus the studio's Origin on every request. */
async function cookieSession(email: string, password = PASSWORD) {
  const agent = request.agent(h.app);
  const login = await agent.post('/api/auth/login').send({ email, password });
  expect(login.status).toBe(200);
  return agent;
}

describe('PATCH /api/me: the display name', () => {
  it('renames the signed-in person (trimmed) and /api/me shows the new name', async () => {
    const u = await makeUser(h.app, 'rename');
    const res = await request(h.app).patch('/api/me').set('Authorization', u.auth).send({ name: '  Ottilie Marram  ' });
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual({ id: u.id, email: u.email, name: 'Ottilie Marram', roles: ['designer'] });
    const me = await request(h.app).get('/api/me').set('Authorization', u.auth);
    expect(me.body.user.name).toBe('Ottilie Marram');
  });

  it('answers a blank, missing, over-long or non-text name with 400 and a message, changing nothing', async () => {
    const u = await makeUser(h.app, 'rename-bad');
    for (const body of [{ name: '   ' }, {}, { name: 'x'.repeat(121) }, { name: 42 }]) {
      const res = await request(h.app).patch('/api/me').set('Authorization', u.auth).send(body);
      expect(res.status, JSON.stringify(body)).toBe(400);
      expect(res.body.error.code).toBe('invalid-request');
      expect(res.body.error.message).toMatch(/\w/);
      expect((res.body.error.details as { path: string }[]).map((d) => d.path)).toEqual(['name']);
    }
    expect((await User.findByPk(u.id))!.name).toBe(u.name);
  });

  it('is 401 without a session', async () => {
    const res = await request(h.app).patch('/api/me').send({ name: 'Nobody' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('with the cookie, needs a matching Origin like every unsafe cookie request (403 bad-origin otherwise)', async () => {
    const u = await makeUser(h.app, 'rename-origin');
    const agent = await cookieSession(u.email);
    const none = await agent.patch('/api/me').send({ name: 'No Origin' });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('bad-origin');
    const evil = await agent.patch('/api/me').set('Origin', 'http://evil.example').send({ name: 'Cross Site' });
    expect(evil.status).toBe(403);
    expect((await User.findByPk(u.id))!.name).toBe(u.name);
    const ok = await agent.patch('/api/me').set('Origin', STUDIO_ORIGIN).send({ name: 'Same Studio' });
    expect(ok.status).toBe(200);
    expect(ok.body.user.name).toBe('Same Studio');
  });
});

describe('POST /api/me/password: changing the password', () => {
  it('changes it with the right current password: new hash (bcrypt cost >= 10), this session stays, every other session and token ends', async () => {
    const u = await makeUser(h.app, 'pw-ok');
    const here = await cookieSession(u.email);
    const elsewhere = await cookieSession(u.email);
    expect((await elsewhere.get('/api/me')).status).toBe(200);

    const res = await here.post('/api/me/password').set('Origin', STUDIO_ORIGIN).send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: u.id, email: u.email });
    expect(typeof res.body.token).toBe('string');
    expect(([] as string[]).concat(res.headers['set-cookie'] ?? []).some((c) => c.startsWith('lw_session=') && /HttpOnly/i.test(c))).toBe(true);

    // The session that asked carries on with its new cookie; the other browser and the old Bearer token are signed out.
    expect((await here.get('/api/me')).status).toBe(200);
    expect((await elsewhere.get('/api/me')).status).toBe(401);
    expect((await request(h.app).get('/api/me').set('Authorization', u.auth)).status).toBe(401);
    expect((await request(h.app).get('/api/me').set('Authorization', `Bearer ${res.body.token}`)).status).toBe(200);

    const stored = (await User.findByPk(u.id))!;
    expect(bcrypt.getRounds(stored.passwordHash)).toBeGreaterThanOrEqual(10);
    expect(await bcrypt.compare(NEW_PASSWORD, stored.passwordHash)).toBe(true);
    expect((await request(h.app).post('/api/auth/login').send({ email: u.email, password: PASSWORD })).status).toBe(401);
    expect((await request(h.app).post('/api/auth/login').send({ email: u.email, password: NEW_PASSWORD })).status).toBe(200);
  });

  it('mails the account a notice of the change, with a way to take the account back and no secret in it', async () => {
    const u = await makeUser(h.app, 'pw-notice');
    const res = await request(h.app).post('/api/me/password').set('Authorization', u.auth).send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(200);
    const notice = await noticeFor(u.email);
    expect(notice.text).toContain('account settings');
    expect(notice.text).toContain(u.email);
    // The link asks for a fresh reset link; it carries no token (an old mailbox must not hold a key to the account).
    expect(notice.links).toEqual([`${PUBLIC_URL}/reset-password`]);
    expect(notice.text).not.toContain(NEW_PASSWORD);
  });

  it('sends no notice when the change is refused', async () => {
    const u = await makeUser(h.app, 'pw-no-notice');
    const res = await request(h.app).post('/api/me/password').set('Authorization', u.auth).send({ currentPassword: 'not the password', newPassword: NEW_PASSWORD });
    expect(res.status).toBe(403);
    await new Promise((r) => setTimeout(r, 300)); // a send would have been on its way by now
    expect(h.smtp.list().some((m) => m.to.includes(u.email))).toBe(false);
  });

  it('works with a Bearer token too (for scripts): the answer carries the replacement token', async () => {
    const u = await makeUser(h.app, 'pw-bearer');
    const res = await request(h.app).post('/api/me/password').set('Authorization', u.auth).send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(200);
    expect((await request(h.app).get('/api/me').set('Authorization', u.auth)).status).toBe(401);
    expect((await request(h.app).get('/api/me').set('Authorization', `Bearer ${res.body.token}`)).body.user.id).toBe(u.id);
  });

  it('closes reset links that were still open, as a mailed reset does', async () => {
    const u = await makeUser(h.app, 'pw-reset');
    expect((await request(h.app).post('/api/auth/password-reset').send({ email: u.email })).status).toBe(202);
    expect(await PasswordReset.count({ where: { userId: u.id, usedAt: null } })).toBe(1);
    const res = await request(h.app).post('/api/me/password').set('Authorization', u.auth).send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(200);
    expect(await PasswordReset.count({ where: { userId: u.id, usedAt: null } })).toBe(0);
  });

  it('refuses a wrong current password with 403 wrong-password and a clear message; nothing changes, sessions carry on', async () => {
    const u = await makeUser(h.app, 'pw-wrong');
    const before = (await User.findByPk(u.id))!;
    const res = await request(h.app).post('/api/me/password').set('Authorization', u.auth).send({ currentPassword: 'not the password', newPassword: NEW_PASSWORD });
    expect(res.status).toBe(403);
    expect(res.body.error.code).toBe('wrong-password');
    expect(res.body.error.message).toMatch(/current password/i);
    const after = (await User.findByPk(u.id))!;
    expect(after.passwordHash).toBe(before.passwordHash);
    expect(after.sessionVersion).toBe(before.sessionVersion);
    expect((await request(h.app).get('/api/me').set('Authorization', u.auth)).status).toBe(200);
  });

  it('refuses a weak new password with the sign-up rule (400 on newPassword): too short, over 72 bytes, or the same as now', async () => {
    const u = await makeUser(h.app, 'pw-weak');
    const cases: { body: Record<string, unknown>; path: string; message: RegExp }[] = [
      { body: { currentPassword: PASSWORD, newPassword: 'short' }, path: 'newPassword', message: /at least 10 characters/ },
      // 25 three-byte characters = 75 UTF-8 bytes; bcrypt would silently ignore the bytes past 72.
      { body: { currentPassword: PASSWORD, newPassword: '潮'.repeat(25) }, path: 'newPassword', message: /72 bytes/ },
      { body: { currentPassword: PASSWORD, newPassword: PASSWORD }, path: 'newPassword', message: /differs from the current/ },
      { body: { newPassword: NEW_PASSWORD }, path: 'currentPassword', message: /./ },
    ];
    for (const c of cases) {
      const res = await request(h.app).post('/api/me/password').set('Authorization', u.auth).send(c.body);
      expect(res.status, JSON.stringify(c.body)).toBe(400);
      expect(res.body.error.code).toBe('invalid-request');
      const details = res.body.error.details as { path: string; message: string }[];
      expect(details.map((d) => d.path)).toContain(c.path);
      expect(details.find((d) => d.path === c.path)!.message).toMatch(c.message);
    }
    expect((await request(h.app).post('/api/auth/login').send({ email: u.email, password: PASSWORD })).status).toBe(200);
  });

  it('is 401 without a session', async () => {
    const res = await request(h.app).post('/api/me/password').send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(res.status).toBe(401);
  });

  it('with the cookie, needs a matching Origin (403 bad-origin), and the password stays', async () => {
    const u = await makeUser(h.app, 'pw-origin');
    const agent = await cookieSession(u.email);
    const none = await agent.post('/api/me/password').send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('bad-origin');
    const evil = await agent.post('/api/me/password').set('Origin', 'http://evil.example').send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(evil.status).toBe(403);
    expect((await request(h.app).post('/api/auth/login').send({ email: u.email, password: PASSWORD })).status).toBe(200);
  });

  it('is rate-limited with the sign-in limit (3 here), per account, counting failed attempts only', async () => {
    const limited = buildApp(h, { rateLimits: { login: { windowMs: 60_000, limit: 3 } } });
    const u = await makeUser(h.app, 'pw-limit');
    const other = await makeUser(h.app, 'pw-limit-other');
    // A successful change does not count against the limit.
    const ok = await request(limited).post('/api/me/password').set('Authorization', u.auth).send({ currentPassword: PASSWORD, newPassword: NEW_PASSWORD });
    expect(ok.status).toBe(200);
    const auth = `Bearer ${ok.body.token}`;
    const codes: number[] = [];
    for (let i = 0; i < 5; i++) {
      codes.push((await request(limited).post('/api/me/password').set('Authorization', auth).send({ currentPassword: `guess number ${i}`, newPassword: 'yet another password' })).status);
    }
    expect(codes).toEqual([403, 403, 403, 429, 429]);
    const blocked = await request(limited).post('/api/me/password').set('Authorization', auth).send({ currentPassword: NEW_PASSWORD, newPassword: 'yet another password' });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate-limited');
    // Another account on the same address is not held back.
    const free = await request(limited).post('/api/me/password').set('Authorization', other.auth).send({ currentPassword: 'a wrong one', newPassword: NEW_PASSWORD });
    expect(free.status).toBe(403);
  });
});

