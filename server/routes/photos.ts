import { pipeline } from 'node:stream/promises';
import { Router, type Request, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { requireSignedIn, actor } from '../middleware/access.ts';
import { parse } from '../middleware/validate.ts';
import { AppError, badRequest, forbidden } from '../errors.ts';
import { photoFilePart, photoUploadFieldsSchema } from '../../shared/schemas/sightings.ts';
import { photoLimits } from '../services/photo-limits.ts';
import { ingestPhotos } from '../services/ingest.ts';
import { photoSpoolStorage, releaseSpool, type SpooledFile } from '../services/photo-spool.ts';
import { photoFileFor, type PhotoVariant } from '../services/photo-files.ts';
import { openStored } from '../services/storage.ts';

export const photosRouter = Router();
const idParam = z.object({ id: z.uuid({ error: 'That photo id is not valid.' }) });

const tooLarge = (message: string) => new AppError(413, 'too_large', message);

/** Refuses a request whose declared or streamed size passes the per-request limit, before anything is kept. */
const requestSizeLimit: RequestHandler = (req, _res, next) => {
  const { maxRequestBytes, maxRequestMb } = photoLimits();
  const message = `This upload is larger than ${maxRequestMb} MB in total; send fewer photos at a time.`;
  if (Number(req.headers['content-length'] ?? 0) > maxRequestBytes) return next(tooLarge(message));
  let received = 0;
  req.on('data', (chunk: Buffer) => {
    received += chunk.length;
    if (received > maxRequestBytes) req.destroy(tooLarge(message));
  });
  next();
};

// Photos are spooled to temp files as they arrive (hashed on the way, only their first bytes in memory); nothing
// touches the disk under a name the phone chose, and the temp files go when the request is done.
const receivePhotos: RequestHandler = (req, res, next) => {
  const limits = photoLimits();
  // A request cut off before its handler ran leaves nothing behind; a running ingest removes its files itself.
  res.once('close', () => {
    if (!res.locals.ingesting) void releaseSpool(req);
  });
  const upload = multer({
    storage: photoSpoolStorage(),
    limits: { fileSize: limits.maxFileBytes, files: limits.maxFiles, fields: 20, fieldSize: 64 * 1024, parts: limits.maxFiles + 20 },
  }).array(photoFilePart, limits.maxFiles);
  upload(req, res, (error: unknown) => {
    if (!error) return next();
    if (error instanceof AppError) return next(error);
    const code = (error as { code?: string }).code;
    const fileName = (error as { field?: string; filename?: string }).filename;
    if (code === 'LIMIT_FILE_SIZE')
      return next(
        tooLarge(
          `${fileName ? `“${fileName}”` : 'A photo'} is larger than ${limits.maxFileMb} MB; nothing from this upload was kept. Send it at a smaller size.`,
        ),
      );
    if (code === 'LIMIT_FILE_COUNT' || (code === 'LIMIT_UNEXPECTED_FILE' && (error as { field?: string }).field === photoFilePart)) {
      return next(tooLarge(`Send at most ${limits.maxFiles} photos at a time; nothing from this upload was kept.`));
    }
    if (code === 'LIMIT_UNEXPECTED_FILE') return next(badRequest(`Send the photos in the “${photoFilePart}” part of the form.`));
    if (code?.startsWith('LIMIT_')) return next(badRequest('The upload form has too many or too large text fields.'));
    next(badRequest('The upload could not be read; send the photos again.'));
  });
};

photosRouter.post(
  '/',
  requireSignedIn,
  (req, _res, next) => (req.user?.role === 'grower' ? next(forbidden('Growers can view sightings but not upload photos; ask your adviser or scout.')) : next()),
  requestSizeLimit,
  receivePhotos,
  async (req, res) => {
    res.locals.ingesting = true;
    let results;
    try {
      results = await ingestUpload(req);
    } finally {
      // Before the answer goes out (success or not), so the next batch finds the disk already freed.
      await releaseSpool(req);
    }
    res.json({ results });
  },
);

/** The spooled photos of an upload, validated and ingested. */
async function ingestUpload(req: Request) {
  const fields = parse(photoUploadFieldsSchema, req.body ?? {});
  const files = (req.files as (Express.Multer.File & SpooledFile)[] | undefined) ?? [];
  if (files.length === 0) throw badRequest(`Choose at least one photo to send (form part “${photoFilePart}”).`);
  if (fields.counts && fields.counts.length !== files.length)
    throw badRequest(`Give one count per photo: ${files.length} photos but ${fields.counts.length} counts.`, { counts: 'One count per photo.' });
  if (fields.clientIds && fields.clientIds.length !== files.length)
    throw badRequest(`Give one clientId per photo: ${files.length} photos but ${fields.clientIds.length} ids.`, { clientIds: 'One id per photo.' });
  return ingestPhotos(
    actor(req),
    { pestId: fields.pestId, walkId: fields.walkId, fieldId: fields.fieldId },
    files.map((file, i) => ({
      // multer hands the name over as latin1; phones send UTF-8.
      fileName: Buffer.from(file.originalname, 'latin1').toString('utf8'),
      spooled: file,
      clientId: fields.clientIds?.[i],
      count: fields.counts?.[i] ?? fields.count ?? null,
    })),
  );
}

function sendPhoto(variant: PhotoVariant): RequestHandler {
  return async (req, res, next) => {
    const file = await photoFileFor(actor(req), parse(idParam, req.params).id, variant);
    // Streamed through the app after the access check: the store itself is never public.
    const opened = await openStored(file.key);
    if (!opened) return next(new AppError(404, 'not_found', 'That photo file is missing from storage.'));
    // Private pictures: no shared cache keeps them, and the browser does not keep them past sign-out (RFC 9111 §5.2.2.5).
    res.setHeader('Cache-Control', 'private, no-store');
    res.setHeader('Content-Type', file.mimeType);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Length', String(opened.size));
    pipeline(opened.stream, res).catch(() => res.destroy());
  };
}

photosRouter.get('/:id/original', requireSignedIn, sendPhoto('original'));
photosRouter.get('/:id/thumbnail', requireSignedIn, sendPhoto('thumbnail'));
