import { JOB_STAGES, type Job, type JobStage } from '../../../../shared/api/jobs';
import { Alert, Select, Spinner, STAGE_LABELS } from '../../../components/ui';
import { formErrorMessage } from '../../../lib/form-errors';
import { useUpdateJob } from '../api/update-job';

/** Moves the job to another stage at once; the server checks the role. */
export function StageControl({ job }: { job: Job }) {
  const update = useUpdateJob(job.id);
  return (
    <div className="flex flex-col gap-1">
      <div className="flex items-center gap-2">
        <label htmlFor="stage-control" className="text-sm font-medium">
          Stage
        </label>
        <Select
          id="stage-control"
          className="h-9 w-44"
          value={update.isPending && update.variables?.stage ? update.variables.stage : job.stage}
          disabled={update.isPending}
          onChange={(e) => update.mutate({ stage: e.target.value as JobStage })}
        >
          {JOB_STAGES.map((s) => (
            <option key={s} value={s}>
              {STAGE_LABELS[s]}
            </option>
          ))}
        </Select>
        {update.isPending && <Spinner size="sm" label="Saving stage" />}
      </div>
      {update.isError && <Alert>{formErrorMessage(update.error)}</Alert>}
    </div>
  );
}
