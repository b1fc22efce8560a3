import { Router } from 'express';
import { idParamsSchema } from '../../../shared/api/common';
import type { AppDeps } from '../../deps';
import { receiveFile } from '../../lib/uploads';
import { requireAuth } from '../../middleware/require-auth';
import { validate } from '../../middleware/validate';
import { PHOTO_MAX_BYTES } from './image-processing';
import { createPhotosController } from './photos.controller';
import type { PhotosService } from './photos.service';

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
export function photosRouters(deps: AppDeps, photos: PhotosService) {
  const c = createPhotosController(deps, photos);
  const params = validate({ params: idParamsSchema });

  const jobPhotos = Router();
  jobPhotos.post('/:id/photos', requireAuth, params, c.precheck, receivePhoto(), c.upload);

  const r = Router();
  r.get('/:id', requireAuth, params, c.full);
  r.get('/:id/thumb', requireAuth, params, c.thumb);
  return { jobPhotos, photos: r };
}
