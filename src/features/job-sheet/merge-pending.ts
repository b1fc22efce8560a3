import type { JobSheet, PhotoStage, Tick, TickKind } from '../../../shared/api/job-sheet';
import type { OutboxItem } from './offline/outbox-db';

export const tickKey = (kind: TickKind, spaceId: string, ref: string) => `${kind}|${spaceId}|${ref}`;

export type ShownTick = Tick & { pending: boolean };
export type ShownNote = { id: string; spaceId: string | null; text: string; byName: string; at: string; pending: boolean };
export type PendingPhoto = { key: string; spaceId: string; stage: PhotoStage; caption: string; file: Blob; failed: boolean };

/**
 * What the sheet shows: the server's records with this device's unsent changes laid over them
 * (a waiting tick replaces the server's state of the same target; waiting notes and photos are added).
 */
export function mergePending(sheet: JobSheet, items: OutboxItem[], me: { id: string; name: string }) {
  const ticks = new Map<string, ShownTick>();
  for (const t of sheet.ticks) ticks.set(tickKey(t.kind, t.spaceId, t.ref), { ...t, pending: false });
  const notes: ShownNote[] = sheet.notes.map((n) => ({ id: n.id, spaceId: n.spaceId, text: n.text, byName: n.by.name, at: n.at, pending: false }));
  const pendingPhotos: PendingPhoto[] = [];
  for (const item of items) {
    if (item.jobId !== sheet.job.id) continue;
    const b = item.body as Record<string, string | boolean | null | undefined>;
    if (item.kind === 'tick' && item.status === 'waiting') {
      const kind = b.kind as TickKind;
      ticks.set(tickKey(kind, String(b.spaceId), String(b.ref)), {
        kind,
        spaceId: String(b.spaceId),
        ref: String(b.ref),
        done: Boolean(b.done),
        reason: String(b.reason ?? ''),
        by: me,
        at: String(b.at ?? item.createdAt),
        pending: true,
      });
    } else if (item.kind === 'note' && item.status === 'waiting') {
      notes.push({
        id: item.key,
        spaceId: (b.spaceId as string) ?? null,
        text: String(b.text),
        byName: me.name,
        at: String(b.at ?? item.createdAt),
        pending: true,
      });
    } else if (item.kind === 'photo' && item.file) {
      pendingPhotos.push({
        key: item.key,
        spaceId: String(b.spaceId),
        stage: b.stage as PhotoStage,
        caption: String(b.caption ?? ''),
        file: item.file,
        failed: item.status === 'failed',
      });
    }
  }
  return { ticks, notes, pendingPhotos };
}

/** What still stops the job being marked installed: unticked checks without a reason, spaces with no after photo. */
export function finishBlockers(sheet: JobSheet, ticks: Map<string, ShownTick>, reasons: Record<string, string>, pendingPhotos: PendingPhoto[]) {
  const checks: { key: string; spaceName: string; title: string }[] = [];
  const photos: string[] = [];
  for (const s of sheet.spaces) {
    for (const c of s.checks) {
      const t = ticks.get(tickKey('check', s.id, c.code));
      const reason = (reasons[`${s.id}:${c.code}`] ?? t?.reason ?? '').trim();
      if (!t?.done && !reason) checks.push({ key: `${s.id}:${c.code}`, spaceName: s.name, title: c.title });
    }
    const hasAfter =
      sheet.photos.some((p) => p.spaceId === s.id && p.stage === 'after') || pendingPhotos.some((p) => p.spaceId === s.id && p.stage === 'after' && !p.failed);
    if (!hasAfter) photos.push(s.name);
  }
  return { checks, photos };
}
