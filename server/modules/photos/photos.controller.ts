import type { NextFunction, Request, Response } from 'express';
import { IDEMPOTENCY_HEADER, photoFieldsSchema } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { fieldError, ValidationError } from '../../lib/errors';
import { readIdempotencyKey, runOnce } from '../../lib/idempotency';
import { pipeToResponse } from '../../lib/storage/pipe-to-response';
import { currentUser } from '../../middleware/require-auth';
import { zodDetails } from '../../middleware/validate';
import type { PhotosService } from './photos.service';

export function createPhotosController(deps: Pick<AppDeps, 'sequelize'>, photos: PhotosService) {
  const sendFile = (thumb: boolean) => async (req: Request, res: Response) => {
    const body = await photos.file(currentUser(req), String(req.params.id), thumb);
    res.set('Content-Type', 'image/jpeg');
    res.set('Cache-Control', 'private, max-age=86400, immutable');
    await pipeToResponse(res, body);
  };

  return {
    /** Refuses before a large body is read when the job is not one the user may record on. */
    async precheck(req: Request, _res: Response, next: NextFunction) {
      await photos.assertWorkable(currentUser(req), String(req.params.id));
      next();
    },

    async upload(req: Request, res: Response) {
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

    full: sendFile(false),
    thumb: sendFile(true),
  };
}
