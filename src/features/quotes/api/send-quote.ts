import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Quote } from '../../../../shared/api/quotes';
import { api } from '../../../lib/api-client';
import { jobKeys } from '../../jobs/api/keys';
import { quoteKeys } from './keys';

export async function sendQuote(id: string, message?: string): Promise<{ quote: Quote; link: string }> {
  return api.post<{ quote: Quote; link: string }>(`/api/quotes/${encodeURIComponent(id)}/send`, message ? { message } : {});
}

export function useSendQuote(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (message?: string) => sendQuote(id, message),
    onSuccess: (r) => {
      qc.setQueryData(quoteKeys.detail(r.quote.id), r.quote);
      void qc.invalidateQueries({ queryKey: quoteKeys.all });
      void qc.invalidateQueries({ queryKey: jobKeys.all });
    },
  });
}
