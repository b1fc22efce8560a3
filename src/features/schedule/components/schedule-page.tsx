import { useState } from 'react';
import { Link } from 'react-router-dom';
import { can } from '../../../../shared/auth/policies';
import type { AssignResult } from '../../../../shared/api/schedule';
import { addDaysIso, formatDate, mondayOf, todayIso } from '../../../../shared/dates';
import { Alert, Button, Card, CardTitle, ErrorState, LoadingState, PageHeader } from '../../../components/ui';
import { useCurrentUser } from '../../auth';
import { useWeek } from '../api/get-week';
import { BookingForm } from './booking-form';
import { InstallSettingsCard } from './install-settings-card';
import { WeekGrid } from './week-grid';

type Booked = { result: AssignResult; reference: string; customerName: string; installerName: string };

/** The office's week of installs: installers by day with their jobs, accepted jobs to book, capacity warnings. */
export default function SchedulePage() {
  const user = useCurrentUser();
  const [weekStart, setWeekStart] = useState(() => mondayOf(todayIso()));
  const week = useWeek(weekStart);
  const canBook = can(user, 'jobs:assign');
  const [booked, setBooked] = useState<Booked | null>(null);

  return (
    <div>
      <PageHeader
        eyebrow="Installs"
        title="Schedule"
        subtitle="Book accepted jobs for an installer and a day. The customer is e-mailed the date and how to prepare; the installer gets the job sheet link."
        actions={
          <div className="flex items-center gap-2">
            <Button variant="secondary" size="sm" onClick={() => setWeekStart((w) => addDaysIso(w, -7))} aria-label="Previous week">
              ‹ Prev
            </Button>
            <Button variant="secondary" size="sm" onClick={() => setWeekStart(mondayOf(todayIso()))}>
              This week
            </Button>
            <Button variant="secondary" size="sm" onClick={() => setWeekStart((w) => addDaysIso(w, 7))} aria-label="Next week">
              Next ›
            </Button>
          </div>
        }
      />
      {week.isPending ? (
        <LoadingState label="Loading the week…" />
      ) : week.isError ? (
        <ErrorState error={week.error} onRetry={() => week.refetch()} />
      ) : (
        <div className="flex flex-col gap-5">
          {booked && (
            <div role="status" data-testid="booking-confirmation">
              <Alert tone="success">
                <span className="font-semibold">
                  {booked.reference} ({booked.customerName}) booked for {booked.installerName} on {formatDate(booked.result.installDate)}.
                </span>{' '}
                {booked.result.emailed.length > 0 ? `E-mailed: ${booked.result.emailed.join(', ')}.` : 'Nobody was e-mailed.'}
                {booked.result.warnings.map((w) => (
                  <div key={w}>{w}</div>
                ))}
                <Button variant="secondary" size="sm" className="mt-2" onClick={() => setBooked(null)}>
                  Dismiss
                </Button>
              </Alert>
            </div>
          )}
          {week.data.loads.some((l) => l.overCapacity) && (
            <Alert tone="caution">
              Some installer-days this week are over capacity ({week.data.capacity.maxJobsPerDay} job(s) or {week.data.capacity.maxAreaM2PerDay} m² a day).
            </Alert>
          )}
          <WeekGrid week={week.data} />
          <Card>
            <CardTitle>Waiting to be booked ({week.data.unscheduled.length})</CardTitle>
            {week.data.unscheduled.length === 0 ? (
              <p className="text-sm text-graphite-light">No accepted jobs are waiting for a date.</p>
            ) : (
              <ul className="flex flex-col divide-y divide-paper-line">
                {week.data.unscheduled.map((job) => (
                  <li key={job.id} className="flex flex-col gap-2 py-3 lg:flex-row lg:items-start lg:justify-between">
                    <div className="min-w-0">
                      <Link to={`/jobs/${job.id}`} className="font-mono text-sm font-semibold text-teal-dark underline">
                        {job.reference}
                      </Link>{' '}
                      <span className="font-medium">{job.customerName}</span>
                      <div className="text-sm text-graphite-light">
                        {job.town} {job.postcode}
                        {job.areaM2 !== null && ` · ${job.areaM2.toFixed(1)} m²`}
                      </div>
                    </div>
                    {canBook && (
                      <BookingForm
                        job={job}
                        installers={week.data.installers}
                        defaultDate={week.data.days[0] < todayIso() ? todayIso() : week.data.days[0]}
                        onBooked={(result, booked, installerName) =>
                          setBooked({ result, reference: booked.reference, customerName: booked.customerName, installerName })
                        }
                      />
                    )}
                  </li>
                ))}
              </ul>
            )}
          </Card>
          {can(user, 'settings:manage') && <InstallSettingsCard />}
        </div>
      )}
    </div>
  );
}
