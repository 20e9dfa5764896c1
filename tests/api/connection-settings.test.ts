/**
 * Database settings from the environment (server/db/connection.ts): the pool
 * size DB_POOL_MAX with its default, overrides, and a clear error for a
 * value that is not a whole number of at least 1.
 */
import { describe, expect, it } from 'vitest';
import { createSequelize, dbSettingsFromEnv, DEFAULT_POOL_MAX } from '../../server/db/connection.ts';

describe('database settings', () => {
  it('uses the default pool size when DB_POOL_MAX is unset or empty', () => {
    expect(dbSettingsFromEnv({}).poolMax).toBe(DEFAULT_POOL_MAX);
    expect(dbSettingsFromEnv({ DB_POOL_MAX: '' }).poolMax).toBe(DEFAULT_POOL_MAX);
  });

  it('reads DB_POOL_MAX and hands it to the connection pool', async () => {
    expect(dbSettingsFromEnv({ DB_POOL_MAX: '24' }).poolMax).toBe(24);
    const sequelize = createSequelize({ DB_POOL_MAX: '24' });
    try {
      expect(sequelize.config.pool?.max).toBe(24);
    } finally {
      await sequelize.close();
    }
  });

  it('lets an override win and ignores an override left undefined', async () => {
    const a = createSequelize({ DB_POOL_MAX: '24' }, { poolMax: 3 });
    const b = createSequelize({ DB_POOL_MAX: '24' }, { poolMax: undefined, host: undefined });
    try {
      expect(a.config.pool?.max).toBe(3);
      expect(b.config.pool?.max).toBe(24);
      expect(b.config.host).toBe('127.0.0.1');
    } finally {
      await a.close();
      await b.close();
    }
  });

  it('refuses a pool size that is not a whole number of at least 1, naming the variable', () => {
    for (const bad of ['0', '-3', '2.5', 'ten']) {
      expect(() => dbSettingsFromEnv({ DB_POOL_MAX: bad })).toThrow(/DB_POOL_MAX must be a whole number of at least 1/);
    }
  });
});
