import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyJob } from '../../../../shared/api/job-sheet';
import { api } from '../../../lib/api-client';
import { sheetKeys } from './keys';

export async function getMyJobs(signal?: AbortSignal): Promise<MyJob[]> {
  return (await api.get<{ jobs: MyJob[] }>('/api/my-jobs', undefined, signal)).jobs;
}

export const myJobsQueryOptions = () => queryOptions({ queryKey: sheetKeys.myJobs(), queryFn: ({ signal }) => getMyJobs(signal) });

export function useMyJobs() {
  return useQuery(myJobsQueryOptions());
}
