import { keepPreviousData, useInfiniteQuery } from '@tanstack/react-query';
import type { Job, JobListQuery } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

/** A job as listed: the list may leave out the spaces. */
export type JobListItem = Omit<Job, 'spaces'> & { spaces?: Job['spaces'] };

/** One page of GET /api/jobs; `nextCursor` null on the last page. */
export type JobsPage = { jobs: JobListItem[]; nextCursor: string | null; count: number };

export async function getJobsPage(query: JobListQuery, cursor: string | undefined, signal?: AbortSignal): Promise<JobsPage> {
  const body = await api.get<Partial<JobsPage> & { jobs: JobListItem[] }>(
    '/api/jobs',
    { q: query.q?.trim(), stage: query.stage, installerId: query.installerId, sort: query.sort, dir: query.dir, cursor },
    signal,
  );
  return { jobs: body.jobs, nextCursor: body.nextCursor ?? null, count: body.count ?? body.jobs.length };
}

/**
 * The jobs list, a page at a time (the server pages by cursor): `jobs` holds every page loaded so
 * far, `loadMore()` fetches the next, `total` counts all matching jobs (the API's `count`). A new search or order
 * starts again from the first page.
 */
export function useJobs(query: JobListQuery) {
  const q = useInfiniteQuery({
    queryKey: jobKeys.list(query),
    queryFn: ({ signal, pageParam }) => getJobsPage(query, pageParam, signal),
    initialPageParam: undefined as string | undefined,
    getNextPageParam: (last) => last.nextCursor ?? undefined,
    placeholderData: keepPreviousData,
  });
  const jobs = q.data?.pages.flatMap((p) => p.jobs);
  return { ...q, jobs, total: q.data?.pages[0]?.count, loadMore: () => q.fetchNextPage() };
}
