/**
 * Decides whether the built client in dist/ is stale and rebuilds it with
 * `vite build`. Used by `npm start`.
 */
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
/** Inputs of the client build; a newer file in any of them makes dist/ stale. */
export const CLIENT_INPUTS = ['src', 'shared', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package.json'];

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, entry)));
  return newest;
}

/** Why dist/ needs a build, or null when it is up to date. */
export function staleReason(): string | null {
  const built = path.join(root, 'dist', 'index.html');
  if (!existsSync(built)) return 'dist/ does not exist yet';
  const builtAt = statSync(built).mtimeMs;
  for (const input of CLIENT_INPUTS) {
    if (newestMtime(path.join(root, input)) > builtAt) return `${input} changed since the last build`;
  }
  return null;
}

/** Runs `vite build`; resolves true on success. Output goes to the terminal. */
export function buildClient(): Promise<boolean> {
  return new Promise((resolve) => {
    const child = spawn(path.join(root, 'node_modules', '.bin', 'vite'), ['build'], { cwd: root, stdio: 'inherit' });
    child.on('exit', (code) => resolve(code === 0));
    child.on('error', () => resolve(false));
  });
}
