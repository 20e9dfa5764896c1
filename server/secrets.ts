/** Secrets for local runs. */
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * The JWT secret: env JWT_SECRET when set, else the contents of
 * `<dataDir>/jwt-secret`, generated (48 random bytes, mode 0600) on first use.
 */
export function resolveJwtSecret(dataDir: string, env: NodeJS.ProcessEnv = process.env): string {
  if (env.JWT_SECRET) return env.JWT_SECRET;
  const file = path.join(dataDir, 'jwt-secret');
  if (existsSync(file)) {
    const secret = readFileSync(file, 'utf8').trim();
    if (secret.length >= 32) return secret;
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}
