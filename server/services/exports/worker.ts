/**
 * The export worker thread: receives `{id, input, format}` messages, runs
 * each export (runExport) one after another, and answers with progress,
 * the finished bytes or a failure. Diffs of two revisions run here too. Compiling and
 * drawing a big pattern takes seconds; here it never blocks the server's
 * event loop.
 */
import { parentPort } from 'node:worker_threads';
import { diffRevisions, formatDiffText } from '../../../shared/diff/index.ts';
import { runExport, type ExportFile, type ExportFormat } from './build.ts';
import { ExportRefusal, type ExportInput } from './document.ts';

/** Two sources to diff (shared/diff) instead of an export. */
export interface DiffTask { oldSource: string; newSource: string; size: string | null }

/** A request to the worker: an export, or a diff when `diff` is set (answered as JSON `{semantic, text}`). */
export interface WorkerRequest { id: string; input: ExportInput | null; format: ExportFormat; diff?: DiffTask }
/** An answer from the worker. */
export type WorkerAnswer =
  | { id: string; type: 'progress'; progress: number }
  | { id: string; type: 'done'; bytes: Uint8Array; contentType: string; filename: string }
  | { id: string; type: 'failed'; code: string; message: string; userError: boolean };

function runDiff(task: DiffTask): ExportFile {
  const semantic = diffRevisions(task.oldSource, task.newSource, task.size ? { size: task.size } : {});
  const json = JSON.stringify({ semantic, text: formatDiffText(semantic) });
  return { bytes: Buffer.from(json, 'utf8'), contentType: 'application/json', filename: 'diff.json' };
}

const port = parentPort;
if (port) {
  port.on('message', (req: WorkerRequest) => {
    void (async () => {
      try {
        const file = req.diff
          ? runDiff(req.diff)
          : await runExport(req.input as ExportInput, req.format, (progress) => port.postMessage({ id: req.id, type: 'progress', progress } satisfies WorkerAnswer));
        const bytes = new Uint8Array(file.bytes.buffer, file.bytes.byteOffset, file.bytes.byteLength);
        port.postMessage({ id: req.id, type: 'done', bytes, contentType: file.contentType, filename: file.filename } satisfies WorkerAnswer);
      } catch (err) {
        const userError = err instanceof ExportRefusal;
        const answer: WorkerAnswer = {
          id: req.id,
          type: 'failed',
          code: userError ? err.code : 'export-failed',
          message: userError ? err.message : 'The export could not be made. Nothing was changed; please try again.',
          userError,
        };
        if (!userError) console.error('export failed:', err);
        port.postMessage(answer);
      }
    })();
  });
}
