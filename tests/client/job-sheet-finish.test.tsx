// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { FinishPanel } from '../../src/features/job-sheet/components/finish-panel';
import { tickKey } from '../../src/features/job-sheet/merge-pending';
import { sheet } from './job-sheet-fixture';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const isoInDays = (days: number) => {
  const d = new Date();
  d.setDate(d.getDate() + days);
  const p = (n: number) => String(n).padStart(2, '0');
  return `${d.getFullYear()}-${p(d.getMonth() + 1)}-${p(d.getDate())}`;
};

// Both checks ticked or explained, an after photo for both spaces: ready to finish.
function readySheet(installDate: string) {
  const s = sheet({ installDate });
  s.ticks = s.spaces.flatMap((sp) =>
    sp.checks.map((c) => ({ kind: 'check' as const, spaceId: sp.id, ref: c.code, done: true, reason: '', by: s.job.installer!, at: '2027-01-04T09:00:00Z' })),
  );
  s.photos = s.spaces.map((sp, i) => ({ ...s.photos[0], id: `p${i}`, spaceId: sp.id }));
  return s;
}

function renderFinish(installDate: string) {
  const calls = fakeApi((c) => (c.url.pathname.endsWith('/finish') ? { body: { completion: null } } : undefined));
  const s = readySheet(installDate);
  const ticks = new Map(s.ticks.map((t) => [tickKey(t.kind, t.spaceId, t.ref), { ...t, pending: false }]));
  renderPage(<FinishPanel sheet={s} ticks={ticks as never} pendingPhotos={[]} waiting={0} />, { user: demoUser('installer') });
  return calls;
}

describe('finishing a job on the phone', () => {
  it('asks once more before marking a job booked for next week as installed today', async () => {
    const calls = renderFinish(isoInDays(7));
    fireEvent.click(screen.getByRole('button', { name: 'Mark installed' }));
    expect(screen.getByRole('alertdialog').textContent).toMatch(/booked for .*, not today/);
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
    fireEvent.click(screen.getByRole('button', { name: 'Not yet' }));
    expect(screen.queryByRole('alertdialog')).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Mark installed' }));
    fireEvent.click(screen.getByRole('button', { name: 'Yes, installed today' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST' && c.url.pathname.endsWith('/finish'))).toHaveLength(1));
  });

  it('marks a job booked for today without asking again', async () => {
    const calls = renderFinish(isoInDays(0));
    fireEvent.click(screen.getByRole('button', { name: 'Mark installed' }));
    expect(screen.queryByRole('alertdialog')).toBeNull();
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST' && c.url.pathname.endsWith('/finish'))).toHaveLength(1));
  });
});
