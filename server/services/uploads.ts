/**
 * Uploaded files: swatch photos (PNG, JPEG or WebP, checked by content,
 * at most 5 MiB) and imported `.loop` sources (UTF-8 text, at most 1 MiB).
 * Bytes go to the storage backend under a random key; the client's file
 * name is kept for display only.
 */
import { fileTypeFromBuffer } from 'file-type';
import { PHOTO_MAX_BYTES, PHOTO_TYPES, SOURCE_MAX_BYTES, type ApiPattern, type ApiRevision, type ApiUpload } from '../../shared/api-schemas.ts';
import type { ServerContext } from '../context.ts';
import { Upload, type User } from '../models/index.ts';
import { authorizeCreatePattern, authorizePattern } from './access.ts';
import { AppError, badRequest, notFound, tooLarge, unsupportedType } from './errors.ts';
import { createPattern } from './patterns.ts';
import { titleFromSource } from './compile-summary.ts';

/** A file as received from multer (memory storage). */
export interface IncomingFile { originalname: string; buffer: Buffer; size: number }

/** Display name: no path separators, no control characters, at most 255 characters. */
const safeName = (name: string) =>
  [...name.replace(/[\\/]/g, '_')].filter((c) => c.charCodeAt(0) >= 32 && c.charCodeAt(0) !== 127).join('').slice(0, 255) || 'file';

const toApiUpload = (u: Upload): ApiUpload => ({
  id: u.id,
  kind: u.kind,
  originalName: u.originalName,
  mimeType: u.mimeType,
  size: u.size,
  url: `/api/uploads/${u.id}`,
  createdAt: u.createdAt.toISOString(),
});

/** Stores a swatch photo for a pattern (owner only). 413 over 5 MiB, 415 when not PNG/JPEG/WebP by content. */
export async function uploadSwatch(ctx: ServerContext, user: User | null, patternId: number, file: IncomingFile | undefined): Promise<ApiUpload> {
  const { pattern } = await authorizePattern(user, patternId, 'upload');
  if (!file) throw badRequest('file-required', 'Send the photo as multipart form data in the field "file".');
  if (file.size > PHOTO_MAX_BYTES) throw tooLarge(`The photo is ${file.size} bytes; the limit is ${PHOTO_MAX_BYTES} bytes (5 MiB).`, PHOTO_MAX_BYTES);
  const detected = await fileTypeFromBuffer(file.buffer);
  if (!detected || !(PHOTO_TYPES as readonly string[]).includes(detected.mime)) {
    throw unsupportedType('Swatch photos must be PNG, JPEG or WebP images (checked by their content, not their name).');
  }
  const storageKey = await ctx.storage.put(file.buffer);
  const upload = await Upload.create({
    ownerId: (user as User).id,
    patternId: pattern.id,
    kind: 'swatch',
    originalName: safeName(file.originalname),
    mimeType: detected.mime,
    size: file.size,
    storageKey,
  });
  return toApiUpload(upload);
}

/** Uploads of a pattern the caller may see, newest first. */
export async function listUploads(user: User | null, patternId: number): Promise<ApiUpload[]> {
  const { pattern } = await authorizePattern(user, patternId, 'view-uploads');
  const uploads = await Upload.findAll({ where: { patternId: pattern.id }, order: [['id', 'DESC']] });
  return uploads.map(toApiUpload);
}

/** Bytes and metadata of one upload, if the caller may see its pattern (404 otherwise). */
export async function readUpload(ctx: ServerContext, user: User | null, uploadId: number): Promise<{ upload: ApiUpload; data: Buffer }> {
  const upload = Number.isSafeInteger(uploadId) ? await Upload.findByPk(uploadId) : null;
  if (!upload) throw notFound('That file');
  if (upload.patternId !== null) {
    await authorizePattern(user, upload.patternId, 'view-uploads').catch((err: unknown) => {
      // A file on a hidden pattern is itself hidden.
      if (err instanceof AppError && err.status === 403) throw notFound('That file');
      throw err;
    });
  } else if (!user || user.id !== upload.ownerId) {
    throw notFound('That file');
  }
  const data = await ctx.storage.get(upload.storageKey);
  if (!data) throw notFound('That file');
  return { upload: toApiUpload(upload), data };
}

/**
 * Creates a pattern from an uploaded `.loop` file (designers only): the
 * title comes from the source header, else from the file name. 413 over
 * 1 MiB, 415 for other extensions, 400 when the bytes are not UTF-8.
 */
export async function importSource(ctx: ServerContext, user: User | null, file: IncomingFile | undefined): Promise<{ pattern: ApiPattern; revision: ApiRevision; upload: ApiUpload }> {
  const owner = authorizeCreatePattern(user);
  if (!file) throw badRequest('file-required', 'Send the .loop file as multipart form data in the field "file".');
  if (file.size > SOURCE_MAX_BYTES) throw tooLarge(`The file is ${file.size} bytes; the limit is ${SOURCE_MAX_BYTES} bytes (1 MiB).`, SOURCE_MAX_BYTES);
  if (!/\.loop$/i.test(file.originalname)) throw unsupportedType('Only Loopwright sources (.loop files) can be imported.');
  let source: string;
  try {
    source = new TextDecoder('utf-8', { fatal: true }).decode(file.buffer);
  } catch {
    throw badRequest('not-utf8', 'The file is not UTF-8 text. Save it as UTF-8 and try again.');
  }
  if (source.includes('\u0000')) throw badRequest('not-text', 'The file contains binary data, not notation text.');
  source = source.replace(/^\uFEFF/, '');
  const fallback = safeName(file.originalname).replace(/\.loop$/i, '').trim() || 'Imported pattern';
  const title = titleFromSource(source) ?? fallback.slice(0, 200);
  const created = await createPattern(ctx, owner, title, source, `Imported from ${safeName(file.originalname)}`);
  const storageKey = await ctx.storage.put(file.buffer);
  const upload = await Upload.create({
    ownerId: owner.id,
    patternId: created.pattern.id,
    kind: 'source',
    originalName: safeName(file.originalname),
    mimeType: 'text/plain; charset=utf-8',
    size: file.size,
    storageKey,
  });
  return { ...created, upload: toApiUpload(upload) };
}
