import { useSearchParams } from 'react-router-dom';
import { JOB_SORTS, JOB_STAGES, type JobStage } from '../../../shared/api/jobs';
import { can } from '../../../shared/auth/policies';
import { Button, ButtonLink, EmptyState, ErrorState, LoadingState, PageHeader, Spinner } from '../../components/ui';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useInstallers } from '../../features/jobs/api/get-installers';
import { useJobs } from '../../features/jobs/api/get-jobs';
import { JobFilters, type JobFilterValues, type JobSort } from '../../features/jobs/components/job-filters';
import { JobsTable } from '../../features/jobs/components/jobs-table';
import { useDebouncedValue } from '../../lib/use-debounced-value';

function readFilters(params: URLSearchParams): JobFilterValues {
  const stage = params.get('stage') ?? '';
  const sort = params.get('sort') ?? 'updated';
  return {
    q: params.get('q') ?? '',
    stage: (JOB_STAGES as readonly string[]).includes(stage) ? (stage as JobStage) : '',
    installerId: /^[0-9a-f-]{36}$/i.test(params.get('installer') ?? '') ? params.get('installer')! : '',
    sort: (JOB_SORTS as readonly string[]).includes(sort) ? (sort as JobSort) : 'updated',
    dir: params.get('dir') === 'asc' ? 'asc' : 'desc',
  };
}

/** All the company's jobs, filtered and sorted by what the URL says (so a filtered list can be shared). */
export default function JobsListPage() {
  const user = useCurrentUser();
  const [params, setParams] = useSearchParams();
  const filters = readFilters(params);
  const q = useDebouncedValue(filters.q.trim(), 250);
  const canFilterByInstaller = can(user, 'jobs:read-all');
  const installers = useInstallers({ enabled: canFilterByInstaller });
  const jobs = useJobs({
    q: q || undefined,
    stage: filters.stage || undefined,
    installerId: filters.installerId || undefined,
    sort: filters.sort,
    dir: filters.dir,
  });
  const filtered = !!(filters.q.trim() || filters.stage || filters.installerId);

  function update(next: Partial<JobFilterValues>) {
    const merged = { ...filters, ...next };
    const p = new URLSearchParams();
    if (merged.q) p.set('q', merged.q);
    if (merged.stage) p.set('stage', merged.stage);
    if (merged.installerId) p.set('installer', merged.installerId);
    if (merged.sort !== 'updated') p.set('sort', merged.sort);
    if (merged.dir !== 'desc') p.set('dir', merged.dir);
    setParams(p, { replace: true });
  }

  const newJob = can(user, 'jobs:write') ? (
    <ButtonLink to="/jobs/new" variant="primary">
      New job
    </ButtonLink>
  ) : null;

  return (
    <div>
      <PageHeader
        title="Jobs"
        subtitle={jobs.total !== undefined ? `${jobs.total} ${jobs.total === 1 ? 'job' : 'jobs'}${filtered ? ' match' : ''}` : ' '}
        actions={newJob}
      />
      <JobFilters value={filters} onChange={update} installers={canFilterByInstaller ? (installers.data ?? []) : null} />
      {jobs.isPending ? (
        <LoadingState label="Loading jobs…" />
      ) : jobs.isError ? (
        <ErrorState error={jobs.error} onRetry={() => jobs.refetch()} title="The jobs could not be loaded" />
      ) : !jobs.jobs?.length ? (
        filtered ? (
          <EmptyState
            title="No jobs match"
            action={
              <Button variant="secondary" onClick={() => update({ q: '', stage: '', installerId: '' })}>
                Clear search and filters
              </Button>
            }
          >
            Nothing matches {filters.q.trim() ? <>“{filters.q.trim()}”</> : 'this filter'}
            {filters.stage ? ' at this stage' : ''}
            {filters.installerId ? ' for this installer' : ''}.
          </EmptyState>
        ) : (
          <EmptyState title="No jobs yet" action={newJob}>
            A job is one property's loft work, from the first enquiry to the installed job.
          </EmptyState>
        )
      ) : (
        <div className="relative">
          {jobs.isFetching && !jobs.isFetchingNextPage && <Spinner size="sm" label="Updating" className="absolute -top-7 right-1 text-graphite-light" />}
          <JobsTable
            jobs={jobs.jobs}
            sort={{ key: filters.sort, dir: filters.dir }}
            onSort={(sort, dir) => update({ sort, dir })}
            pages={{
              loaded: jobs.jobs.length,
              total: jobs.total,
              hasMore: jobs.hasNextPage,
              loading: jobs.isFetchingNextPage,
              failed: jobs.isFetchNextPageError,
              onLoadMore: () => jobs.loadMore(),
              noun: 'jobs',
            }}
          />
        </div>
      )}
    </div>
  );
}
