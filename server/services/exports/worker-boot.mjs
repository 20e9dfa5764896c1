// Entry of the export worker thread: the server runs TypeScript through tsx,
// and a worker thread starts without the parent's loader, so register it here.
import { register } from 'tsx/esm/api';

register();
await import('./worker.ts');
