/**
 * Schema migrations with umzug. Migrations live in server/migrations/ and
 * are listed in order in server/migrations/index.ts (an explicit list works
 * the same under tsx, vitest and a bundler). Applied names are recorded in
 * the `SequelizeMeta` table, so running again is a no-op. Never `sync()`.
 */
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { migrations } from '../migrations/index.ts';

/** Builds the umzug instance (exported for tooling that wants `down`). */
export function createMigrator(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: migrations.map((m) => ({ name: m.name, up: ({ context }) => m.up(context), down: ({ context }) => m.down(context) })),
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize }),
    logger: undefined,
  });
}

/** Applies every pending migration. Idempotent. */
export async function migrate(sequelize: Sequelize): Promise<void> {
  await createMigrator(sequelize).up();
}
