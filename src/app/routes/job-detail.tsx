import { useParams } from 'react-router-dom';
import { can } from '../../../shared/auth/policies';
import type { JobStage } from '../../../shared/api/jobs';
import { ButtonLink, ErrorState, LoadingState, PageHeader, StageBadge, formatDateTime } from '../../components/ui';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useJob } from '../../features/jobs/api/get-job';
import { JobDetails } from '../../features/jobs/components/job-details';
import { JobSpaces } from '../../features/jobs/components/job-spaces';
import { JobTimeline } from '../../features/jobs/components/job-timeline';
import { StageControl } from '../../features/jobs/components/stage-control';
import { JobMoneyCard } from '../../features/invoices/components/job-money-card';
import { useJobQuotes } from '../../features/quotes/api/get-job-quotes';
import { JobQuotesCard } from '../../features/quotes/components/job-quotes-card';
import { isApiError } from '../../lib/api-client';
import { JobActualsCard } from '../../features/reports/components/job-actuals-card';
import NotFoundPage from './not-found';

/** One job: who, where, which stage, who installs it and when, and its loft spaces. */
export default function JobDetailPage() {
  const { id = '' } = useParams();
  const user = useCurrentUser();
  const job = useJob(id);
  if (job.isPending) return <LoadingState label="Loading the job…" />;
  if (job.isError) {
    if (isApiError(job.error) && job.error.status === 404) return <NotFoundPage />;
    return <ErrorState error={job.error} onRetry={() => job.refetch()} title="The job could not be loaded" />;
  }
  const j = job.data;
  const canEdit = can(user, 'jobs:write');
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={j.reference}
        documentTitle={`${j.reference} ${j.customer.name}`}
        title={
          <span className="flex flex-wrap items-center gap-x-3 gap-y-1">
            {j.customer.name} <StageBadge stage={j.stage} />
          </span>
        }
        subtitle={`Last changed ${formatDateTime(j.updatedAt)}`}
        actions={
          <>
            <ButtonLink to={`/jobs/${j.id}/sheet`} variant="secondary">
              Job sheet
            </ButtonLink>
            {canEdit && (
              <ButtonLink to={`/jobs/${j.id}/edit`} variant="primary">
                Edit job
              </ButtonLink>
            )}
          </>
        }
      />
      {canEdit && (
        <div className="rounded-lg border border-paper-line bg-white/60 px-4 py-3">
          <StageControl job={j} />
        </div>
      )}
      <JobDetails job={j} />
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,2fr)_minmax(0,1fr)]">
        <JobSpaces job={j} canEdit={can(user, 'plans:write')} />
        <JobTimeline jobId={j.id} />
      </div>
      {can(user, 'quotes:draft') && <JobQuotesCard jobId={j.id} />}
      {can(user, 'prices:read') && <JobMoney jobId={j.id} stage={j.stage} canInvoice={can(user, 'quotes:manage')} />}
      {can(user, 'reports:read') && (j.stage === 'installed' || j.stage === 'closed') && <JobActualsCard jobId={j.id} installer={j.assignedInstaller} />}
    </div>
  );
}

/** The money card, told whether the job has an accepted quote (an invoice is made from it). */
function JobMoney({ jobId, stage, canInvoice }: { jobId: string; stage: JobStage; canInvoice: boolean }) {
  const quotes = useJobQuotes(jobId);
  const hasAcceptedQuote = quotes.isSuccess ? quotes.data.some((q) => q.status === 'accepted') : undefined;
  return <JobMoneyCard jobId={jobId} stage={stage} canInvoice={canInvoice} hasAcceptedQuote={hasAcceptedQuote} />;
}
