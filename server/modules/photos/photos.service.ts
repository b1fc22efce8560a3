import { randomUUID } from 'node:crypto';
import type { Readable } from 'node:stream';
import type { Transaction } from 'sequelize';
import type { JobPhoto as JobPhotoDto, PhotoStage } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { Space, User } from '../../db/models';
import { JobPhoto } from '../../db/models';
import { AppError, fieldError, NotFoundError } from '../../lib/errors';
import { StorageNotFoundError } from '../../lib/storage';
import type { SessionUser } from '../../types';
import { findSheetJob, findWorkableJob } from '../jobs/job-access';
import { recordedAt } from '../../lib/recorded-at';
import { ImageRejected, processPhoto } from './image-processing';

export function photoToDto(p: JobPhoto, byName: string): JobPhotoDto {
  return {
    id: p.id,
    spaceId: p.spaceId,
    stage: p.stage,
    caption: p.caption,
    widthPx: p.widthPx,
    heightPx: p.heightPx,
    url: `/api/photos/${p.id}`,
    thumbUrl: `/api/photos/${p.id}/thumb`,
    by: { id: p.userId ?? '', name: byName },
    at: p.takenAt.toISOString(),
  };
}

export type PhotoInput = { bytes: Buffer; spaceId: string; stage: PhotoStage; caption: string; takenAt?: string };

export function createPhotosService(deps: Pick<AppDeps, 'storage'>) {
  const { storage } = deps;

  /** The storage key of a photo (or its thumbnail) the user may see. */
  async function fileKey(user: SessionUser, photoId: string, thumb: boolean): Promise<string> {
    const photo = await JobPhoto.findOne({ where: { id: photoId, organisationId: user.organisationId } });
    if (!photo) throw new NotFoundError('photo');
    await findSheetJob(user, photo.jobId);
    return thumb ? photo.thumbKey : photo.storageKey;
  }

  return {
    /**
     * Checks the image by its content, makes the upright copy and the thumbnail, stores both, and
     * records the photo. Nothing is written before the checks pass; the keys written are pushed to
     * `stored` so the caller can remove them if the transaction does not commit (`discard`).
     */
    async add(user: SessionUser, jobId: string, input: PhotoInput, t: Transaction, stored: string[]): Promise<JobPhotoDto> {
      const job = await findWorkableJob(user, jobId, t);
      const space = await Space.findOne({ where: { id: input.spaceId, jobId: job.id }, transaction: t });
      if (!space) throw fieldError('spaceId', 'that space is not part of this job');
      let image;
      try {
        image = await processPhoto(input.bytes);
      } catch (e) {
        if (e instanceof ImageRejected) throw new AppError(415, e.code, e.message);
        throw e;
      }
      const id = randomUUID();
      const base = `${user.organisationId}/photos/${job.id}/${id}`;
      const keys = [`${base}.jpg`, `${base}.thumb.jpg`];
      stored.push(...keys);
      await storage.put(keys[0], image.full, { contentType: 'image/jpeg' });
      await storage.put(keys[1], image.thumb, { contentType: 'image/jpeg' });
      const row = await JobPhoto.create(
        {
          id,
          organisationId: user.organisationId,
          jobId: job.id,
          spaceId: space.id,
          stage: input.stage,
          caption: input.caption,
          storageKey: keys[0],
          thumbKey: keys[1],
          widthPx: image.widthPx,
          heightPx: image.heightPx,
          bytes: image.full.length,
          userId: user.id,
          takenAt: recordedAt(input.takenAt),
        },
        { transaction: t },
      );
      return photoToDto(row, user.name);
    },

    /** Removes files written by an `add` whose transaction did not commit. */
    async discard(keys: string[]) {
      await Promise.all(keys.map((k) => storage.delete(k).catch(() => undefined)));
    },

    /** Refuses (404/403/409 as job-access says) when the job is not one the user may record on. */
    async assertWorkable(user: SessionUser, jobId: string): Promise<void> {
      await findWorkableJob(user, jobId);
    },

    /** A photo (or its thumbnail) the user may see, as a stream; 404 when its file is gone. */
    async file(user: SessionUser, photoId: string, thumb: boolean): Promise<Readable> {
      try {
        return await storage.get(await fileKey(user, photoId, thumb));
      } catch (e) {
        if (e instanceof StorageNotFoundError) throw new NotFoundError('photo file');
        throw e;
      }
    },

    fileKey,

    async list(jobId: string, t?: Transaction): Promise<JobPhotoDto[]> {
      const rows = await JobPhoto.findAll({ where: { jobId }, include: [{ model: User, as: 'user' }], order: [['takenAt', 'ASC']], transaction: t });
      return rows.map((r) => photoToDto(r, r.user?.name ?? 'former user'));
    },
  };
}
export type PhotosService = ReturnType<typeof createPhotosService>;
