import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobSheet } from '../../../../shared/api/job-sheet';
import { api } from '../../../lib/api-client';
import { sheetKeys, sheetUrl } from './keys';

export async function getJobSheet(jobId: string, signal?: AbortSignal): Promise<JobSheet> {
  return (await api.get<{ sheet: JobSheet }>(sheetUrl(jobId), undefined, signal)).sheet;
}

export const jobSheetQueryOptions = (jobId: string) =>
  queryOptions({ queryKey: sheetKeys.sheet(jobId), queryFn: ({ signal }) => getJobSheet(jobId, signal), staleTime: 10_000 });

export function useJobSheet(jobId: string) {
  return useQuery(jobSheetQueryOptions(jobId));
}
