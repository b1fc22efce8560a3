// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { enqueue } from '../../src/features/job-sheet/offline/outbox';
import { FinishPanel } from '../../src/features/job-sheet/components/finish-panel';
import { tickKey } from '../../src/features/job-sheet/merge-pending';
import { sheet } from './job-sheet-fixture';
import { demoUser, fakeApi, renderPage } from './render';

// IndexedDB is not in happy-dom: the outbox's queue is replaced by a spy (its sending is tested in the browser).
vi.mock('../../src/features/job-sheet/offline/outbox', async (original) => ({
  ...(await original<typeof import('../../src/features/job-sheet/offline/outbox')>()),
  enqueue: vi.fn(async (item: object) => item),
}));

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
  s.vanLoad = {
    rolls: [{ productId: 'prod-100', productName: 'Roll 100 mm', thicknessMm: 100, count: 7 }],
    extras: [{ code: 'hatch_kit', label: 'Hatch kit', quantity: 1, unit: 'each' }],
  };
  s.ticks = s.spaces.flatMap((sp) =>
    sp.checks.map((c) => ({ kind: 'check' as const, spaceId: sp.id, ref: c.code, done: true, reason: '', by: s.job.installer!, at: '2027-01-04T09:00:00Z' })),
  );
  s.photos = s.spaces.map((sp, i) => ({ ...s.photos[0], id: `p${i}`, spaceId: sp.id }));
  return s;
}

function renderFinish(installDate: string, change: (s: ReturnType<typeof readySheet>) => void = () => {}) {
  const calls = fakeApi((c) => (c.url.pathname.endsWith('/finish') ? { body: { completion: null } } : undefined));
  const s = readySheet(installDate);
  change(s);
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

  it('sends what was used, prefilled from the van load and corrected, with the installer’s hours', async () => {
    const calls = renderFinish(isoInDays(0));
    expect((screen.getByLabelText('Roll 100 mm: rolls used') as HTMLInputElement).value).toBe('7');
    fireEvent.change(screen.getByLabelText('Roll 100 mm: rolls used'), { target: { value: '6' } });
    fireEvent.change(screen.getByLabelText('Roll 100 mm: rolls brought back'), { target: { value: '1' } });
    const installer = readySheet(isoInDays(0)).job.installer!;
    fireEvent.change(screen.getByLabelText(`${installer.name}: hours on site`), { target: { value: '5,5' } });
    fireEvent.click(screen.getByRole('button', { name: 'Mark installed' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1));
    expect((calls[0].body as { actuals: unknown }).actuals).toEqual({
      rolls: [{ productId: 'prod-100', used: 6, returned: 1 }],
      hours: [{ userId: installer.id, hours: 5.5 }],
      extras: [{ code: 'hatch_kit', used: 1 }],
    });
  });

  it('queues the finish in the outbox under the key it was tried with when there is no signal', async () => {
    const keys: string[] = [];
    renderFinish(isoInDays(0));
    vi.stubGlobal('fetch', async (_url: string, init: RequestInit) => {
      keys.push((init.headers as Record<string, string>)['Idempotency-Key']);
      throw new TypeError('Failed to fetch');
    });
    fireEvent.click(screen.getByRole('button', { name: 'Mark installed' }));
    expect(await screen.findByText(/No signal: marked installed on this phone/)).toBeTruthy();
    const queued = vi.mocked(enqueue).mock.calls.at(-1)![0];
    expect(queued).toMatchObject({ kind: 'finish', key: keys[0] });
    expect((queued.body as { actuals: { rolls: unknown[] } }).actuals.rolls).toEqual([{ productId: 'prod-100', used: 7, returned: 0 }]);
  });

  it('holds the finish until the parts the company asks for are filled in, marking them required', async () => {
    const calls = renderFinish(isoInDays(0), (s) => (s.actualsRequired = ['hours', 'rolls']));
    const installer = readySheet(isoInDays(0)).job.installer!;
    const hours = screen.getByLabelText(`${installer.name}: hours on site`);
    expect(hours.getAttribute('aria-required')).toBe('true');
    expect(hours.getAttribute('aria-invalid')).toBe('true');
    // Rolls are prefilled from the van load, so only the hours are missing.
    expect(screen.getByLabelText('Roll 100 mm: rolls used').getAttribute('aria-invalid')).toBe('false');
    expect(screen.getByText(/Fill in the hours on site: the company asks for them/)).toBeTruthy();
    const button = screen.getByRole('button', { name: 'Mark installed' }) as HTMLButtonElement;
    expect(button.disabled).toBe(true);

    fireEvent.change(screen.getByLabelText('Roll 100 mm: rolls used'), { target: { value: '' } });
    expect(screen.getByText(/Fill in the hours on site and the rolls used/)).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Roll 100 mm: rolls used'), { target: { value: '7' } });
    fireEvent.change(hours, { target: { value: '4' } });
    expect(screen.queryByText(/the company asks for them/)).toBeNull();
    expect(button.disabled).toBe(false);
    fireEvent.click(button);
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1));
    expect((calls[0].body as { actuals: { hours: unknown } }).actuals.hours).toEqual([{ userId: installer.id, hours: 4 }]);
  });

  it('does not ask for extras on a job whose van load has none', () => {
    renderFinish(isoInDays(0), (s) => {
      s.actualsRequired = ['extras'];
      s.vanLoad.extras = [];
    });
    expect(screen.queryByText(/the company asks for them/)).toBeNull();
    expect((screen.getByRole('button', { name: 'Mark installed' }) as HTMLButtonElement).disabled).toBe(false);
  });
});
