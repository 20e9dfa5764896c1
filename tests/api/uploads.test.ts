/**
 * Uploads: swatch photos (PNG, JPEG, WebP recognised by content with
 * file-type; <= 5 MiB), `.loop` imports (<= 1 MiB, UTF-8), and reading files
 * back with the right type, only for those who may see the pattern.
 * 413 Content Too Large and 415 Unsupported Media Type per RFC 9110.
 */
import { readdirSync } from 'node:fs';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PHOTO_MAX_BYTES, SOURCE_MAX_BYTES } from '../../shared/api-schemas.ts';
import { compile, summarizeForStorage } from '../../shared/index.ts';
import { Upload } from '../../server/models/index.ts';
import { makeUser, startHarness, type ApiHarness, type TestUser } from './helpers.ts';
import { gifBytes, jpegBytes, pngBytes, webpBytes } from './images.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let designer: TestUser;
let stranger: TestUser;
let patternId: number;
beforeAll(async () => {
  h = await startHarness();
  designer = await makeUser(h.app, 'up-designer');
  stranger = await makeUser(h.app, 'up-stranger');
  patternId = (await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Swatches', source: sampleSource() })).body.pattern.id;
});
afterAll(async () => { await h.close(); });

const uploadPhoto = (user: TestUser, data: Buffer, name: string) =>
  request(h.app).post(`/api/patterns/${patternId}/uploads`).set('Authorization', user.auth).attach('file', data, { filename: name, contentType: 'application/octet-stream' });

describe('swatch photos', () => {
  it.each([
    ['PNG', pngBytes(), 'swatch.png', 'image/png'],
    ['JPEG', jpegBytes(), 'swatch.jpg', 'image/jpeg'],
    ['WebP', webpBytes(), 'swatch.webp', 'image/webp'],
  ])('accepts a %s photo and serves it back with its type', async (_label, data, name, mime) => {
    const res = await uploadPhoto(designer, data, name);
    expect(res.status).toBe(201);
    expect(res.body.upload).toMatchObject({ kind: 'swatch', originalName: name, mimeType: mime, size: data.length });
    const back = await request(h.app).get(res.body.upload.url).set('Authorization', designer.auth).buffer(true).parse((r, cb) => {
      const parts: Buffer[] = [];
      r.on('data', (c: Buffer) => parts.push(c));
      r.on('end', () => cb(null, Buffer.concat(parts)));
    });
    expect(back.status).toBe(200);
    expect(back.headers['content-type']).toBe(mime);
    expect(Buffer.compare(back.body as Buffer, data)).toBe(0);
  });

  it('judges by content, not by name: a GIF or text named .png is refused with 415', async () => {
    expect((await uploadPhoto(designer, gifBytes(), 'swatch.png')).status).toBe(415);
    const text = await uploadPhoto(designer, Buffer.from('hello, not an image'), 'photo.jpg');
    expect(text.status).toBe(415);
    expect(text.body.error.code).toBe('unsupported-type');
  });

  it('refuses a photo over 5 MiB with 413 and accepts one of exactly 5 MiB', async () => {
    const over = await uploadPhoto(designer, pngBytes(PHOTO_MAX_BYTES + 1), 'big.png');
    expect(over.status).toBe(413);
    expect(over.body.error.code).toBe('too-large');
    const exact = pngBytes(PHOTO_MAX_BYTES);
    expect(exact.length).toBe(PHOTO_MAX_BYTES);
    expect((await uploadPhoto(designer, exact, 'exact.png')).status).toBe(201);
  });

  it('stores files under random keys, never the client file name', async () => {
    const res = await uploadPhoto(designer, pngBytes(), '../../etc/passwd.png');
    expect(res.status).toBe(201);
    // The display name keeps no directory part (multer's busboy drops it; we also replace separators).
    expect(res.body.upload.originalName).not.toMatch(/[\\/]/);
    expect(res.body.upload.originalName).toContain('passwd.png');
    const row = await Upload.findByPk(res.body.upload.id as number);
    expect(row!.storageKey).toMatch(/^[a-f0-9]{48}$/);
    expect(readdirSync(h.storageDir)).toContain(row!.storageKey);
    expect(readdirSync(h.storageDir).some((f) => f.includes('passwd'))).toBe(false);
  });

  it('requires a file (400) and hides photos of other people\'s patterns (404)', async () => {
    const none = await request(h.app).post(`/api/patterns/${patternId}/uploads`).set('Authorization', designer.auth).field('note', 'no file');
    expect(none.status).toBe(400);
    const mine = await uploadPhoto(designer, pngBytes(), 'private.png');
    expect((await request(h.app).get(mine.body.upload.url).set('Authorization', stranger.auth)).status).toBe(404);
    expect((await request(h.app).get(mine.body.upload.url)).status).toBe(401);
    expect((await uploadPhoto(stranger, pngBytes(), 'intruder.png')).status).toBe(404);
    const list = await request(h.app).get(`/api/patterns/${patternId}/uploads`).set('Authorization', designer.auth);
    expect(list.body.uploads.length).toBeGreaterThanOrEqual(5);
  });
});

describe('.loop import', () => {
  const importFile = (user: TestUser, data: Buffer, name: string) =>
    request(h.app).post('/api/patterns/import').set('Authorization', user.auth).attach('file', data, { filename: name, contentType: 'text/plain' });

  it('creates a pattern with revision 1 and the server-computed summary', async () => {
    const source = sampleSource('imported');
    const res = await importFile(designer, Buffer.from(source, 'utf8'), 'quarry-tote-panel.loop');
    expect(res.status).toBe(201);
    expect(res.body.revision).toMatchObject({ number: 1, source });
    expect(res.body.revision.summary).toEqual(summarizeForStorage(compile(source)));
    const expectedTitle = compile(source).header.title ?? 'quarry-tote-panel';
    expect(res.body.pattern.title).toBe(expectedTitle);
    expect(res.body.upload).toMatchObject({ kind: 'source', originalName: 'quarry-tote-panel.loop' });
  });

  it('refuses files over 1 MiB (413), other extensions (415) and bytes that are not UTF-8 (400)', async () => {
    expect((await importFile(designer, Buffer.alloc(SOURCE_MAX_BYTES + 1, 0x61), 'big.loop')).status).toBe(413);
    expect((await importFile(designer, Buffer.from('cast on 8'), 'notes.txt')).status).toBe(415);
    const latin1 = await importFile(designer, Buffer.from([0x63, 0x61, 0x73, 0x74, 0x20, 0xe9, 0x0a]), 'latin1.loop');
    expect(latin1.status).toBe(400);
    expect(latin1.body.error.code).toBe('not-utf8');
    expect((await request(h.app).post('/api/patterns/import').set('Authorization', designer.auth).field('x', 'y')).status).toBe(400);
  });

  it('lets only designers import (403 for a knitter account, 401 signed out)', async () => {
    const knitter = await makeUser(h.app, 'up-knitter', ['knitter']);
    expect((await importFile(knitter, Buffer.from('cast on 8'), 'k.loop')).status).toBe(403);
    expect((await request(h.app).post('/api/patterns/import').attach('file', Buffer.from('x'), 'a.loop')).status).toBe(401);
  });
});
