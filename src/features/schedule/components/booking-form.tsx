import { useState } from 'react';
import type { AssignResult, ScheduleJob } from '../../../../shared/api/schedule';
import { Alert, Button, Input, Select } from '../../../components/ui';
import { isApiError } from '../../../lib/api-client';
import { useAssignJob } from '../api/assign-job';

/**
 * Installer + date for one accepted job; over capacity it asks before booking anyway. A booked job
 * leaves the waiting list at once (this form with it), so the confirmation is the page's: `onBooked`.
 */
export function BookingForm({
  job,
  installers,
  defaultDate,
  onBooked,
}: {
  job: ScheduleJob;
  installers: { id: string; name: string }[];
  defaultDate: string;
  onBooked: (result: AssignResult, job: ScheduleJob, installerName: string) => void;
}) {
  const [installerId, setInstallerId] = useState(installers[0]?.id ?? '');
  const [date, setDate] = useState(defaultDate);
  const assign = useAssignJob();
  const overCapacity = isApiError(assign.error) && assign.error.code === 'over_capacity';
  // mutateAsync, not mutate's onSuccess: the refetch after booking unmounts this form before mutate's callbacks would run.
  const book = (allowOverCapacity: boolean) =>
    assign.mutateAsync({ jobId: job.id, installerId, date, allowOverCapacity }).then(
      (result) => onBooked(result, job, installers.find((i) => i.id === installerId)?.name ?? 'the installer'),
      () => undefined,
    );

  return (
    <form
      className="flex flex-col gap-2 sm:flex-row sm:items-end"
      onSubmit={(e) => {
        e.preventDefault();
        book(false);
      }}
    >
      <label className="flex flex-col text-xs font-medium">
        Installer
        <Select value={installerId} onChange={(e) => setInstallerId(e.target.value)} className="h-9 w-48">
          {installers.map((i) => (
            <option key={i.id} value={i.id}>
              {i.name}
            </option>
          ))}
        </Select>
      </label>
      <label className="flex flex-col text-xs font-medium">
        Date
        <Input type="date" value={date} onChange={(e) => setDate(e.target.value)} className="h-9 w-40" />
      </label>
      <Button type="submit" size="sm" busy={assign.isPending && !overCapacity} disabled={!installerId || !date}>
        Book
      </Button>
      {assign.error && (
        <div className="sm:max-w-sm">
          <Alert tone={overCapacity ? 'caution' : 'error'}>
            {assign.error.message}
            {overCapacity && (
              <Button variant="danger" size="sm" className="mt-2" onClick={() => book(true)} busy={assign.isPending}>
                Book anyway
              </Button>
            )}
          </Alert>
        </div>
      )}
    </form>
  );
}
