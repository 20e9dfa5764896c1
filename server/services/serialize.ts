/** Turns models into the JSON shapes of shared/api-schemas.ts. */
import type { ApiPerson, ApiRevision, ApiUser } from '../../shared/api-schemas.ts';
import type { Revision, User } from '../models/index.ts';

export const toApiUser = (u: User): ApiUser => ({ id: u.id, email: u.email, name: u.name, roles: [...u.roles] });
export const toPerson = (u: Pick<User, 'id' | 'name'> | undefined | null): ApiPerson => (u ? { id: u.id, name: u.name } : { id: 0, name: 'unknown' });

/** A revision; with `full` it includes `source` and `summary`. */
export function toApiRevision(r: Revision, full: boolean): ApiRevision {
  const base: ApiRevision = {
    id: r.id,
    number: r.number,
    message: r.message,
    author: toPerson(r.author),
    errors: r.errors,
    warnings: r.warnings,
    createdAt: r.createdAt.toISOString(),
  };
  return full ? { ...base, source: r.source, summary: r.summary } : base;
}
