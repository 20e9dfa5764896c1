/**
 * `npm run demo:reset`: deletes .data/start (database, uploads, outbox,
 * generated secrets). The next `npm start` initialises a fresh database and
 * seeds the demo data again. Refuses while `npm start` is running.
 */
import { existsSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';

const dir = path.resolve(import.meta.dirname, '..', '.data', 'start');

function runningOwner(): number | null {
  try {
    const { ownerPid } = JSON.parse(readFileSync(path.join(dir, 'launcher.json'), 'utf8')) as { ownerPid: number };
    process.kill(ownerPid, 0);
    return ownerPid;
  } catch {
    return null;
  }
}

const owner = runningOwner();
if (owner !== null) {
  console.error(`npm start is still running (process ${owner}); stop it with Ctrl-C first.`);
  process.exit(1);
}
if (existsSync(dir)) {
  rmSync(dir, { recursive: true, force: true });
  console.log('Deleted .data/start. The next `npm start` creates a fresh database with the demo data.');
} else {
  console.log('Nothing to reset: .data/start does not exist.');
}
