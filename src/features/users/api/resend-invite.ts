import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { User } from '../../../../shared/api/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

/** E-mails a fresh set-password link to a user who has not set a password yet. */
export async function resendInvite(id: string): Promise<User> {
  return (await api.post<{ user: User }>(`/api/users/${encodeURIComponent(id)}/resend-invite`)).user;
}

export function useResendInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: resendInvite,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: userKeys.all }), qc.invalidateQueries({ queryKey: ['outbox'] })]),
  });
}
