// @vitest-environment happy-dom
import { cleanup, fireEvent, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { ScheduleJob, ScheduleWeek } from '../../shared/api/schedule';
import SchedulePage from '../../src/features/schedule/components/schedule-page';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const JOB: ScheduleJob = {
  id: '55555555-5555-4555-8555-555555555555',
  reference: 'JOB-2026-0007',
  stage: 'accepted',
  customerName: 'Robin Hale',
  town: 'Kelsworth',
  postcode: 'KW3 6NP',
  installDate: null,
  installerId: null,
  areaM2: 42.5,
};
const INSTALLER = { id: '66666666-6666-4666-8666-666666666666', name: 'Ian Calder' };

function week(unscheduled: ScheduleJob[]): ScheduleWeek {
  const monday = '2030-01-07';
  const days = [0, 1, 2, 3, 4, 5, 6].map((d) => `2030-01-${String(7 + d).padStart(2, '0')}`);
  return { weekStart: monday, days, installers: [INSTALLER], jobs: [], unscheduled, loads: [], capacity: { maxJobsPerDay: 1, maxAreaM2PerDay: 80 } };
}

describe('booking on the schedule', () => {
  it('confirms the booking on the page after the job leaves the waiting list', async () => {
    let booked = false;
    fakeApi(({ method, url }) => {
      if (url.pathname === '/api/schedule' && method === 'GET') return { body: week(booked ? [] : [JOB]) };
      if (url.pathname === '/api/schedule/assign' && method === 'POST') {
        booked = true;
        return {
          body: { jobId: JOB.id, stage: 'scheduled', installDate: '2030-01-08', installerId: INSTALLER.id, warnings: [], emailed: ['robin@example.com'] },
        };
      }
      return undefined;
    });
    renderPage(<SchedulePage />, { user: demoUser('office'), path: '/schedule' });
    fireEvent.click(await screen.findByRole('button', { name: 'Book' }));
    const confirmation = await screen.findByTestId('booking-confirmation');
    expect(confirmation.textContent).toContain('JOB-2026-0007 (Robin Hale) booked for Ian Calder on 8 Jan 2030.');
    expect(confirmation.textContent).toContain('E-mailed: robin@example.com.');
    expect(await screen.findByText('No accepted jobs are waiting for a date.')).toBeTruthy();
    expect(screen.getByTestId('booking-confirmation')).toBeTruthy();
  });
});
