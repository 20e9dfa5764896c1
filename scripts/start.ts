/**
 * `npm start`: private MariaDB (127.0.0.1:3316, .data/start), migrations,
 * demo seed, fake SMTP (127.0.0.1:2526), the payment stand-in
 * (127.0.0.1:${PAYMENTS_FAKE_PORT:-4320}), `vite build` when the client is
 * stale, then the app on 127.0.0.1:${PORT:-4310}. Ctrl-C stops everything,
 * MariaDB included.
 */
import { describeDemo, startLocalBackend, stopOnSignals } from '../server/boot.ts';
import { findRunningInstance } from '../server/db/launcher.ts';
import { buildClient, staleReason } from './client-build.ts';

process.env.NODE_ENV ??= 'development';

async function main(): Promise<void> {
  // Refuse before touching dist/, which the running instance is serving.
  const running = findRunningInstance('start');
  if (running) {
    throw new Error(`Loopwright is already running (process ${running.ownerPid}, database on port ${running.port}, since ${running.startedAt}). Stop it with Ctrl-C in its terminal first.`);
  }
  const reason = staleReason();
  if (reason) {
    console.log(`Building the client (${reason}) ...`);
    if (!(await buildClient())) {
      console.error('The client build failed (see above). The API still starts; the pages will not be served until the build succeeds.');
    }
  }
  const backend = await startLocalBackend({ name: 'start', dbPort: 3316 });
  stopOnSignals(backend.stop);
  console.log(describeDemo(backend.url));
}

main().catch((err: unknown) => {
  console.error(`\nCould not start: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
