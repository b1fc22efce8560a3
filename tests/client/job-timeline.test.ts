import { describe, expect, it } from 'vitest';
import type { JobEvent } from '../../shared/api/jobs';
import { describeEvent } from '../../src/features/jobs/components/job-timeline';
import { formatDate } from '../../src/components/ui';

const ev = (kind: string, data: Record<string, unknown>): JobEvent => ({ id: 'e1', kind, data, user: null, createdAt: '2026-12-01T10:00:00.000Z' });

describe('job history sentences', () => {
  it('a date set by editing the job ({ from, to })', () => {
    expect(describeEvent(ev('scheduled', { from: null, to: '2026-12-03' }))).toBe(`Install date set to ${formatDate('2026-12-03')}`);
  });
  it('a booking made on the schedule ({ from, installerId, date }) reads as a date set, not cleared', () => {
    const booking = ev('scheduled', { from: { stage: 'accepted', installerId: null, date: null }, installerId: 'i1', date: '2026-12-03', overCapacity: false });
    expect(describeEvent(booking)).toBe(`Install date set to ${formatDate('2026-12-03')}`);
  });
  it('a date removed by editing the job', () => {
    expect(describeEvent(ev('scheduled', { from: '2026-12-03', to: null }))).toBe('Install date cleared');
  });
});
