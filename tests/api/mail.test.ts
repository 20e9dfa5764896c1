/**
 * Invitations and password resets by e-mail: the mails travel over a real
 * SMTP conversation (nodemailer -> smtp-server on a free loopback port),
 * carry a link that works exactly once, and show up in GET /api/dev/outbox.
 * 410 Gone for used or expired links per RFC 9110 §15.5.11.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Invitation, PasswordReset } from '../../server/models/index.ts';
import { hashToken } from '../../server/services/tokens.ts';
import { PASSWORD, PUBLIC_URL, buildApp, makeUser, startHarness, tokenFromLink, uniqueEmail, type ApiHarness, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let designer: TestUser;
let patternId: number;
beforeAll(async () => {
  h = await startHarness();
  designer = await makeUser(h.app, 'mail-designer');
  patternId = (await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Tidepool Cowl', source: sampleSource() })).body.pattern.id;
});
afterAll(async () => { await h.close(); });

const invite = (email: string, role: string) =>
  request(h.app).post(`/api/patterns/${patternId}/members`).set('Authorization', designer.auth).send({ email, role });

describe('invitations', () => {
  it('mails an invitation with a link; a new person accepts once, gets an account and sees the pattern', async () => {
    const email = uniqueEmail('invitee');
    const res = await invite(email, 'editor');
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ invitation: { email, role: 'editor', acceptedAt: null }, delivered: true });

    const mail = await h.smtp.waitFor(email);
    expect(mail.subject).toContain('Tidepool Cowl');
    expect(mail.text).toContain(designer.name);
    expect(mail.html).toContain('<a href=');
    const link = mail.links.find((l) => l.startsWith(`${PUBLIC_URL}/invitations/`));
    expect(link).toBeDefined();
    const token = tokenFromLink(link!, 'invitations');
    // Only the hash is stored.
    expect(await Invitation.count({ where: { tokenHash: token } })).toBe(0);
    expect(await Invitation.count({ where: { tokenHash: hashToken(token) } })).toBe(1);

    const info = await request(h.app).get(`/api/invitations/${token}`);
    expect(info.body.invitation).toMatchObject({ email, role: 'editor', patternTitle: 'Tidepool Cowl', accountExists: false, invitedBy: designer.name });

    const missing = await request(h.app).post(`/api/invitations/${token}/accept`).send({});
    expect(missing.status).toBe(400);
    expect(missing.body.error.code).toBe('account-details-required');

    const accepted = await request(h.app).post(`/api/invitations/${token}/accept`).send({ name: 'Idris Test', password: PASSWORD });
    expect(accepted.status).toBe(201);
    expect(accepted.body).toMatchObject({ user: { email, name: 'Idris Test' }, patternId, role: 'editor' });
    const seen = await request(h.app).get(`/api/patterns/${patternId}`).set('Authorization', `Bearer ${accepted.body.token}`);
    expect(seen.status).toBe(200);
    expect(seen.body.pattern.myRole).toBe('editor');

    const again = await request(h.app).post(`/api/invitations/${token}/accept`).send({ name: 'Someone', password: PASSWORD });
    expect(again.status).toBe(410);
    expect(again.body.error.code).toBe('invitation-used');
    expect((await request(h.app).get(`/api/invitations/${token}`)).status).toBe(410);
  });

  it('adds an existing account as a member without asking for a password', async () => {
    const knitter = await makeUser(h.app, 'existing-knitter');
    await invite(knitter.email, 'test-knitter');
    const mail = await h.smtp.waitFor(knitter.email);
    const token = tokenFromLink(mail.links[0]!, 'invitations');
    expect((await request(h.app).get(`/api/invitations/${token}`)).body.invitation.accountExists).toBe(true);
    const res = await request(h.app).post(`/api/invitations/${token}/accept`).set('Authorization', knitter.auth).send({});
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ user: { id: knitter.id }, role: 'test-knitter', signedIn: true });
    const members = await request(h.app).get(`/api/patterns/${patternId}/members`).set('Authorization', designer.auth);
    expect(members.body.members).toContainEqual(expect.objectContaining({ user: expect.objectContaining({ id: knitter.id }), role: 'test-knitter' }));
    // Inviting a current member again is a conflict.
    expect((await invite(knitter.email, 'editor')).status).toBe(409);
  });

  it('refuses unknown (404) and expired (410) invitation links and bad invitation payloads (400)', async () => {
    expect((await request(h.app).post('/api/invitations/no-such-token/accept').send({})).status).toBe(404);
    const email = uniqueEmail('late');
    await invite(email, 'knitter');
    const token = tokenFromLink((await h.smtp.waitFor(email)).links[0]!, 'invitations');
    await Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    const late = await request(h.app).post(`/api/invitations/${token}/accept`).send({ name: 'Late', password: PASSWORD });
    expect(late.status).toBe(410);
    expect(late.body.error.code).toBe('invitation-expired');
    expect((await invite('not-an-email', 'editor')).status).toBe(400);
    expect((await invite(uniqueEmail('x'), 'owner')).status).toBe(400);
    expect((await invite(designer.email, 'editor')).status).toBe(400);
  });

  it('escapes pattern titles in the HTML part of the mail', async () => {
    const created = await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: '<b>Bold</b> & "Co"' });
    const email = uniqueEmail('escape');
    await request(h.app).post(`/api/patterns/${created.body.pattern.id}/members`).set('Authorization', designer.auth).send({ email, role: 'editor' });
    const mail = await h.smtp.waitFor(email);
    expect(mail.html).toContain('&lt;b&gt;Bold&lt;/b&gt; &amp; &quot;Co&quot;');
    expect(mail.html).not.toContain('<b>Bold</b>');
    expect(mail.text).toContain('"<b>Bold</b> & "Co""');
  });

  it('lists the caught mails in GET /api/dev/outbox, newest first, with links', async () => {
    const email = uniqueEmail('outbox');
    await invite(email, 'knitter');
    await h.smtp.waitFor(email);
    const res = await request(h.app).get('/api/dev/outbox');
    expect(res.status).toBe(200);
    const first = res.body.messages[0];
    expect(first).toMatchObject({ to: email, subject: expect.stringContaining('invited'), links: [expect.stringContaining('/invitations/')] });
    expect(typeof first.id).toBe('string');
    expect(Number.isNaN(Date.parse(first.receivedAt))).toBe(false);
  });

  it('hides the outbox in production', async () => {
    const prod = buildApp(h, { env: 'production' });
    expect((await request(prod).get('/api/dev/outbox')).status).toBe(404);
  });
});

describe('password reset', () => {
  it('mails a one-use link; the new password works, the old one and old sessions stop working', async () => {
    const user = await makeUser(h.app, 'resetter');
    const res = await request(h.app).post('/api/auth/password-reset').send({ email: user.email });
    expect(res.status).toBe(202);
    const mail = await h.smtp.waitFor(user.email);
    expect(mail.subject).toMatch(/password/i);
    const link = mail.links.find((l) => l.startsWith(`${PUBLIC_URL}/reset-password/`))!;
    const token = tokenFromLink(link, 'reset-password');

    const weak = await request(h.app).post(`/api/auth/password-reset/${token}`).send({ password: 'short' });
    expect(weak.status).toBe(400);
    const done = await request(h.app).post(`/api/auth/password-reset/${token}`).send({ password: 'a brand new password' });
    expect(done.status).toBe(204);
    const twice = await request(h.app).post(`/api/auth/password-reset/${token}`).send({ password: 'yet another password' });
    expect(twice.status).toBe(410);
    expect(twice.body.error.code).toBe('token-used');

    expect((await request(h.app).post('/api/auth/login').send({ email: user.email, password: PASSWORD })).status).toBe(401);
    expect((await request(h.app).post('/api/auth/login').send({ email: user.email, password: 'a brand new password' })).status).toBe(200);
    // The session from before the reset has ended.
    expect((await request(h.app).get('/api/me').set('Authorization', user.auth)).status).toBe(401);
    // And the address is told of the change, with no secret link in the notice.
    let notice = h.smtp.list().find((m) => m.to.includes(user.email) && /password was changed/i.test(m.subject));
    for (let waited = 0; !notice && waited < 5000; waited += 50) {
      await new Promise((r) => setTimeout(r, 50));
      notice = h.smtp.list().find((m) => m.to.includes(user.email) && /password was changed/i.test(m.subject));
    }
    expect(notice?.text).toContain('reset link');
    expect(notice?.links).toEqual([`${PUBLIC_URL}/reset-password`]);
  });

  it('answers the same 202 for an unknown e-mail and sends nothing', async () => {
    const email = uniqueEmail('ghost');
    const known = await makeUser(h.app, 'known');
    const a = await request(h.app).post('/api/auth/password-reset').send({ email });
    const b = await request(h.app).post('/api/auth/password-reset').send({ email: known.email });
    expect(a.status).toBe(202);
    expect(a.body).toEqual(b.body);
    await h.smtp.waitFor(known.email);
    expect(h.smtp.list().some((m) => m.to.includes(email))).toBe(false);
  });

  it('refuses an expired reset link (410) and an unknown one (404)', async () => {
    const user = await makeUser(h.app, 'expired-reset');
    await request(h.app).post('/api/auth/password-reset').send({ email: user.email });
    const token = tokenFromLink((await h.smtp.waitFor(user.email)).links[0]!, 'reset-password');
    await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    const res = await request(h.app).post(`/api/auth/password-reset/${token}`).send({ password: 'a brand new password' });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('token-expired');
    expect((await request(h.app).post('/api/auth/password-reset/unknown').send({ password: 'a brand new password' })).status).toBe(404);
  });
});
