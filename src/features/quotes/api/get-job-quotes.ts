import { queryOptions, useQuery } from '@tanstack/react-query';
import type { QuoteSummary } from '../../../../shared/api/quotes';
import { api } from '../../../lib/api-client';
import { quoteKeys } from './keys';

export async function getJobQuotes(jobId: string, signal?: AbortSignal): Promise<QuoteSummary[]> {
  return (await api.get<{ quotes: QuoteSummary[] }>(`/api/jobs/${encodeURIComponent(jobId)}/quotes`, undefined, signal)).quotes;
}

export const jobQuotesQueryOptions = (jobId: string) =>
  queryOptions({ queryKey: quoteKeys.forJob(jobId), queryFn: ({ signal }) => getJobQuotes(jobId, signal) });

export function useJobQuotes(jobId: string) {
  return useQuery(jobQuotesQueryOptions(jobId));
}
