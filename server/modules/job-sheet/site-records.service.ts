import type { Transaction } from 'sequelize';
import type { JobNote as JobNoteDto, NoteBody, Tick, TickBody } from '../../../shared/api/job-sheet';
import type { AppDeps } from '../../deps';
import { JobEvent, Space, User } from '../../db/models';
import { JobNote, JobTick } from '../../db/models';
import { fieldError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { recordedAt } from '../../lib/recorded-at';
import { findWorkableJob } from '../jobs/job-access';

type Parsed<T> = T extends { reason?: unknown } ? Required<T> : T;

export function tickToDto(t: JobTick, byName: string): Tick {
  return {
    kind: t.kind,
    spaceId: t.spaceId,
    ref: t.ref,
    done: t.done,
    reason: t.reason,
    by: { id: t.userId ?? '', name: byName },
    at: t.tickedAt.toISOString(),
  };
}

export function noteToDto(n: JobNote, byName: string): JobNoteDto {
  return { id: n.id, spaceId: n.spaceId, text: n.text, by: { id: n.userId ?? '', name: byName }, at: n.notedAt.toISOString() };
}

async function assertSpaceOfJob(jobId: string, spaceId: string, t: Transaction) {
  const space = await Space.findOne({ where: { id: spaceId, jobId }, transaction: t });
  if (!space) throw fieldError('spaceId', 'that space is not part of this job');
}

export function createSiteRecordsService(_deps: Pick<AppDeps, 'sequelize'>) {
  return {
    /** Sets one tick's state (strip cut, strip laid, or a site check), recording who and when. */
    async setTick(user: SessionUser, jobId: string, body: Parsed<TickBody>, t: Transaction): Promise<Tick> {
      const job = await findWorkableJob(user, jobId, t);
      await assertSpaceOfJob(job.id, body.spaceId, t);
      if (body.kind !== 'check' && body.reason) throw fieldError('reason', 'only a site check takes a reason');
      const at = recordedAt(body.at);
      const values = { done: body.done, reason: body.done ? '' : (body.reason ?? ''), userId: user.id, tickedAt: at };
      const existing = await JobTick.findOne({
        where: { jobId: job.id, spaceId: body.spaceId, kind: body.kind, ref: body.ref },
        transaction: t,
        lock: t.LOCK.UPDATE,
      });
      const tick = existing
        ? await existing.update(values, { transaction: t })
        : await JobTick.create(
            { organisationId: user.organisationId, jobId: job.id, spaceId: body.spaceId, kind: body.kind, ref: body.ref, ...values },
            { transaction: t },
          );
      return tickToDto(tick, user.name);
    },

    /** Adds a note to the job (optionally about one space). */
    async addNote(user: SessionUser, jobId: string, body: NoteBody & { text: string }, t: Transaction): Promise<JobNoteDto> {
      const job = await findWorkableJob(user, jobId, t);
      if (body.spaceId) await assertSpaceOfJob(job.id, body.spaceId, t);
      const note = await JobNote.create(
        { organisationId: user.organisationId, jobId: job.id, spaceId: body.spaceId ?? null, userId: user.id, text: body.text, notedAt: recordedAt(body.at) },
        { transaction: t },
      );
      await JobEvent.create(
        { organisationId: user.organisationId, jobId: job.id, userId: user.id, kind: 'site_note', data: { noteId: note.id } },
        { transaction: t },
      );
      return noteToDto(note, user.name);
    },

    async listTicks(jobId: string, t?: Transaction): Promise<Tick[]> {
      const rows = await JobTick.findAll({ where: { jobId }, include: [{ model: User, as: 'user' }], order: [['tickedAt', 'ASC']], transaction: t });
      return rows.map((r) => tickToDto(r, r.user?.name ?? 'former user'));
    },

    async listNotes(jobId: string, t?: Transaction): Promise<JobNoteDto[]> {
      const rows = await JobNote.findAll({ where: { jobId }, include: [{ model: User, as: 'user' }], order: [['notedAt', 'ASC']], transaction: t });
      return rows.map((r) => noteToDto(r, r.user?.name ?? 'former user'));
    },
  };
}
export type SiteRecordsService = ReturnType<typeof createSiteRecordsService>;
