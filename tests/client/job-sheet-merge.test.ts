import { describe, expect, it } from 'vitest';
import { groupMyJobs } from '../../src/features/job-sheet/components/my-jobs-page';
import { finishBlockers, mergePending, tickKey } from '../../src/features/job-sheet/merge-pending';
import type { OutboxItem } from '../../src/features/job-sheet/offline/outbox-db';

import { me, sheet } from './job-sheet-fixture';

const item = (over: Partial<OutboxItem>): OutboxItem => ({
  key: Math.random().toString(36).slice(2),
  jobId: 'j1',
  kind: 'tick',
  url: '',
  body: {},
  createdAt: '2027-01-04T11:00:00Z',
  status: 'waiting',
  ...over,
});

describe('the sheet with unsent changes laid over it', () => {
  it('shows a waiting untick over the server tick, and adds waiting notes and photos', () => {
    const items = [
      item({ kind: 'tick', body: { kind: 'check', spaceId: 's1', ref: 'ppe.dust', done: false, reason: '' } }),
      item({ kind: 'note', body: { text: 'Loose hatch' } }),
      item({ kind: 'photo', body: { spaceId: 's2', stage: 'after', caption: '' }, file: new Blob(['x']) }),
      item({ jobId: 'other', kind: 'note', body: { text: 'not this job' } }),
    ];
    const m = mergePending(sheet(), items, me);
    expect(m.ticks.get(tickKey('check', 's1', 'ppe.dust'))).toMatchObject({ done: false, pending: true });
    expect(m.notes.map((n) => [n.text, n.pending])).toEqual([['Loose hatch', true]]);
    expect(m.pendingPhotos.map((p) => p.spaceId)).toEqual(['s2']);
  });

  it('ignores refused (failed) ticks and notes: the server state stands', () => {
    const m = mergePending(sheet(), [item({ status: 'failed', body: { kind: 'check', spaceId: 's1', ref: 'ppe.dust', done: false } })], me);
    expect(m.ticks.get(tickKey('check', 's1', 'ppe.dust'))?.done).toBe(true);
  });
});

describe('what stops finishing', () => {
  it('lists unticked checks without a reason and spaces without an after photo', () => {
    const s = sheet();
    const m = mergePending(s, [], me);
    const b = finishBlockers(s, m.ticks, {}, m.pendingPhotos);
    expect(b.checks.map((c) => c.key)).toEqual(['s1:downlight.covers', 's2:ppe.dust', 's2:downlight.covers']);
    expect(b.photos).toEqual(['Garage loft']);
  });

  it('accepts a written reason in place of a tick, and a waiting after photo', () => {
    const s = sheet();
    const m = mergePending(s, [item({ kind: 'photo', body: { spaceId: 's2', stage: 'after' }, file: new Blob(['x']) })], me);
    const reasons = { 's1:downlight.covers': 'no downlights found', 's2:ppe.dust': 'n/a', 's2:downlight.covers': '  ' };
    const b = finishBlockers(s, m.ticks, reasons, m.pendingPhotos);
    expect(b.checks.map((c) => c.key)).toEqual(['s2:downlight.covers']);
    expect(b.photos).toEqual([]);
  });
});

describe("the installer's list", () => {
  it("puts today's jobs first, then the coming ones by date, then earlier ones newest first", () => {
    const job = (id: string, installDate: string | null) => ({
      id,
      reference: id,
      stage: 'scheduled' as const,
      installDate,
      customerName: '',
      propertyAddress: { line1: '', line2: '', town: '', postcode: '' },
      spaceCount: 1,
    });
    const g = groupMyJobs(
      [job('a', '2027-01-02'), job('b', '2027-01-10'), job('c', '2027-01-05'), job('d', '2027-01-04'), job('e', '2026-12-30'), job('f', null)],
      '2027-01-05',
    );
    expect(g.today.map((j) => j.id)).toEqual(['c']);
    expect(g.upcoming.map((j) => j.id)).toEqual(['b', 'f']);
    expect(g.earlier.map((j) => j.id)).toEqual(['d', 'a', 'e']);
  });
});
