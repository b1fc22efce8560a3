import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Job } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

export async function getJob(id: string, signal?: AbortSignal): Promise<Job> {
  return (await api.get<{ job: Job }>(`/api/jobs/${encodeURIComponent(id)}`, undefined, signal)).job;
}

export const jobQueryOptions = (id: string) => queryOptions({ queryKey: jobKeys.detail(id), queryFn: ({ signal }) => getJob(id, signal) });

export function useJob(id: string) {
  return useQuery(jobQueryOptions(id));
}
