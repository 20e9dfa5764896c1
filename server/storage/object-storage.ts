/**
 * A small storage interface for uploaded bytes, so an object store can
 * replace the local folder later. Keys are random and generated here; a
 * client's file name never becomes a path.
 */
import { randomBytes } from 'node:crypto';
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';

export interface ObjectStorage {
  /** Stores bytes under a new random key and returns the key. */
  put(data: Buffer): Promise<string>;
  /** Reads the bytes for `key`, or null when missing. */
  get(key: string): Promise<Buffer | null>;
  /** Deletes `key` (no error when missing). */
  remove(key: string): Promise<void>;
}

const KEY_PATTERN = /^[a-f0-9]{48}$/;

/** Stores objects as files named by their key inside `dir` (created on first use). */
export function createLocalStorage(dir: string): ObjectStorage {
  const fileFor = (key: string) => {
    if (!KEY_PATTERN.test(key)) throw new Error(`invalid storage key`);
    return path.join(dir, key);
  };
  return {
    async put(data) {
      await mkdir(dir, { recursive: true });
      const key = randomBytes(24).toString('hex');
      await writeFile(fileFor(key), data, { flag: 'wx', mode: 0o600 });
      return key;
    },
    async get(key) {
      try {
        return await readFile(fileFor(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') return null;
        throw err;
      }
    },
    async remove(key) {
      await rm(fileFor(key), { force: true });
    },
  };
}
