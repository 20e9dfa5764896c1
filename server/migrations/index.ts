/** Ordered list of schema migrations. Append only; never edit one that has shipped. */
import type { QueryInterface } from 'sequelize';
import * as initialSchema from './0001-initial-schema.ts';
import * as shop from './0100-shop.ts';
import * as reviewRelease from './0002-review-release.ts';

/** One migration: a stable name plus up/down against the query interface. */
export interface Migration { name: string; up(qi: QueryInterface): Promise<void>; down(qi: QueryInterface): Promise<void> }

export const migrations: Migration[] = [
  { name: '0001-initial-schema', ...initialSchema },
  { name: '0002-review-release', ...reviewRelease },
  { name: '0100-shop', ...shop },
];
