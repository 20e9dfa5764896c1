/**
 * Exports against the real database and the worker thread: every format
 * with its content checked by an outside reader (the PDF's text extracted
 * with pdf-parse; the PNG's signature and IHDR size read per the PNG
 * specification; the SVG checked well-formed with fast-xml-parser), the
 * export job with progress, and the access rules (knitters export released
 * revisions only). Counts are taken from the summary the server stored
 * with the revision (the shared compiler's), not written here.
 */
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startHarness, type ApiHarness } from './helpers.ts';
import { as, makeReviewCast, releaseRevision, saveRevision, type ReviewCast, type Who } from './review-fixture.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let cast: ReviewCast;
let base: string;
type Counts = { number: number; front: number; backing: number; total: number };
let sizeM: Counts[];

/** Raw bytes of a supertest response. */
const binary = (r: import('supertest').Test) => r.buffer(true).parse((res, cb) => {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
});
const get = (who: Who | null, path: string) => binary(as(h.app, who ? cast.people[who] : null, 'get', `${base}${path}`));

beforeAll(async () => {
  h = await startHarness();
  cast = await makeReviewCast(h.app, 'ex');
  base = `/api/patterns/${cast.patternId}`;
  expect((await releaseRevision(h.app, cast, 1, '1.0')).status).toBe(201);
  await saveRevision(h.app, cast, sampleSource('unreleased'), 'draft after release');
  const rev = await as(h.app, cast.people.owner, 'get', `${base}/revisions/1`);
  sizeM = (rev.body.revision.summary.sizes as { name: string; rounds: Counts[] }[]).find((s) => s.name === 'M')!.rounds;
}, 60_000);
afterAll(async () => h.close());

/** "69 sts: 64 + 5 backing" or "64 sts", the way counts are written (shared/render formatCounts). */
const countText = (c: Counts) => (c.backing > 0 ? `${c.total} sts: ${c.front} + ${c.backing} backing` : `${c.total} sts`);
/** The first round whose counts differ from the round before (so the instructions print them). */
const firstChangedCount = () => sizeM.find((r, i) => i > 0 && r.total !== sizeM[i - 1]!.total)!;

describe('PDF', () => {
  it('has the title, version, sizes, gauge, yarns, abbreviations, cautions, round 1 and the counts, as text a PDF reader extracts', async () => {
    const res = await get('knitter', '/revisions/1/export?format=pdf&size=M');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="lantern-mitts-v1\.0-m\.pdf"$/);
    const bytes = res.body as Buffer;
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const parser = new PDFParse({ data: new Uint8Array(bytes) });
    const parsed = await parser.getText();
    await parser.destroy();
    // pdf-parse breaks lines where the layout wrapped them; compare with whitespace collapsed.
    const text = parsed.text.replace(/\s+/g, ' ');
    expect(text).toContain('Lantern Mitts');
    expect(text).toContain('Version 1.0 (revision 1), size M');
    expect(text).toMatch(/Sizes: S, M, L/);
    expect(text).toMatch(/Gauge: \d+ sts and \d+ rows per/);
    expect(text).toMatch(/A: .*about \d+ m/);
    expect(text).toContain('Abbreviations');
    expect(text).toContain('k: knit');
    expect(text).toContain('fibre content'); // care-label caution (product.md, cautions)
    expect(text).toContain('baby or a toddler'); // floats and small parts caution
    expect(text).toContain('not a safety certification');
    expect(text).toMatch(/Rnds? 1\b|Rnds? 1–/); // round 1 is there
    expect(text).toMatch(/Cast on \d+ sts/);
    const changed = firstChangedCount();
    expect(text).toContain(countText(changed));
    expect(parsed.total).toBeGreaterThanOrEqual(3);
    expect(text).toMatch(/Page 1 of \d+/);
  }, 60_000);

  it('never splits a round\'s entry across pages: every entry label and its text sit on one page', async () => {
    const res = await get('owner', '/revisions/1/export?format=pdf&size=L');
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    const parsed = await parser.getText();
    await parser.destroy();
    const txt = await get('owner', '/revisions/1/export?format=txt&size=L');
    const entries = (txt.body as Buffer).toString('utf8').split('\n').filter((l) => /^(Rnds?|Rows?) \d/.test(l));
    expect(entries.length).toBeGreaterThan(5);
    const pages = parsed.pages.map((p) => p.text.replace(/\s+/g, ' '));
    for (const entry of entries) {
      const label = entry.slice(0, entry.indexOf(':'));
      // The end of the entry (its last words) must be on the page that has its label.
      const tail = entry.replace(/\s+/g, ' ').split(' ').slice(-3).join(' ').replace(/\)$/, '');
      const page = pages.find((p) => p.includes(`${label} `));
      expect(page, label).toBeDefined();
      expect(page!.includes(tail), `${label} ends on its own page`).toBe(true);
    }
  }, 60_000);
});

describe('text, SVG and PNG', () => {
  it('plain text has round 1, counts, the key and the cautions', async () => {
    const res = await get('knitter', '/revisions/1/export?format=txt&size=M');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/plain; charset=utf-8');
    const text = (res.body as Buffer).toString('utf8');
    expect(text).toMatch(/^Rnds? 1\b/m);
    expect(text).toContain(`(${countText(firstChangedCount())})`);
    expect(text).toContain('Abbreviations');
    expect(text).toContain('Cautions');
  });

  it('the chart as SVG is well-formed XML with an <svg> root; the back view differs', async () => {
    const front = await get('knitter', '/revisions/1/export?format=svg&size=M');
    expect(front.status).toBe(200);
    expect(front.headers['content-type']).toMatch(/^image\/svg\+xml/);
    const svg = (front.body as Buffer).toString('utf8');
    expect(XMLValidator.validate(svg)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false }).parse(svg) as { svg?: Record<string, string> };
    expect(doc.svg?.['@_xmlns']).toBe('http://www.w3.org/2000/svg');
    const back = await get('knitter', '/revisions/1/export?format=svg&size=M&view=back');
    expect(back.headers['content-disposition']).toContain('-chart-back.svg');
    const backSvg = (back.body as Buffer).toString('utf8');
    expect(XMLValidator.validate(backSvg)).toBe(true);
    expect(backSvg).not.toBe(svg);
  });

  it('the chart as PNG has the PNG signature and twice the SVG size (IHDR, PNG specification)', async () => {
    const svg = (await get('owner', '/revisions/1/export?format=svg&size=S')).body.toString('utf8') as string;
    const attrs = new XMLParser({ ignoreAttributes: false }).parse(svg).svg as Record<string, string>;
    const res = await get('owner', '/revisions/1/export?format=png&size=S');
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    const png = res.body as Buffer;
    expect([...png.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
    expect(png.subarray(12, 16).toString('latin1')).toBe('IHDR');
    expect(png.readUInt32BE(16)).toBe(Math.ceil(Number(attrs['@_width']) * 2));
    expect(png.readUInt32BE(20)).toBe(Math.ceil(Number(attrs['@_height']) * 2));
  }, 30_000);
});

describe('export access and parameters', () => {
  it('knitters export released revisions only; members of other roles and strangers as the policy says', async () => {
    expect((await get('knitter', '/revisions/2/export?format=txt')).status).toBe(404);
    expect((await get('testKnitter', '/revisions/2/export?format=txt')).status).toBe(404);
    expect((await get('editor', '/revisions/2/export?format=txt')).status).toBe(200);
    expect((await get('owner', '/revisions/2/export?format=txt')).status).toBe(200);
    expect((await get('stranger', '/revisions/1/export?format=txt')).status).toBe(404);
    expect((await get(null, '/revisions/1/export?format=txt')).status).toBe(401);
    expect((await get('owner', '/revisions/99/export?format=txt')).status).toBe(404);
  });

  it('answers 400 for a bad format, size or view', async () => {
    for (const q of ['format=doc', '', 'format=pdf&size=XXL', 'format=svg&view=side', 'format=pdf&format=txt']) {
      const r = await as(h.app, cast.people.owner, 'get', `${base}/revisions/1/export?${q}`);
      expect(r.status, q).toBe(400);
    }
  });
});

describe('export jobs with progress', () => {
  it('POST .../exports queues a job; GET /api/exports/:job reports progress until done; the file downloads once done', async () => {
    const start = await as(h.app, cast.people.knitter, 'post', `${base}/revisions/1/exports`).send({ format: 'pdf', size: 'S' });
    expect(start.status).toBe(202);
    expect(start.body.job).toMatchObject({ state: expect.stringMatching(/queued|running/), format: 'pdf', url: null, error: null });
    const id = start.body.job.id as string;
    const seen: number[] = [];
    let job = start.body.job as { state: string; progress: number; url: string | null };
    for (let i = 0; i < 600 && job.state !== 'done' && job.state !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = (await as(h.app, cast.people.knitter, 'get', `/api/exports/${id}`)).body.job;
      seen.push(job.progress);
    }
    expect(job.state).toBe('done');
    expect(job.progress).toBe(1);
    expect(job.url).toBe(`/api/exports/${id}/download`);
    // Progress never goes back.
    for (let i = 1; i < seen.length; i++) expect(seen[i]!).toBeGreaterThanOrEqual(seen[i - 1]!);
    const file = await binary(as(h.app, cast.people.knitter, 'get', job.url!));
    expect(file.status).toBe(200);
    expect((file.body as Buffer).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    // Someone else's job does not exist for them.
    expect((await as(h.app, cast.people.owner, 'get', `/api/exports/${id}`)).status).toBe(404);
    expect((await as(h.app, cast.people.owner, 'get', `/api/exports/${id}/download`)).status).toBe(404);
    expect((await as(h.app, cast.people.knitter, 'get', '/api/exports/nope')).status).toBe(404);
  }, 90_000);

  it('jobs check access and parameters before queueing', async () => {
    expect((await as(h.app, cast.people.knitter, 'post', `${base}/revisions/2/exports`).send({ format: 'pdf' })).status).toBe(404);
    expect((await as(h.app, cast.people.knitter, 'post', `${base}/revisions/1/exports`).send({ format: 'docx' })).status).toBe(400);
  });
});
