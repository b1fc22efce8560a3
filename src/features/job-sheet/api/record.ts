import type { NoteBody, PhotoStage, TickBody } from '../../../../shared/api/job-sheet';
import { enqueue } from '../offline/outbox';

/** Ticks, notes and photos all go through the offline outbox, with signal or without. */
export function recordTick(jobId: string, body: TickBody) {
  return enqueue({ jobId, kind: 'tick', url: `/api/jobs/${encodeURIComponent(jobId)}/ticks`, body: { ...body, at: new Date().toISOString() } });
}

export function recordNote(jobId: string, body: NoteBody) {
  return enqueue({ jobId, kind: 'note', url: `/api/jobs/${encodeURIComponent(jobId)}/notes`, body: { ...body, at: new Date().toISOString() } });
}

export function recordPhoto(jobId: string, input: { file: Blob; fileName: string; spaceId: string; stage: PhotoStage; caption: string }) {
  return enqueue({
    jobId,
    kind: 'photo',
    url: `/api/jobs/${encodeURIComponent(jobId)}/photos`,
    body: { spaceId: input.spaceId, stage: input.stage, caption: input.caption, takenAt: new Date().toISOString() },
    file: input.file,
    fileName: input.fileName,
  });
}
