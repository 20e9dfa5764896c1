/**
 * Security checks against the running API and the compiler's renderers.
 *
 * Sources named per check: RFC 7519 (JWT) and RFC 8725 (JWT best current
 * practice: reject "none", pin the algorithm, beware key confusion); RFC
 * 9110 (413 Content Too Large, 415 Unsupported Media Type, 429 via RFC
 * 6585); the PNG specification's signature; the OWASP guidance on output
 * encoding (text put into HTML/SVG/XML is escaped: `<` `&` `"` never reach
 * markup raw) and on SQL injection (parameterised queries: SQL-looking
 * input is data, never code).
 */
import { generateKeyPairSync } from 'node:crypto';
import { existsSync, readdirSync } from 'node:fs';
import path from 'node:path';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compile } from '../../shared/index.ts';
import { buildChart, formatInstructionsText, renderBackSvg, renderChartSvg, writeInstructions } from '../../shared/render/index.ts';
import { User } from '../../server/models/index.ts';
import { buildApp, JWT_SECRET, makeUser, PASSWORD, startHarness, uniqueEmail, type ApiHarness, type TestUser } from './helpers.ts';
import { pngBytes } from './images.ts';

let h: ApiHarness;
let alice: TestUser;
let bob: TestUser;
beforeAll(async () => {
  h = await startHarness();
  alice = await makeUser(h.app, 'sec-alice');
  bob = await makeUser(h.app, 'sec-bob');
});
afterAll(async () => { await h.close(); });

const me = (token: string) => request(h.app).get('/api/me').set('Authorization', `Bearer ${token}`);
const b64url = (o: unknown) => Buffer.from(JSON.stringify(o)).toString('base64url');
const now = () => Math.floor(Date.now() / 1000);

describe('session tokens (RFC 7519, RFC 8725)', () => {
  it('accepts the token it issued (control for the checks below)', async () => {
    const res = await me(alice.token);
    expect(res.status).toBe(200);
    expect(res.body.user.email).toBe(alice.email);
  });

  it('refuses a tampered payload: another user id under the original signature', async () => {
    const [header, payload, signature] = alice.token.split('.');
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString()) as Record<string, unknown>;
    const forged = `${header}.${b64url({ ...claims, sub: String(bob.id) })}.${signature}`;
    expect((await me(forged)).status).toBe(401);
  });

  it('refuses a token whose signature was altered', async () => {
    const [header, payload, signature] = alice.token.split('.');
    const flipped = signature.slice(0, -2) + (signature.endsWith('AA') ? 'BB' : 'AA');
    expect((await me(`${header}.${payload}.${flipped}`)).status).toBe(401);
  });

  it('refuses an expired token signed with the right key', async () => {
    const expired = jwt.sign({ sv: 0, iat: now() - 7200, exp: now() - 3600 }, JWT_SECRET, { algorithm: 'HS256', subject: String(alice.id) });
    expect((await me(expired)).status).toBe(401);
  });

  it('refuses alg "none" (unsigned) tokens', async () => {
    const unsigned = `${b64url({ alg: 'none', typ: 'JWT' })}.${b64url({ sv: 0, sub: String(alice.id), iat: now(), exp: now() + 3600 })}.`;
    expect((await me(unsigned)).status).toBe(401);
  });

  it('refuses HS512 with another key, and HS512 even with the right key (the algorithm is pinned to HS256)', async () => {
    const other = jwt.sign({ sv: 0 }, 'some-other-secret', { algorithm: 'HS512', subject: String(alice.id), expiresIn: 3600 });
    expect((await me(other)).status).toBe(401);
    const rightKey = jwt.sign({ sv: 0 }, JWT_SECRET, { algorithm: 'HS512', subject: String(alice.id), expiresIn: 3600 });
    expect((await me(rightKey)).status).toBe(401);
  });

  it('refuses RS256 tokens and the RS256/HS256 key confusion (an HMAC made with a public key)', async () => {
    const { privateKey, publicKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
    const rs = jwt.sign({ sv: 0 }, privateKey.export({ type: 'pkcs8', format: 'pem' }), { algorithm: 'RS256', subject: String(alice.id), expiresIn: 3600 });
    expect((await me(rs)).status).toBe(401);
    const pem = publicKey.export({ type: 'spki', format: 'pem' }).toString();
    const header = b64url({ alg: 'HS256', typ: 'JWT' });
    const body = b64url({ sv: 0, sub: String(alice.id), iat: now(), exp: now() + 3600 });
    const { createHmac } = await import('node:crypto');
    const confused = `${header}.${body}.${createHmac('sha256', pem).update(`${header}.${body}`).digest('base64url')}`;
    expect((await me(confused)).status).toBe(401);
  });

  it('refuses the same tampering through the session cookie', async () => {
    const [header, payload, signature] = alice.token.split('.');
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString()) as Record<string, unknown>;
    const forged = `${header}.${b64url({ ...claims, sub: String(bob.id) })}.${signature}`;
    expect((await request(h.app).get('/api/me').set('Cookie', `lw_session=${forged}`)).status).toBe(401);
    expect((await request(h.app).get('/api/me').set('Cookie', `lw_session=${alice.token}`)).status).toBe(200);
  });
});

describe('rate limits on sign-in, register and password reset (RFC 6585: 429)', () => {
  it('answers 429 rate-limited after the limit, per route', async () => {
    const app = buildApp(h, { rateLimits: { login: { windowMs: 60_000, limit: 3 }, register: { windowMs: 60_000, limit: 2 }, reset: { windowMs: 60_000, limit: 2 } } });
    const tries = async (n: number, send: () => request.Test) => { const out: number[] = []; for (let i = 0; i < n; i++) out.push((await send()).status); return out; };

    const logins = await tries(5, () => request(app).post('/api/auth/login').send({ email: alice.email, password: 'wrong password here' }));
    expect(logins).toEqual([401, 401, 401, 429, 429]);
    // The right password does not get past the limit either.
    const blocked = await request(app).post('/api/auth/login').send({ email: alice.email, password: PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate-limited');
    expect(blocked.headers).toHaveProperty('ratelimit-policy');

    const registers = await tries(3, () => request(app).post('/api/auth/register').send({ email: uniqueEmail('sec-rl'), password: PASSWORD, name: 'Rate Limit' }));
    expect(registers).toEqual([201, 201, 429]);

    const resets = await tries(3, () => request(app).post('/api/auth/password-reset').send({ email: alice.email }));
    expect(resets).toEqual([202, 202, 429]);
  });
});

describe('uploads', () => {
  let patternId: number;
  beforeAll(async () => {
    const res = await request(h.app).post('/api/patterns').set('Authorization', alice.auth).send({ title: 'Upload checks', source: 'cast on 8\n' });
    patternId = res.body.pattern.id;
  });
  const upload = (data: Buffer, filename: string) =>
    request(h.app).post(`/api/patterns/${patternId}/uploads`).set('Authorization', alice.auth).attach('file', data, { filename, contentType: 'image/png' });

  it('refuses a wrong type behind a right extension and a right Content-Type (415): script, SVG, HTML, a PNG signature cut short', async () => {
    const fakes: [string, Buffer][] = [
      ['script.png', Buffer.from('<script>alert(1)</script>')],
      ['vector.png', Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"><circle r="4"/></svg>')],
      ['page.jpg', Buffer.from('<!doctype html><html><body onload="alert(1)"></body></html>')],
      ['short.png', pngBytes().subarray(0, 6)], // the 8-byte PNG signature, truncated
    ];
    for (const [name, data] of fakes) {
      const res = await upload(data, name);
      expect(res.status, name).toBe(415);
      expect(res.body.error.code).toBe('unsupported-type');
    }
  });

  it('refuses an oversized photo (413) and an oversized import (413)', async () => {
    const big = await upload(pngBytes(5 * 1024 * 1024 + 1), 'big.png');
    expect(big.status).toBe(413);
    const loop = await request(h.app).post('/api/patterns/import').set('Authorization', alice.auth).attach('file', Buffer.alloc(1024 * 1024 + 1, 'k'), { filename: 'big.loop' });
    expect(loop.status).toBe(413);
  });

  it('keeps a path-like name as a display name only: nothing is written outside the storage folder', async () => {
    const res = await upload(pngBytes(), '../../etc/passwd.png');
    expect(res.status).toBe(201);
    expect(res.body.upload.originalName).not.toMatch(/[\\/]/);
    expect(res.body.upload.originalName).toContain('passwd.png');
    // The bytes live under a random key inside the storage folder, and nowhere the name points to.
    expect(readdirSync(h.storageDir).every((f) => /^[a-f0-9]{48}$/.test(f))).toBe(true);
    expect(existsSync(path.resolve(h.storageDir, '../../etc/passwd.png'))).toBe(false);
    const back = await request(h.app).get(res.body.upload.url).set('Authorization', alice.auth);
    expect(back.status).toBe(200);
    expect(back.headers['content-type']).toBe('image/png');
    expect(back.headers['x-content-type-options']).toBe('nosniff');
    expect(back.headers['content-disposition']).toMatch(/^inline; filename\*=UTF-8''[^/\\\s"]+$/);
    const imported = await request(h.app).post('/api/patterns/import').set('Authorization', alice.auth).attach('file', Buffer.from('cast on 8\n'), { filename: '..\\..\\windows\\evil.loop' });
    expect(imported.status).toBe(201);
    expect(imported.body.upload.originalName).not.toMatch(/[\\/]/);
  });

  it('refuses binary data named .loop (400), so an image cannot become a pattern source', async () => {
    const res = await request(h.app).post('/api/patterns/import').set('Authorization', alice.auth).attach('file', pngBytes(), { filename: 'swatch.loop' });
    expect(res.status).toBe(400);
    expect(['not-utf8', 'not-text']).toContain(res.body.error.code);
  });
});

/** Strings that would run if any renderer put them into markup unescaped. */
const HOSTILE = {
  title: '<script>alert("title")</script>',
  yarnLabel: '</text><script>alert(1)</script><text>',
  yarnName: 'Bx',
  note: '<svg onload=alert(2)> & <img src=x onerror=alert(3)>',
  designer: "<iframe src='javascript:alert(4)'>",
  comment: '<img src=x onerror=alert(5)>',
};

const HOSTILE_SOURCE = [
  `title "${HOSTILE.title.replace(/"/g, "'")}"`,
  `designer "${HOSTILE.designer}"`,
  'gauge 28 sts and 32 rounds per 10 cm',
  'yarn A "Harbour" #1d3557',
  `yarn ${HOSTILE.yarnName} "${HOSTILE.yarnLabel}" #cfe8e0`,
  'cast on 16 in A',
  'chart dots:',
  '  key "." A',
  `  key "x" ${HOSTILE.yarnName}`,
  '  |.x..|',
  `round 1: k to end note "${HOSTILE.note}"`,
  'rounds 2-3: chart dots',
  '',
].join('\n');

/** Fails when an XML document has a script element, an event-handler attribute or a javascript: URL. */
function expectInertSvg(svg: string, label: string): void {
  expect(XMLValidator.validate(svg), label).toBe(true);
  const doc = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '@', preserveOrder: true }).parse(svg) as unknown[];
  const walk = (nodes: unknown[]) => {
    for (const node of nodes as Record<string, unknown>[]) {
      for (const [key, value] of Object.entries(node)) {
        if (key === ':@') {
          for (const [attr, v] of Object.entries(value as Record<string, string>)) {
            expect(attr.toLowerCase(), `${label}: attribute ${attr}`).not.toMatch(/^@on/);
            expect(String(v), `${label}: ${attr}`).not.toMatch(/^\s*javascript:/i);
          }
        } else if (key !== '#text') {
          expect(key.toLowerCase(), label).not.toMatch(/^(script|iframe|foreignobject|img)$/);
          walk(value as unknown[]);
        }
      }
    }
  };
  walk(doc);
}

describe('script and SVG injection through titles, notes, comments and yarn names', () => {
  it('the API stores them as text and gives them back unchanged, as JSON', async () => {
    const created = await request(h.app).post('/api/patterns').set('Authorization', alice.auth).send({ title: HOSTILE.title, source: HOSTILE_SOURCE });
    expect(created.status).toBe(201);
    const id = created.body.pattern.id as number;
    const read = await request(h.app).get(`/api/patterns/${id}`).set('Authorization', alice.auth);
    expect(read.headers['content-type']).toMatch(/^application\/json/);
    expect(read.body.pattern.title).toBe(HOSTILE.title);
    expect(read.body.latestRevision.source).toBe(HOSTILE_SOURCE);
    const comment = await request(h.app).post(`/api/patterns/${id}/revisions/1/comments`).set('Authorization', alice.auth).send({ body: HOSTILE.comment });
    expect(comment.status).toBe(201);
    const comments = await request(h.app).get(`/api/patterns/${id}/revisions/1/comments`).set('Authorization', alice.auth);
    expect(comments.body.comments.map((c: { body: string }) => c.body)).toContain(HOSTILE.comment);
  });

  it('the compiler keeps them as text (labels and notes come back verbatim in the model)', () => {
    const r = compile(HOSTILE_SOURCE);
    expect(r.diagnostics.filter((d) => d.severity === 'error')).toEqual([]);
    expect(r.header.yarns.find((y) => y.name === HOSTILE.yarnName)?.label).toBe(HOSTILE.yarnLabel);
    expect(r.header.designer).toBe(HOSTILE.designer);
  });

  it('the chart SVG (front and back) is well-formed XML with no script, handler or javascript: URL, and shows the text escaped', () => {
    const r = compile(HOSTILE_SOURCE);
    const chart = buildChart(r);
    expect(chart).not.toBeNull();
    const front = renderChartSvg(chart!);
    const back = renderBackSvg(chart!);
    for (const [label, svg] of [['front', front], ['back', back]] as const) {
      expectInertSvg(svg, label);
      expect(svg).not.toContain('<script');
    }
    // The legend names the yarn by its label: the label is there, escaped.
    for (const svg of [front, back]) expect(svg).toContain('&lt;/text&gt;&lt;script&gt;alert(1)&lt;/script&gt;&lt;text&gt;');
  });

  it('the written instructions carry the note as plain text (no markup is produced)', () => {
    const r = compile(HOSTILE_SOURCE);
    const ins = writeInstructions(HOSTILE_SOURCE, r);
    expect(ins).not.toBeNull();
    const text = formatInstructionsText(ins!);
    expect(text).toContain(HOSTILE.note);
  });

  it('the export API serves the SVG inert and the text as text/plain, with a safe file name', async () => {
    const created = await request(h.app).post('/api/patterns').set('Authorization', alice.auth).send({ title: `${HOSTILE.title}\r\nSet-Cookie: x=1`, source: HOSTILE_SOURCE });
    expect(created.status).toBe(201);
    const id = created.body.pattern.id as number;
    const svg = await request(h.app).get(`/api/patterns/${id}/revisions/1/export?format=svg`).set('Authorization', alice.auth).buffer(true).parse((res, cb) => {
      let data = '';
      res.setEncoding('utf8');
      res.on('data', (c: string) => { data += c; });
      res.on('end', () => cb(null, data));
    });
    expect(svg.status).toBe(200);
    expect(svg.headers['content-type']).toMatch(/^image\/svg\+xml/);
    expect(svg.headers['set-cookie']).toBeUndefined();
    expect(svg.headers['content-disposition']).not.toMatch(/[<>\r\n]/);
    expectInertSvg(svg.body as string, 'export svg');
    const txt = await request(h.app).get(`/api/patterns/${id}/revisions/1/export?format=txt`).set('Authorization', alice.auth);
    expect(txt.status).toBe(200);
    expect(txt.headers['content-type']).toMatch(/^text\/plain/);
    expect(txt.headers['x-content-type-options']).toBe('nosniff');
  }, 120_000);
});

describe('SQL-looking input is data, never SQL', () => {
  const INJECTIONS = ["' OR '1'='1", "1; DROP TABLE users; --", "Robert'); DROP TABLE patterns;--", '" OR ""="', '%\' UNION SELECT passwordHash FROM users -- '];

  it('sign-in with SQL in the e-mail or password fails like any wrong password (400 or 401), never 500', async () => {
    for (const s of INJECTIONS) {
      const asEmail = await request(h.app).post('/api/auth/login').send({ email: s, password: s });
      expect([400, 401], s).toContain(asEmail.status);
      const asPassword = await request(h.app).post('/api/auth/login').send({ email: alice.email, password: s });
      expect(asPassword.status, s).toBe(401);
    }
    const quoted = await request(h.app).post('/api/auth/login').send({ email: "o'brien'--@test.example", password: "' OR 1=1 --" });
    expect(quoted.status).toBe(401);
  });

  it('names and titles full of SQL are stored verbatim and the tables are intact', async () => {
    const usersBefore = await User.count();
    const reg = await request(h.app).post('/api/auth/register').send({ email: uniqueEmail('sec-sql'), password: PASSWORD, name: INJECTIONS[2] });
    expect(reg.status).toBe(201);
    expect(reg.body.user.name).toBe(INJECTIONS[2]);
    for (const title of INJECTIONS) {
      const res = await request(h.app).post('/api/patterns').set('Authorization', alice.auth).send({ title, source: 'cast on 8\n' });
      expect(res.status, title).toBe(201);
      expect(res.body.pattern.title).toBe(title.trim()); // titles are trimmed, otherwise kept
    }
    expect(await User.count()).toBe(usersBefore + 1);
    const list = await request(h.app).get('/api/patterns').set('Authorization', alice.auth);
    expect(list.status).toBe(200);
    // Only Alice's own patterns: the quotes did not widen the query.
    expect(list.body.patterns.every((p: { myRole: string }) => p.myRole === 'owner')).toBe(true);
    expect((await request(h.app).get('/api/patterns').set('Authorization', bob.auth)).body.patterns).toEqual([]);
  });

  it('path and query parameters with SQL get 400 or 404, never data and never 500', async () => {
    const own = await request(h.app).post('/api/patterns').set('Authorization', alice.auth).send({ title: 'SQL query params', source: 'cast on 8\nround 1: k to end\n' });
    const id = own.body.pattern.id as number;
    const paths = [
      `/api/patterns/${encodeURIComponent(`${id} OR 1=1`)}`,
      `/api/patterns/${encodeURIComponent("1' OR '1'='1")}/revisions`,
      `/api/patterns/${id}/revisions/${encodeURIComponent('1 UNION SELECT 1')}`,
      `/api/uploads/${encodeURIComponent('1;DROP TABLE uploads')}`,
      `/api/patterns/${id}/diff?from=${encodeURIComponent('1 OR 1=1')}&to=1`,
      `/api/patterns/${id}/revisions/1/export?format=${encodeURIComponent("svg' --")}`,
      `/api/patterns/${id}/revisions/1/export?format=txt&size=${encodeURIComponent("S' OR '1'='1")}`,
    ];
    for (const p of paths) {
      const res = await request(h.app).get(p).set('Authorization', bob.auth);
      expect([400, 404], p).toContain(res.status);
      const mine = await request(h.app).get(p).set('Authorization', alice.auth);
      expect([400, 404], p).toContain(mine.status);
      expect(mine.body.error.message).not.toMatch(/SQL|syntax|mariadb/i);
    }
    const invite = await request(h.app).post(`/api/patterns/${id}/members`).set('Authorization', alice.auth).send({ email: "x' OR 1=1 --", role: 'editor' });
    expect(invite.status).toBe(400);
  });
});
