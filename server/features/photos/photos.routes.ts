import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { requireKiosk, requireRole, requireUser } from '@server/middleware/session-guard';
import { AppError, badRequest, refusal, type RefusalKey } from '@server/errors/app-error';
import type { PhotoStore } from '@server/storage/photo-store';
import { MAX_PHOTO_BYTES, readPhoto, storePhoto } from './photos.service';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 5 },
});

/** What multer refused, by its error code, in words of the catalogue (multer's own words are English only). */
const multerRefusals: Record<string, RefusalKey> = {
  LIMIT_PART_COUNT: 'photos.multer.tooManyParts',
  LIMIT_FILE_SIZE: 'photos.multer.fileTooLarge',
  LIMIT_FILE_COUNT: 'photos.multer.tooManyFiles',
  LIMIT_FIELD_KEY: 'photos.multer.fieldNameTooLong',
  LIMIT_FIELD_VALUE: 'photos.multer.fieldValueTooLong',
  LIMIT_FIELD_COUNT: 'photos.multer.tooManyFields',
  LIMIT_UNEXPECTED_FILE: 'photos.multer.unexpectedFile',
  MISSING_FIELD_NAME: 'photos.multer.fieldNameMissing',
  LIMIT_FIELD_NESTING: 'photos.multer.fieldNestingTooDeep',
  LIMIT_FIELD_ARRAY_INDEX: 'photos.multer.arrayIndexTooLarge',
  STREAM_DESTROYED: 'photos.multer.streamDestroyed',
  INVALID_FIELD_NAME: 'photos.multer.invalidFieldName',
};

/** multer's own errors become plain 4xx answers the kiosk can show. */
const receivePhoto: RequestHandler = (req, res, next) => {
  upload.single('photo')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        const megabytes = MAX_PHOTO_BYTES / 1024 / 1024;
        return next(new AppError(413, 'photo_too_large', refusal('photos.tooLarge', { megabytes })));
      }
      const why = multerRefusals[err.code];
      return next(
        badRequest(
          'photo_upload_refused',
          why
            ? refusal('photos.uploadRefused', { why: { phrase: refusal(why) } })
            : refusal('photos.uploadRefusedOther'),
        ),
      );
    }
    // The multipart parser's own errors ("Malformed part header", "Unexpected end of form") are bad input too.
    next(badRequest('photo_upload_malformed', refusal('photos.uploadMalformed')));
  });
};

export function photoRoutes(options: { store: PhotoStore }): Router {
  const router = Router();
  router.post('/photos', requireKiosk, requireRole('mechanic'), receivePhoto, async (req, res) => {
    if (!req.file) throw badRequest('photo_missing', refusal('photos.missing'));
    res.status(201).json(await storePhoto(options.store, req.file.buffer, req.user!.id));
  });
  router.get('/photos/:id', requireUser, async (req, res) => {
    const { photo, bytes } = await readPhoto(options.store, z.uuid().parse(req.params.id));
    res
      // Not kept in the tablet's cache either (the API answers no-store): the next person on it is someone else.
      .set({ 'Content-Type': photo.mimeType, 'X-Content-Type-Options': 'nosniff' })
      .send(bytes);
  });
  return router;
}
