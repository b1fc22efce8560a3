import { useEffect } from 'react';
import { Link } from 'react-router-dom';
import type { MyJob } from '../../../../shared/api/job-sheet';
import { localTodayIso } from '../../../../shared/dates';
import { EmptyState, ErrorState, LoadingState, PageHeader, StageBadge, formatAddress, formatDate } from '../../../components/ui';
import { useMyJobs } from '../api/get-my-jobs';
import { keepForOffline } from '../offline/register-sw';
import { startOutbox } from '../offline/outbox';
import { SyncStatus } from './sync-status';
import '../dark-loft.css';

/** Today's jobs first, then the coming ones by date, then earlier ones, most recent first. */
export function groupMyJobs(jobs: MyJob[], today: string) {
  const dated = (j: MyJob) => j.installDate ?? '9999-12-31';
  return {
    today: jobs.filter((j) => j.installDate === today),
    upcoming: jobs.filter((j) => dated(j) > today).sort((a, b) => dated(a).localeCompare(dated(b))),
    earlier: jobs.filter((j) => j.installDate !== null && j.installDate < today).sort((a, b) => b.installDate!.localeCompare(a.installDate!)),
  };
}

function JobCard({ job, highlight }: { job: MyJob; highlight?: boolean }) {
  return (
    <li>
      <Link
        to={`/jobs/${job.id}/sheet`}
        className={`block rounded-lg border-2 p-4 shadow-sm focus-visible:outline-3 focus-visible:outline-teal ${highlight ? 'border-teal-dark bg-white' : 'border-graphite/20 bg-white/90'}`}
      >
        <div className="flex items-center justify-between gap-2">
          <span className="text-lg font-bold text-graphite">{job.installDate ? formatDate(job.installDate) : 'No date yet'}</span>
          <StageBadge stage={job.stage} />
        </div>
        <div className="mt-1 text-lg font-semibold">{job.customerName}</div>
        <div className="text-base text-graphite">{formatAddress(job.propertyAddress)}</div>
        <div className="mt-1 font-mono text-sm text-graphite-light">
          {job.reference} · {job.spaceCount} space{job.spaceCount === 1 ? '' : 's'}
        </div>
      </Link>
    </li>
  );
}

function Section({ title, jobs, highlight }: { title: string; jobs: MyJob[]; highlight?: boolean }) {
  if (jobs.length === 0) return null;
  return (
    <section className="mb-6">
      <h2 className="mb-2 text-xl font-bold text-graphite">{title}</h2>
      <ul className="flex flex-col gap-3">
        {jobs.map((j) => (
          <JobCard key={j.id} job={j} highlight={highlight} />
        ))}
      </ul>
    </section>
  );
}

/** The installer's home: only the jobs assigned to them, today's first. */
export default function MyJobsPage() {
  const jobs = useMyJobs();
  useEffect(() => {
    startOutbox();
    void keepForOffline(['/api/auth/me', '/api/my-jobs']);
  }, []);
  if (jobs.isPending) return <LoadingState label="Loading your jobs…" />;
  if (jobs.isError) return <ErrorState error={jobs.error} onRetry={() => jobs.refetch()} />;
  const g = groupMyJobs(jobs.data, localTodayIso());
  return (
    <div className="mx-auto max-w-xl text-lg" data-dark-loft>
      <PageHeader title="My jobs" subtitle="Open a job sheet once with signal: it then works in the loft without any." />
      <SyncStatus />
      {jobs.data.length === 0 ? (
        <EmptyState title="No jobs assigned to you">The office assigns jobs; they appear here with their date.</EmptyState>
      ) : (
        <>
          {g.today.length === 0 && <p className="mb-4 rounded-md border border-graphite/20 bg-white/80 px-3 py-2 text-base">Nothing booked for today.</p>}
          <Section title="Today" jobs={g.today} highlight />
          <Section title="Coming up" jobs={g.upcoming} />
          <Section title="Earlier" jobs={g.earlier} />
        </>
      )}
    </div>
  );
}
