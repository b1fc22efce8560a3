import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Quote } from '../../../../shared/api/quotes';
import { api } from '../../../lib/api-client';
import { jobKeys } from '../../jobs/api/keys';
import { quoteKeys } from './keys';

/** Builds a draft from the job's saved takeoffs (empty body). */
export async function createQuote(jobId: string): Promise<Quote> {
  return (await api.post<{ quote: Quote }>(`/api/jobs/${encodeURIComponent(jobId)}/quotes`, {})).quote;
}

export function useCreateQuote(jobId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => createQuote(jobId),
    onSuccess: (q) => {
      qc.setQueryData(quoteKeys.detail(q.id), q);
      void qc.invalidateQueries({ queryKey: quoteKeys.forJob(jobId) });
      // The server writes "Quote … drafted" into the job's history (under the job's detail key).
      void qc.invalidateQueries({ queryKey: jobKeys.detail(jobId) });
    },
  });
}
