import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Job, JobListQuery } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

/** A job as listed: the list may leave out the spaces. */
export type JobListItem = Omit<Job, 'spaces'> & { spaces?: Job['spaces'] };

export async function getJobs(query: JobListQuery, signal?: AbortSignal): Promise<JobListItem[]> {
  const body = await api.get<{ jobs: JobListItem[] }>(
    '/api/jobs',
    { q: query.q?.trim(), stage: query.stage, installerId: query.installerId, sort: query.sort, dir: query.dir },
    signal,
  );
  return body.jobs;
}

export const jobsQueryOptions = (query: JobListQuery) =>
  queryOptions({
    queryKey: jobKeys.list(query),
    queryFn: ({ signal }) => getJobs(query, signal),
    placeholderData: keepPreviousData,
  });

export function useJobs(query: JobListQuery) {
  return useQuery(jobsQueryOptions(query));
}
