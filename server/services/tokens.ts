/** One-use tokens for mailed links: random, sent once, stored only as SHA-256. */
import { createHash, randomBytes } from 'node:crypto';

/** A new random token (256 bits, base64url) and its hash for storage. */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashToken(token) };
}

/** SHA-256 hex of a token; tokens are high-entropy, so no salt is needed. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}
