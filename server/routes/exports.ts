/**
 * Exports: the direct download (GET .../export, waits for the file) and
 * export jobs with progress (POST .../exports, GET /api/exports/:job, GET
 * /api/exports/:job/download). The work runs in a worker thread.
 */
import { Router, type Response } from 'express';
import { exportRequest } from '../../shared/api-schemas.ts';
import { requireUser } from '../services/access.ts';
import { AppError, notFound } from '../services/errors.ts';
import { ExportQueue, type ExportJob } from '../services/exports/jobs.ts';
import { prepareExport, toApiExportJob } from '../services/exports/prepare.ts';
import { intParam, parseBody } from './params.ts';

function sendFile(res: Response, job: ExportJob): void {
  if (job.state === 'failed' || !job.file) {
    const e = job.error ?? { code: 'export-failed', message: 'The export could not be made.', userError: false };
    throw new AppError(e.userError ? 400 : 500, e.code, e.message);
  }
  res.setHeader('Content-Type', job.file.contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${job.file.filename}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(job.file.bytes);
}

const busy = () => new AppError(429, 'too-many-exports', 'You have several exports running; wait for one to finish.');

/** Export routes; one export queue (and worker thread) per app. */
export function exportRoutes(queue = new ExportQueue()): Router {
  const r = Router();

  r.get('/patterns/:id/revisions/:number/export', async (req, res) => {
    const user = requireUser(req.user);
    const q = parseBody(exportRequest, req.query);
    const { input, filename } = await prepareExport(user, intParam(req.params.id), intParam(req.params.number), q);
    const job = queue.submit(user.id, input, q.format, filename);
    if (!job) throw busy();
    await job.finished;
    sendFile(res, job);
  });

  r.post('/patterns/:id/revisions/:number/exports', async (req, res) => {
    const user = requireUser(req.user);
    const body = parseBody(exportRequest, req.body);
    const { input, filename } = await prepareExport(user, intParam(req.params.id), intParam(req.params.number), body);
    const job = queue.submit(user.id, input, body.format, filename);
    if (!job) throw busy();
    res.status(202).json({ job: toApiExportJob(job) });
  });

  r.get('/exports/:job', (req, res) => {
    const user = requireUser(req.user);
    const job = queue.get(String(req.params.job), user.id);
    if (!job) throw notFound('That export');
    res.json({ job: toApiExportJob(job) });
  });

  r.get('/exports/:job/download', (req, res) => {
    const user = requireUser(req.user);
    const job = queue.get(String(req.params.job), user.id);
    if (!job) throw notFound('That export');
    if (job.state === 'queued' || job.state === 'running') throw new AppError(409, 'not-ready', 'The export is not finished yet; ask GET /api/exports/:job for its progress.');
    sendFile(res, job);
  });

  return r;
}
