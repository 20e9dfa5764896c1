/**
 * The bundle figures of `npm run bench`: gzipped JS of the studio's first
 * load and of the whole workspace, from tests/e2e/bundle-size.ts
 * `measureBundles()`. Runs `vite build` first when dist/ is missing or older
 * than any file the client is built from.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { measureBundles, type BundleSizes } from '../e2e/bundle-size.ts';

const root = path.resolve(import.meta.dirname, '..', '..');

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = 0;
  for (const name of readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, name)));
  return newest;
}

/** True when dist/ needs a build (no manifest, or a client input is newer). */
export function isDistStale(): boolean {
  const manifest = path.join(root, 'dist', '.vite', 'manifest.json');
  if (!existsSync(manifest)) return true;
  const inputs = ['src', 'shared', 'index.html', 'vite.config.ts', 'package.json'].map((p) => newestMtime(path.join(root, p)));
  return Math.max(...inputs) > statSync(manifest).mtimeMs;
}

/** Builds when stale, then measures. Returns the sizes and whether a build ran. */
export function measureBundleFigures(): { sizes: BundleSizes; built: boolean } {
  const stale = isDistStale();
  if (stale) {
    console.log('dist/ is missing or stale: running vite build ...');
    const r = spawnSync('npx', ['vite', 'build', '--logLevel', 'warn'], { cwd: root, stdio: 'inherit' });
    if (r.status !== 0) throw new Error(`vite build failed (exit ${r.status})`);
  }
  return { sizes: measureBundles(path.join(root, 'dist')), built: stale };
}
