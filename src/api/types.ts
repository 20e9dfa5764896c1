/**
 * Shapes of the HTTP API's JSON (see the contract in the project notes).
 * Only what the client reads is typed; the server may send more.
 */

/** A signed-in person. `roles` holds account roles such as `designer`. */
export interface User {
  id: number | string;
  email: string;
  name: string;
  roles: string[];
}

/** A person's role on one pattern. */
export type PatternRole = 'owner' | 'editor' | 'test-knitter' | 'knitter';

/** A row of the pattern library (`GET /api/patterns`). `updatedAt` is ISO 8601. */
export interface PatternListItem {
  id: number | string;
  title: string;
  status: string;
  sizes: string[];
  latestRevision: number;
  latestAuthor: { id: number | string; name: string } | null;
  errors: number;
  warnings: number;
  updatedAt: string;
  myRole: PatternRole;
}

/** Stored count summary of a revision (the server re-runs the compiler on save). */
export interface RevisionSummary {
  errors: number;
  warnings: number;
  sizes: { name: string; rounds: { number: number; front: number; backing: number; total: number }[] }[];
}

/** One saved revision. `number` counts up from 1 per pattern. */
export interface Revision {
  number: number;
  source: string;
  summary?: RevisionSummary | null;
  message: string | null;
  author: { id: number | string; name: string } | null;
  createdAt: string;
}

/** A pattern record. */
export interface Pattern {
  id: number | string;
  title: string;
  status: string;
  myRole?: PatternRole;
  updatedAt?: string;
}

/** A fake-SMTP message captured in development and tests. */
export interface OutboxMessage {
  id: number | string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  links: string[];
  receivedAt: string;
}
