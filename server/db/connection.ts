/**
 * Sequelize connection from the environment.
 *
 * Reads DB_HOST (default 127.0.0.1), DB_PORT (default 3316), DB_USER,
 * DB_PASSWORD, DB_NAME (default loopwright), DB_POOL_MAX (default
 * {@link DEFAULT_POOL_MAX}). Dialect: mariadb (the `mariadb` driver). Times
 * are stored in UTC.
 */
import { Sequelize } from 'sequelize';
import { initModels } from '../models/index.ts';

/**
 * Most connections one app process holds to the database. Requests beyond
 * that wait in the pool's first-come queue. Ten is enough at 100 concurrent
 * HTTP connections on the 2-core machine the bench runs on: the app's event
 * loop is busy about 90% of the time there, so it is the limit, not the
 * pool, and a pool of 20 gave no better throughput or p99 for either the
 * pattern read or health in the same run (docs/scaling.md). With several
 * instances on one database keep instances x pool below MariaDB's
 * max_connections (151 by default).
 */
export const DEFAULT_POOL_MAX = 10;

/** Connection settings; every field is optional and falls back to the env defaults above. */
export interface DbSettings { host?: string; port?: number; user?: string; password?: string; database?: string; poolMax?: number }

/** DB_POOL_MAX as a whole number of at least 1, undefined when unset; anything else is a configuration error said plainly at start. */
function poolMaxFromEnv(value: string | undefined): number | undefined {
  if (value === undefined || value.trim() === '') return undefined;
  const n = Number(value);
  if (!Number.isInteger(n) || n < 1) throw new Error(`DB_POOL_MAX must be a whole number of at least 1, not "${value}".`);
  return n;
}

/** Reads {@link DbSettings} from an environment object (default `process.env`). */
export function dbSettingsFromEnv(env: NodeJS.ProcessEnv = process.env): Required<DbSettings> {
  return {
    host: env.DB_HOST ?? '127.0.0.1',
    port: Number(env.DB_PORT ?? 3316),
    user: env.DB_USER ?? 'loopwright',
    password: env.DB_PASSWORD ?? '',
    database: env.DB_NAME ?? 'loopwright',
    poolMax: poolMaxFromEnv(env.DB_POOL_MAX) ?? DEFAULT_POOL_MAX,
  };
}

/**
 * Creates a Sequelize instance (lazy: it connects on first query) with every
 * model initialised and associated. Pass `env` to read other variables.
 */
export function createSequelize(env: NodeJS.ProcessEnv = process.env, overrides: DbSettings = {}): Sequelize {
  // An override left undefined keeps the env value (spreading it would blank the setting).
  const given = Object.fromEntries(Object.entries(overrides).filter(([, v]) => v !== undefined)) as DbSettings;
  const s = { ...dbSettingsFromEnv(env), ...given };
  const sequelize = new Sequelize(s.database, s.user, s.password, {
    host: s.host,
    port: s.port,
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 5000 },
    pool: { max: s.poolMax, min: 0, acquire: 10_000, idle: 10_000 },
  });
  initModels(sequelize);
  return sequelize;
}
