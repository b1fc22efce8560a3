import { allowedStageMoves } from '../../../../shared/api/job-stages';
import { JOB_STAGES, type Job, type JobStage } from '../../../../shared/api/jobs';
import { useCurrentUser } from '../../auth';
import { Alert, Select, Spinner, STAGE_LABELS } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { formErrorMessage } from '../../../lib/forms/server-errors';
import { useUpdateJob } from '../api/update-job';

const PATH: JobStage[] = JOB_STAGES.filter((s) => s !== 'declined');

/** Where the job is on its way from enquiry to closed (declined shown as a branch). */
function StagePath({ stage }: { stage: JobStage }) {
  const at = PATH.indexOf(stage);
  return (
    <ol className="hidden items-center gap-1 md:flex" aria-label="Stages">
      {PATH.map((s, i) => (
        <li key={s} className="flex items-center gap-1">
          {i > 0 && <span aria-hidden className={cn('h-px w-3', i <= at ? 'bg-teal' : 'bg-graphite/20')} />}
          <span
            aria-current={s === stage ? 'step' : undefined}
            className={cn(
              'rounded-full px-2 py-0.5 text-xs',
              s === stage ? 'bg-teal-dark font-semibold text-white' : i < at ? 'bg-teal-light/50 text-teal-dark' : 'text-graphite-faint',
            )}
          >
            {STAGE_LABELS[s]}
          </span>
        </li>
      ))}
      {stage === 'declined' && <li className="ml-2 rounded-full bg-brick px-2 py-0.5 text-xs font-semibold text-white">{STAGE_LABELS.declined}</li>}
    </ol>
  );
}

/** Moves the job at once to a stage the shared table allows from where it is; the server checks the same table. */
export function StageControl({ job }: { job: Job }) {
  const update = useUpdateJob(job.id);
  const { role } = useCurrentUser();
  const shown = update.isPending && update.variables?.stage ? update.variables.stage : job.stage;
  const offered = [job.stage, ...allowedStageMoves(job.stage, role)];
  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <StagePath stage={shown} />
        <div className="flex items-center gap-2">
          <label htmlFor="stage-control" className="text-sm font-medium whitespace-nowrap">
            Move to
          </label>
          <Select
            id="stage-control"
            className="h-9 w-40"
            value={shown}
            disabled={update.isPending}
            onChange={(e) => update.mutate({ stage: e.target.value as JobStage })}
          >
            {JOB_STAGES.filter((s) => offered.includes(s) || s === shown).map((s) => (
              <option key={s} value={s}>
                {STAGE_LABELS[s]}
              </option>
            ))}
          </Select>
          {update.isPending && <Spinner size="sm" label="Saving stage" />}
        </div>
      </div>
      {update.isError && <Alert>{formErrorMessage(update.error)}</Alert>}
    </div>
  );
}
