/**
 * The demo seed (contracts.md: demo accounts and one pattern per
 * examples/*.loop owned by the designer) is idempotent and stores revision 1
 * with the summary of the shared compiler.
 */
import { mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { compile, summarizeForStorage } from '../../shared/index.ts';
import { changedDemoExamples, DEMO_ACCOUNTS, DEMO_PASSWORD, seedDemo } from '../../server/db/seed.ts';
import { Pattern, Revision, User } from '../../server/models/index.ts';
import { startHarness, type ApiHarness } from './helpers.ts';

let h: ApiHarness;
beforeAll(async () => { h = await startHarness(); });
afterAll(async () => { await h.close(); });

const examplesDir = path.resolve(import.meta.dirname, '..', '..', 'examples');

describe('demo seed', () => {
  it('creates the contract accounts and example patterns once; a second run adds nothing', async () => {
    await seedDemo(h.sequelize);
    const usersBefore = await User.count();
    const patternsBefore = await Pattern.count();
    expect(await seedDemo(h.sequelize)).toEqual({ users: 0, patterns: 0 });
    expect(await User.count()).toBe(usersBefore);
    expect(await Pattern.count()).toBe(patternsBefore);
    const emails = DEMO_ACCOUNTS.map((a) => a.email).sort();
    expect(emails).toEqual(['designer@saltmarsh.example', 'editor@saltmarsh.example', 'knitter2@saltmarsh.example', 'knitter@saltmarsh.example']);
    for (const email of emails) {
      const res = await request(h.app).post('/api/auth/login').send({ email, password: DEMO_PASSWORD });
      expect(res.status, email).toBe(200);
    }
  });

  it('gives the designer one pattern per examples/*.loop with revision 1 and its compile summary', async () => {
    await seedDemo(h.sequelize);
    const designer = await User.findOne({ where: { email: 'designer@saltmarsh.example' } });
    const files = readdirSync(examplesDir).filter((f) => f.endsWith('.loop'));
    // The test database outlives a run; start the demo patterns afresh so they
    // reflect today's examples and compiler (other suites seed again as needed).
    await Pattern.destroy({ where: { ownerId: designer!.id } });
    expect((await seedDemo(h.sequelize)).patterns).toBe(files.length);
    const revisions = await Revision.findAll({ where: { authorId: designer!.id, number: 1 } });
    for (const file of files) {
      const source = readFileSync(path.join(examplesDir, file), 'utf8');
      const stored = revisions.find((r) => r.source === source);
      expect(stored, file).toBeDefined();
      expect(stored!.summary).toEqual(summarizeForStorage(compile(source)));
    }
  });

  it('names the example files that changed since their demo pattern was seeded, and only those', async () => {
    const dir = mkdtempSync(path.join(os.tmpdir(), 'lw-examples-'));
    try {
      const title = `Seed Check ${Date.now()}`;
      const text = (rounds: number) => `title "${title}"\nyarn A "Harbour" #1d3557\ncast on 8 in A\nrounds 1-${rounds}: k to end\n`;
      writeFileSync(path.join(dir, 'seed-check.loop'), text(2));
      expect(await seedDemo(h.sequelize, { examplesDir: dir })).toMatchObject({ patterns: 1 });
      expect(await changedDemoExamples({ examplesDir: dir })).toEqual([]);
      writeFileSync(path.join(dir, 'seed-check.loop'), text(3));
      expect(await changedDemoExamples({ examplesDir: dir })).toEqual(['seed-check.loop']);
      // Seeding again leaves the pattern as it was (revisions are history).
      expect(await seedDemo(h.sequelize, { examplesDir: dir })).toEqual({ users: 0, patterns: 0 });
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
