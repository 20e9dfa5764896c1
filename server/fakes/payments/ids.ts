/** Object ids in the provider's usual shape: a type prefix, an underscore, random letters and digits. */
import { randomBytes } from 'node:crypto';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** Prefixes of the objects the fake knows. */
export type IdPrefix = 'cs_test' | 'pi' | 'ch' | 're' | 'evt' | 'req';

/** A new id such as `cs_test_a1B2...` (24 random characters after the prefix). */
export function newId(prefix: IdPrefix, length = 24): string {
  const bytes = randomBytes(length);
  let out = '';
  for (const b of bytes) out += ALPHABET[b % ALPHABET.length];
  return `${prefix}_${out}`;
}

/** A generated secret for local runs: `sk_test_...` API key or `whsec_...` signing secret. Never a real key. */
export function newSecret(kind: 'api-key' | 'webhook'): string {
  return `${kind === 'api-key' ? 'sk_test_local' : 'whsec_local'}_${randomBytes(24).toString('hex')}`;
}
