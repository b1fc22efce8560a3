import { useNavigate, useParams } from 'react-router-dom';
import { ErrorState, LoadingState, PageHeader } from '../../components/ui';
import { useJob } from '../../features/jobs/api/get-job';
import { isApiError } from '../../lib/api-client';
import { RequireAction } from '../require-auth';
import { JobFormPage } from '../job-form/job-form-page';
import NotFoundPage from './not-found';

export default function JobEditPage() {
  return (
    <RequireAction action="jobs:write">
      <JobEdit />
    </RequireAction>
  );
}

// Separate so its queries run only for roles that may use the page.
function JobEdit() {
  const { id = '' } = useParams();
  const navigate = useNavigate();
  const job = useJob(id);
  return (
    <>
      <div className="mx-auto max-w-3xl">
        {job.isPending ? (
          <LoadingState label="Loading the job…" />
        ) : job.isError ? (
          isApiError(job.error) && job.error.status === 404 ? (
            <NotFoundPage />
          ) : (
            <ErrorState error={job.error} onRetry={() => job.refetch()} />
          )
        ) : (
          <>
            <PageHeader eyebrow={job.data.reference} title="Edit job" subtitle={job.data.customer.name} />
            <JobFormPage key={job.data.id} job={job.data} onSaved={() => navigate(`/jobs/${id}`)} />
          </>
        )}
      </div>
    </>
  );
}
