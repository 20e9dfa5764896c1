/**
 * Export jobs (and revision diffs): a queue in front of one worker thread (the machine has few
 * cores, and a PDF of a big pattern takes seconds). A job is created by a
 * user, runs in the worker, reports progress 0..1, and keeps its file for
 * {@link JOB_TTL_MS} after it finishes. Jobs live in this process's memory:
 * behind a load balancer, the status and download requests must reach the
 * same instance (sticky sessions), or the store moves to shared storage.
 */
import { randomBytes } from 'node:crypto';
import { Worker } from 'node:worker_threads';
import type { ApiExportJob } from '../../../shared/api-schemas.ts';
import type { ExportFile, ExportFormat } from './build.ts';
import type { ExportInput } from './document.ts';
import type { DiffTask, WorkerAnswer, WorkerRequest } from './worker.ts';

/** How long a finished job and its file are kept (10 minutes). */
export const JOB_TTL_MS = 10 * 60 * 1000;
/** Most unfinished jobs one user may have at a time. */
export const MAX_ACTIVE_PER_USER = 4;

/** One export job. */
export interface ExportJob {
  id: string;
  ownerId: number;
  format: ExportFormat;
  state: ApiExportJob['state'];
  progress: number;
  filename: string;
  file: ExportFile | null;
  error: { code: string; message: string; userError: boolean } | null;
  /** Settles when the job is done or failed (never rejects). */
  finished: Promise<void>;
  finishedAt: number | null;
}

/** The queue; one per app. */
export class ExportQueue {
  private readonly jobs = new Map<string, ExportJob>();
  private readonly waiting: { job: ExportJob; input: ExportInput | null; diff?: DiffTask; settle: () => void }[] = [];
  private running: { job: ExportJob; settle: () => void } | null = null;
  private worker: Worker | null = null;

  /** Queues an export for `ownerId`; null when they have too many unfinished jobs. */
  submit(ownerId: number, input: ExportInput, format: ExportFormat, filename: string): ExportJob | null {
    this.sweep();
    const active = [...this.jobs.values()].filter((j) => j.ownerId === ownerId && (j.state === 'queued' || j.state === 'running')).length;
    if (active >= MAX_ACTIVE_PER_USER) return null;
    let settle: () => void = () => {};
    const finished = new Promise<void>((resolve) => { settle = resolve; });
    const job: ExportJob = { id: randomBytes(12).toString('base64url'), ownerId, format, state: 'queued', progress: 0, filename, file: null, error: null, finished, finishedAt: null };
    this.jobs.set(job.id, job);
    this.waiting.push({ job, input, settle });
    this.pump();
    return job;
  }

  /**
   * Diffs two sources in the worker (shared/diff: two compiles, which take
   * a while for big patterns). Resolves with `{semantic, text}`; rejects when
   * the worker fails.
   */
  async diff(task: DiffTask): Promise<{ semantic: unknown; text: string }> {
    let settle: () => void = () => {};
    const finished = new Promise<void>((resolve) => { settle = resolve; });
    const job: ExportJob = { id: randomBytes(12).toString('base64url'), ownerId: -1, format: 'txt', state: 'queued', progress: 0, filename: 'diff.json', file: null, error: null, finished, finishedAt: null };
    this.waiting.push({ job, input: null, diff: task, settle });
    this.pump();
    await finished;
    if (!job.file) throw new Error(job.error?.message ?? 'diff failed');
    return JSON.parse(job.file.bytes.toString('utf8')) as { semantic: unknown; text: string };
  }

  /** The job `id` if it belongs to `ownerId` (others get null, as if it did not exist). */
  get(id: string, ownerId: number): ExportJob | null {
    this.sweep();
    const job = this.jobs.get(id);
    return job && job.ownerId === ownerId ? job : null;
  }

  /** Stops the worker (tests, shutdown). Unfinished jobs fail. */
  async close(): Promise<void> {
    const w = this.worker;
    this.worker = null;
    if (w) await w.terminate();
  }

  private sweep(): void {
    const now = Date.now();
    for (const [id, j] of this.jobs) if (j.finishedAt !== null && now - j.finishedAt > JOB_TTL_MS) this.jobs.delete(id);
  }

  private ensureWorker(): Worker {
    if (this.worker) return this.worker;
    const w = new Worker(new URL('./worker-boot.mjs', import.meta.url));
    // An idle worker must not keep the process alive (tests, scripts).
    w.unref();
    w.on('message', (a: WorkerAnswer) => this.onAnswer(a));
    w.on('error', (err) => this.onCrash(err));
    w.on('exit', (code) => { if (this.worker === w) this.onCrash(new Error(`export worker exited with code ${code}`)); });
    this.worker = w;
    return w;
  }

  private pump(): void {
    if (this.running) return;
    const next = this.waiting.shift();
    if (!next) return;
    this.running = { job: next.job, settle: next.settle };
    next.job.state = 'running';
    const req: WorkerRequest = { id: next.job.id, input: next.input, format: next.job.format, ...(next.diff ? { diff: next.diff } : {}) };
    this.ensureWorker().postMessage(req);
  }

  private finish(job: ExportJob): void {
    job.finishedAt = Date.now();
    if (this.running?.job === job) {
      this.running.settle();
      this.running = null;
    }
    this.pump();
  }

  private onAnswer(a: WorkerAnswer): void {
    const job = this.running?.job;
    if (!job || job.id !== a.id) return;
    if (a.type === 'progress') {
      job.progress = Math.max(job.progress, Math.min(0.99, a.progress));
      return;
    }
    if (a.type === 'done') {
      job.state = 'done';
      job.progress = 1;
      job.file = { bytes: Buffer.from(a.bytes.buffer, a.bytes.byteOffset, a.bytes.byteLength), contentType: a.contentType, filename: a.filename };
      job.filename = a.filename;
    } else {
      job.state = 'failed';
      job.error = { code: a.code, message: a.message, userError: a.userError };
    }
    this.finish(job);
  }

  private onCrash(err: Error): void {
    console.error('export worker stopped:', err.message);
    this.worker = null;
    const job = this.running?.job;
    if (job) {
      job.state = 'failed';
      job.error = { code: 'export-failed', message: 'The export could not be made. Nothing was changed; please try again.', userError: false };
      this.finish(job);
    }
  }
}
