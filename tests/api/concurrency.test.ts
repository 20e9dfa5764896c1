/**
 * Two saves on the same base revision at the same time: exactly one 201 and
 * one 409, no revision lost or duplicated, numbering stays contiguous.
 * (Optimistic concurrency as in RFC 9110 §13, 409 Conflict §15.5.10.)
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Revision } from '../../server/models/index.ts';
import { makeUser, startHarness, type ApiHarness, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

let h: ApiHarness;
let designer: TestUser;
beforeAll(async () => {
  h = await startHarness();
  designer = await makeUser(h.app, 'conc-designer');
});
afterAll(async () => { await h.close(); });

const save = (patternId: number, baseRevision: number, marker: string) =>
  request(h.app).post(`/api/patterns/${patternId}/revisions`).set('Authorization', designer.auth).send({ source: sampleSource(marker), baseRevision, message: marker });

describe('concurrent saves', () => {
  it('gives exactly one 201 and one 409 for two saves on the same base, ten times over', async () => {
    const created = await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Race', source: sampleSource() });
    const patternId = created.body.pattern.id as number;
    let base = 1;
    for (let round = 0; round < 10; round++) {
      const [a, b] = await Promise.all([save(patternId, base, `a${round}`), save(patternId, base, `b${round}`)]);
      const statuses = [a.status, b.status].sort();
      expect(statuses, `round ${round}`).toEqual([201, 409]);
      const winner = a.status === 201 ? a : b;
      const loser = a.status === 201 ? b : a;
      expect(winner.body.revision.number).toBe(base + 1);
      // The loser learns what won, with its source, so nothing is lost on the client either.
      expect(loser.body.latest).toMatchObject({ number: base + 1, source: winner.body.revision.source });
      base += 1;
    }
    const numbers = (await Revision.findAll({ where: { patternId }, attributes: ['number'], order: [['number', 'ASC']] })).map((r) => r.number);
    expect(numbers).toEqual(Array.from({ length: 11 }, (_, i) => i + 1));
  });

  it('with five saves racing on one base, one wins and four get 409', async () => {
    const created = await request(h.app).post('/api/patterns').set('Authorization', designer.auth).send({ title: 'Crowd', source: sampleSource() });
    const patternId = created.body.pattern.id as number;
    const results = await Promise.all([0, 1, 2, 3, 4].map((i) => save(patternId, 1, `crowd${i}`)));
    expect(results.filter((r) => r.status === 201)).toHaveLength(1);
    expect(results.filter((r) => r.status === 409)).toHaveLength(4);
    expect(await Revision.count({ where: { patternId } })).toBe(2);
  });
});
