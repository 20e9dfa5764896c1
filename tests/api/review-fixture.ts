/**
 * A pattern with its people for the review, release, diff and export
 * tests: a designer (owner), an invited technical editor, a test knitter, a
 * knitter and a stranger, and the pattern created through the API from the
 * sample source (a demo example with three sizes).
 */
import type { Express } from 'express';
import request from 'supertest';
import { Membership } from '../../server/models/index.ts';
import { makeUser, type TestUser } from './helpers.ts';
import { sampleSource } from './sample-source.ts';

export type Who = 'owner' | 'editor' | 'testKnitter' | 'knitter' | 'stranger';

/** The cast and the pattern id. */
export interface ReviewCast { people: Record<Who, TestUser>; patternId: number }

/** Creates the people and a pattern (revision 1 = sampleSource()), with the editor and knitters as members. */
export async function makeReviewCast(app: Express, label: string): Promise<ReviewCast> {
  const people = {
    owner: await makeUser(app, `${label}-owner`, ['designer']),
    editor: await makeUser(app, `${label}-editor`, ['editor']),
    testKnitter: await makeUser(app, `${label}-tk`, ['knitter']),
    knitter: await makeUser(app, `${label}-knitter`, ['knitter']),
    stranger: await makeUser(app, `${label}-stranger`, ['designer', 'knitter']),
  };
  const created = await request(app).post('/api/patterns').set('Authorization', people.owner.auth).send({ title: 'Lantern Mitts', source: sampleSource() });
  if (created.status !== 201) throw new Error(`create failed: ${created.status}`);
  const patternId = created.body.pattern.id as number;
  await Membership.bulkCreate([
    { patternId, userId: people.editor.id, role: 'editor' },
    { patternId, userId: people.testKnitter.id, role: 'test-knitter' },
    { patternId, userId: people.knitter.id, role: 'knitter' },
  ]);
  return { people, patternId };
}

/** A request as `who` (Bearer token), or signed out for 'anon'. */
export function as(app: Express, who: TestUser | null, method: 'get' | 'post' | 'put' | 'patch' | 'delete', url: string): request.Test {
  const r = request(app)[method](url);
  return who ? r.set('Authorization', who.auth) : r;
}

/** Saves a new revision as the owner on top of the newest one; returns its number. */
export async function saveRevision(app: Express, cast: ReviewCast, source: string, message: string): Promise<number> {
  const p = await as(app, cast.people.owner, 'get', `/api/patterns/${cast.patternId}`);
  const r = await as(app, cast.people.owner, 'post', `/api/patterns/${cast.patternId}/revisions`).send({ source, baseRevision: p.body.pattern.latestRevision, message });
  if (r.status !== 201) throw new Error(`save failed: ${r.status}`);
  return r.body.revision.number as number;
}

/** Runs submit -> approve (revision) -> release (label) through the review routes; returns the release response. */
export async function releaseRevision(app: Express, cast: ReviewCast, revision: number, label: string): Promise<request.Response> {
  const base = `/api/patterns/${cast.patternId}`;
  const submit = await as(app, cast.people.owner, 'post', `${base}/review/request`).send({ revision });
  if (submit.status !== 200) throw new Error(`submit failed: ${submit.status} ${JSON.stringify(submit.body)}`);
  const approve = await as(app, cast.people.editor, 'post', `${base}/review/approve`).send({ revision });
  if (approve.status !== 200) throw new Error(`approve failed: ${approve.status} ${JSON.stringify(approve.body)}`);
  return as(app, cast.people.owner, 'post', `${base}/releases`).send({ label });
}
