/**
 * Reading a pattern source for the command line: strictly UTF-8, and an
 * error message (exit code 2 for the caller) instead of a throw.
 */
import { readFileSync } from 'node:fs';

/** Reads a source as UTF-8 (strictly); returns an error message when it cannot. */
export function readSource(file: string): string | { error: string } {
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    return { error: `cannot read ${file}${code ? ` (${code})` : ''}` };
  }
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return { error: `${file} is not UTF-8 text` };
  }
}
