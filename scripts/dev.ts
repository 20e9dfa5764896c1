/**
 * `npm run dev`: the same back end as `npm start` (API on 127.0.0.1:4310,
 * no client build) plus Vite's dev server on 5173, which proxies /api to the
 * API (see vite.config.ts). Ctrl-C stops both and MariaDB.
 */
import { spawn } from 'node:child_process';
import path from 'node:path';
import { describeDemo, startLocalBackend, stopOnSignals } from '../server/boot.ts';

process.env.NODE_ENV ??= 'development';
const root = path.resolve(import.meta.dirname, '..');

async function main(): Promise<void> {
  const backend = await startLocalBackend({ name: 'start', dbPort: 3316, distDir: null, publicUrl: 'http://127.0.0.1:5173' });
  const vite = spawn(path.join(root, 'node_modules', '.bin', 'vite'), ['--host', '127.0.0.1', '--port', '5173', '--strictPort'], { cwd: root, stdio: 'inherit' });
  const stop = async () => {
    if (vite.exitCode === null) {
      vite.kill('SIGTERM');
      await new Promise((r) => vite.once('exit', r));
    }
    await backend.stop();
  };
  vite.on('exit', (code) => {
    if (code !== null && code !== 0) {
      console.error(`vite exited with code ${code}; stopping.`);
      void backend.stop().then(() => process.exit(1));
    }
  });
  stopOnSignals(stop);
  console.log(describeDemo('http://127.0.0.1:5173').replace('Loopwright is running', 'Loopwright (dev server) is running'));
}

main().catch((err: unknown) => {
  console.error(`\nCould not start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
