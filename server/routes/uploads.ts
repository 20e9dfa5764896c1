/** Uploads: POST /api/patterns/import, /api/patterns/:id/uploads, GET /api/uploads/:id. */
import { Router } from 'express';
import multer from 'multer';
import { PHOTO_MAX_BYTES, SOURCE_MAX_BYTES } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { authorizeCreatePattern, authorizePattern } from '../services/access.ts';
import { importSource, listUploads, readUpload, uploadSwatch } from '../services/uploads.ts';
import { intParam } from './params.ts';

// Files stay in memory (at most 5 MiB) so nothing touches disk before checks pass.
const photoUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: PHOTO_MAX_BYTES, files: 1, fields: 5 } }).single('file');
const sourceUpload = multer({ storage: multer.memoryStorage(), limits: { fileSize: SOURCE_MAX_BYTES, files: 1, fields: 5 } }).single('file');

/** Import, swatch photo upload/list and file download routes. */
export function uploadRoutes(ctx: ServerContext): Router {
  const r = Router();

  // Check permission before reading the body, so a stranger's large upload is refused early.
  r.post('/patterns/import', (req, _res, next) => { authorizeCreatePattern(req.user); next(); }, sourceUpload, async (req, res) => {
    res.status(201).json(await importSource(ctx, req.user, req.file));
  });

  r.post('/patterns/:id/uploads', async (req, _res, next) => { await authorizePattern(req.user, intParam(req.params.id), 'upload'); next(); }, photoUpload, async (req, res) => {
    res.status(201).json({ upload: await uploadSwatch(ctx, req.user, intParam(req.params.id), req.file) });
  });

  r.get('/patterns/:id/uploads', async (req, res) => {
    res.json({ uploads: await listUploads(req.user, intParam(req.params.id)) });
  });

  r.get('/uploads/:id', async (req, res) => {
    const { upload, data } = await readUpload(ctx, req.user, intParam(req.params.id));
    res.setHeader('Content-Type', upload.mimeType);
    res.setHeader('Content-Length', String(data.length));
    res.setHeader('Cache-Control', 'private, max-age=3600');
    res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${encodeURIComponent(upload.originalName)}`);
    res.end(data);
  });

  return r;
}
