import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobEvent } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

/** A job's history, oldest first (created, stage changes, assignment, scheduling, edits). */
export async function getJobEvents(id: string, signal?: AbortSignal): Promise<JobEvent[]> {
  return (await api.get<{ events: JobEvent[] }>(`/api/jobs/${encodeURIComponent(id)}/events`, undefined, signal)).events;
}

// Under the job's detail key, so every mutation that refreshes the job refreshes its history too.
export const jobEventsQueryOptions = (id: string) =>
  queryOptions({ queryKey: [...jobKeys.detail(id), 'events'] as const, queryFn: ({ signal }) => getJobEvents(id, signal) });

export function useJobEvents(id: string) {
  return useQuery(jobEventsQueryOptions(id));
}
