import { Router, type Request, type Response } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import { IDEMPOTENCY_HEADER, photoFieldsSchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { fieldError } from '../../lib/errors';
import { receiveFile } from '../../lib/uploads';
import { currentUser, requireAuth } from '../../middleware/require-auth';
import { validate, zodDetails } from '../../middleware/validate';
import { ValidationError } from '../../lib/errors';
import { readIdempotencyKey, runOnce } from '../../lib/idempotency';
import { findWorkableJob } from '../jobs/job-access';
import { PHOTO_MAX_BYTES } from './image-processing';
import { createPhotosService } from './photos.service';

const MAX_MB = Math.round(PHOTO_MAX_BYTES / 1024 / 1024);

/** One file in field `photo`; its limit errors become clear 413/422 answers. */
const receivePhoto = () =>
  receiveFile({
    field: 'photo',
    maxBytes: PHOTO_MAX_BYTES,
    fields: 10,
    fieldSize: 10_000,
    tooLarge: { code: 'photo_too_large', message: `The photo is larger than ${MAX_MB} MB. Take it at a lower resolution or pick a smaller file.` },
  });

/**
 * `jobPhotos`: POST /api/jobs/:id/photos (multipart), composed into the jobs router; `photos`:
 * GET /api/photos/:id[/thumb].
 */
export function photosRouters(deps: AppDeps) {
  const photos = createPhotosService(deps);
  const jobPhotos = Router();

  jobPhotos.post(
    '/:id/photos',
    requireAuth,
    validate({ params: idParamsSchema }),
    // Refuse before reading a large body when the job is not one the user may record on.
    async (req, _res, next) => {
      await findWorkableJob(currentUser(req), String(req.params.id));
      next();
    },
    receivePhoto(),
    async (req, res) => {
      const user = currentUser(req);
      const key = readIdempotencyKey(req.get(IDEMPOTENCY_HEADER));
      const fields = photoFieldsSchema.safeParse(req.body ?? {});
      if (!fields.success) throw new ValidationError(zodDetails(fields.error));
      if (!req.file) throw fieldError('photo', 'choose a photo to upload (field "photo")');
      const stored: string[] = [];
      try {
        const result = await runOnce(deps.sequelize, user, key, `POST /api/jobs/${req.params.id}/photos`, async (t) => ({
          status: 201,
          body: { photo: await photos.add(user, String(req.params.id), { bytes: req.file!.buffer, ...fields.data }, t, stored) },
        }));
        res.status(result.status).json(result.body);
      } catch (e) {
        await photos.discard(stored);
        throw e;
      }
    },
  );

  const sendFile = (thumb: boolean) => async (req: Request, res: Response) => {
    const fileKey = await photos.fileKey(currentUser(req), String(req.params.id), thumb);
    const bytes = await deps.storage.get(fileKey);
    res.set('Content-Type', 'image/jpeg');
    res.set('Cache-Control', 'private, max-age=86400, immutable');
    res.send(bytes);
  };
  const r = Router();
  r.get('/:id', requireAuth, validate({ params: idParamsSchema }), sendFile(false));
  r.get('/:id/thumb', requireAuth, validate({ params: idParamsSchema }), sendFile(true));
  return { jobPhotos, photos: r };
}
