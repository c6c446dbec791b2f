import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { z } from 'zod';
import { requireKiosk, requireRole, requireUser } from '@server/middleware/session-guard';
import { AppError, badRequest } from '@server/errors/app-error';
import type { PhotoStore } from '@server/storage/photo-store';
import { MAX_PHOTO_BYTES, readPhoto, storePhoto } from './photos.service';

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 5 },
});

/** multer's own errors become plain 4xx answers the kiosk can show. */
const receivePhoto: RequestHandler = (req, res, next) => {
  upload.single('photo')(req, res, (err: unknown) => {
    if (!err) return next();
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        return next(
          new AppError(
            413,
            'photo_too_large',
            `The photo is larger than ${MAX_PHOTO_BYTES / 1024 / 1024} MB. Take it again at a lower size.`,
          ),
        );
      }
      return next(badRequest('photo_upload_refused', `The upload was refused: ${err.message}.`));
    }
    // The multipart parser's own errors ("Malformed part header", "Unexpected end of form") are bad input too.
    next(badRequest('photo_upload_malformed', 'The upload could not be read. Take the photo again.'));
  });
};

export function photoRoutes(options: { store: PhotoStore }): Router {
  const router = Router();
  router.post('/photos', requireKiosk, requireRole('mechanic'), receivePhoto, async (req, res) => {
    if (!req.file) throw badRequest('photo_missing', 'No photo was sent. Send it in the form field "photo".');
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
