/**
 * The checks in front of an export, on the request thread: who may export
 * which revision (the access module: owner and editors any revision, test
 * knitters and knitters released ones only), that the revision and size
 * exist, and what the worker needs (source, title, designer, label).
 */
import type { ApiExportJob } from '../../../shared/api-schemas.ts';
import { Release, Revision, User } from '../../models/index.ts';
import { authorizePattern, canReadRevision } from '../access.ts';
import { badRequest, notFound } from '../errors.ts';
import { releasedNumbers } from '../releases.ts';
import { exportFilename, type ExportFormat } from './build.ts';
import type { ExportInput } from './document.ts';
import type { ExportJob } from './jobs.ts';

/** An export request after validation (see exportRequest in shared/api-schemas.ts). */
export interface ExportRequest { format: ExportFormat; size?: string; view: 'front' | 'back' }

/** Checks access and inputs; 404 for a revision the caller cannot read, 400 `unknown-size`. */
export async function prepareExport(user: User | null, patternId: number, number: number, req: ExportRequest): Promise<{ input: ExportInput; filename: string }> {
  const { pattern, role } = await authorizePattern(user, patternId, 'export');
  const released = role === 'owner' || role === 'editor' ? [] : await releasedNumbers(pattern.id);
  if (!Number.isSafeInteger(number) || !canReadRevision(role, pattern, number, released)) throw notFound('Revision');
  const revision = await Revision.findOne({ where: { patternId: pattern.id, number } });
  if (!revision) throw notFound('Revision');
  const sizes = revision.summary?.sizes.map((s) => s.name) ?? [];
  if (sizes.length === 0) throw badRequest('nothing-to-export', 'This revision has no size the compiler could work out; fix its errors first.');
  const size = req.size ?? sizes[0]!;
  if (!sizes.includes(size)) throw badRequest('unknown-size', `Revision ${number} has no size "${size}"; its sizes are ${sizes.join(', ')}.`);
  const release = await Release.findOne({ where: { patternId: pattern.id, revisionNumber: number }, attributes: ['label'] });
  const owner = await User.findByPk(pattern.ownerId, { attributes: ['name'] });
  const input: ExportInput = {
    source: revision.source, title: pattern.title, designer: owner?.name ?? null, revision: number, label: release?.label ?? null, size, view: req.view,
  };
  return { input, filename: exportFilename(input, size, req.format) };
}

/** A job as the API shows it. */
export function toApiExportJob(job: ExportJob): ApiExportJob {
  return {
    id: job.id,
    state: job.state,
    progress: Math.round(job.progress * 100) / 100,
    format: job.format,
    url: job.state === 'done' ? `/api/exports/${job.id}/download` : null,
    filename: job.filename,
    error: job.error ? { code: job.error.code, message: job.error.message } : null,
  };
}
