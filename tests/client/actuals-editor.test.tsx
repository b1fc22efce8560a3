// @vitest-environment happy-dom
// Correcting what was used after finishing: the form starts from what is stored, the save names the
// version it was read at, and a correction someone else saved first is shown, not overwritten.
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ActualsEditor } from '../../src/features/job-sheet/components/actuals-editor';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const load = {
  rolls: [{ productId: 'prod-100', productName: 'Roll 100 mm', thicknessMm: 100, count: 7 }],
  extras: [{ code: 'hatch_kit' as const, label: 'Hatch kit', quantity: 1, unit: 'each' }],
};
const people = [{ id: 'u1', name: 'Sam Ridley' }];
const stored = { version: 3, rolls: [{ productId: 'prod-100', used: 6, returned: 1 }], hours: [{ userId: 'u1', hours: 5 }], extras: [] };

function renderEditor(answer: { status: number; body: unknown }) {
  const onSaved = vi.fn();
  const calls = fakeApi((c) => (c.method === 'PUT' && c.url.pathname === '/api/jobs/j1/actuals' ? answer : undefined));
  renderPage(<ActualsEditor jobId="j1" load={load} people={people} stored={stored} editable onSaved={onSaved} />, { user: demoUser('installer') });
  return { calls, onSaved };
}

describe('correcting what was used', () => {
  it('starts from the stored figures and sends the correction with the version it was read at', async () => {
    const { calls, onSaved } = renderEditor({ status: 200, body: { actuals: { ...stored, version: 4 } } });
    expect(screen.getByTestId('actuals-recorded').textContent).toContain('Roll 100 mm: 6 used, 1 back');
    fireEvent.click(screen.getByRole('button', { name: 'Correct what was used' }));
    expect((screen.getByLabelText('Roll 100 mm: rolls used') as HTMLInputElement).value).toBe('6');
    expect((screen.getByLabelText('Sam Ridley: hours on site') as HTMLInputElement).value).toBe('5');
    // Nothing was stored for the hatch kit: blank, not the van load's 1.
    expect((screen.getByLabelText('Hatch kit: used') as HTMLInputElement).value).toBe('');
    fireEvent.change(screen.getByLabelText('Roll 100 mm: rolls used'), { target: { value: '5' } });
    fireEvent.change(screen.getByLabelText('Roll 100 mm: rolls brought back'), { target: { value: '2' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save correction' }));
    await screen.findByText('Saved.');
    expect(calls[0].body).toEqual({
      expectedVersion: 3,
      actuals: { rolls: [{ productId: 'prod-100', used: 5, returned: 2 }], hours: [{ userId: 'u1', hours: 5 }], extras: [] },
    });
    expect(onSaved).toHaveBeenCalled();
  });

  it('when someone saved a correction first, says so, closes the form and fetches their figures', async () => {
    const message = 'someone changed what was used since you opened it: look at the new figures and make your change again';
    const { onSaved } = renderEditor({ status: 409, body: { error: { code: 'actuals_changed', message } } });
    fireEvent.click(screen.getByRole('button', { name: 'Correct what was used' }));
    fireEvent.change(screen.getByLabelText('Sam Ridley: hours on site'), { target: { value: '6' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save correction' }));
    expect(await screen.findByText(message)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save correction' })).toBeNull();
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
  });

  it('shows the figures without the button to someone who may not correct them', () => {
    fakeApi(() => undefined);
    renderPage(<ActualsEditor jobId="j1" load={load} people={people} stored={stored} editable={false} onSaved={() => {}} />, { user: demoUser('installer') });
    expect(screen.getByTestId('actuals-recorded').textContent).toContain('5 hours on site');
    expect(screen.queryByRole('button', { name: 'Correct what was used' })).toBeNull();
  });
});
