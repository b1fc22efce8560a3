import { useNavigate } from 'react-router-dom';
import { PageHeader } from '../../components/ui';
import { RequireAction } from '../require-auth';
import { JobFormPage } from '../job-form/job-form-page';

export default function JobNewPage() {
  const navigate = useNavigate();
  return (
    <RequireAction action="jobs:write">
      <div className="mx-auto max-w-3xl">
        <PageHeader title="New job" subtitle="Who the customer is and which property the loft work is at." />
        <JobFormPage onSaved={(job) => navigate(`/jobs/${job.id}`)} />
      </div>
    </RequireAction>
  );
}
