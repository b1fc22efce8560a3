import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { MailRecord, MailRecordsResponse } from '../../../../shared/api/mail';
import { api } from '../../../lib/api-client';

const mailKeys = { all: ['mail-records'] as const };

/** The company's latest e-mail with its sending status (waiting, sent, failed), refreshed as the worker sends. */
export function useMailRecords() {
  return useQuery({
    queryKey: mailKeys.all,
    queryFn: ({ signal }) => api.get<MailRecordsResponse>('/api/mail/messages', undefined, signal),
    refetchInterval: 3000,
  });
}

/** Queues a failed message again (the server answers 409 when it is no longer failed). */
export function useResendMail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (id: string) => (await api.post<{ message: MailRecord }>(`/api/mail/messages/${encodeURIComponent(id)}/resend`)).message,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: mailKeys.all }), qc.invalidateQueries({ queryKey: ['outbox'] })]),
  });
}
