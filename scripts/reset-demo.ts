/**
 * `npm run demo:reset`: deletes .data/start (database, uploads, outbox,
 * generated secrets). The next `npm start` initialises a fresh database and
 * seeds the demo data again. Refuses while `npm start` is running.
 */
import { existsSync, rmSync } from 'node:fs';
import path from 'node:path';
import { findRunningInstance } from '../server/db/launcher.ts';

const dir = path.resolve(import.meta.dirname, '..', '.data', 'start');

const running = findRunningInstance('start');
if (running) {
  console.error(`npm start is still running (process ${running.ownerPid}); stop it with Ctrl-C first.`);
  process.exit(1);
}
if (existsSync(dir)) {
  rmSync(dir, { recursive: true, force: true });
  console.log('Deleted .data/start. The next `npm start` creates a fresh database with the demo data.');
} else {
  console.log('Nothing to reset: .data/start does not exist.');
}
