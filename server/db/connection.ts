/**
 * Sequelize connection from the environment.
 *
 * Reads DB_HOST (default 127.0.0.1), DB_PORT (default 3316), DB_USER,
 * DB_PASSWORD, DB_NAME (default loopwright). Dialect: mariadb (the `mariadb`
 * driver). Times are stored in UTC.
 */
import { Sequelize } from 'sequelize';
import { initModels } from '../models/index.ts';

/** Connection settings; every field is optional and falls back to the env defaults above. */
export interface DbSettings { host?: string; port?: number; user?: string; password?: string; database?: string }

/** Reads {@link DbSettings} from an environment object (default `process.env`). */
export function dbSettingsFromEnv(env: NodeJS.ProcessEnv = process.env): Required<DbSettings> {
  return {
    host: env.DB_HOST ?? '127.0.0.1',
    port: Number(env.DB_PORT ?? 3316),
    user: env.DB_USER ?? 'loopwright',
    password: env.DB_PASSWORD ?? '',
    database: env.DB_NAME ?? 'loopwright',
  };
}

/**
 * Creates a Sequelize instance (lazy: it connects on first query) with every
 * model initialised and associated. Pass `env` to read other variables.
 */
export function createSequelize(env: NodeJS.ProcessEnv = process.env, overrides: DbSettings = {}): Sequelize {
  const s = { ...dbSettingsFromEnv(env), ...overrides };
  const sequelize = new Sequelize(s.database, s.user, s.password, {
    host: s.host,
    port: s.port,
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    dialectOptions: { connectTimeout: 5000 },
    pool: { max: 10, min: 0, acquire: 10_000, idle: 10_000 },
  });
  initModels(sequelize);
  return sequelize;
}
