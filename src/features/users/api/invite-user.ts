import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InviteUserBody, User } from '../../../../shared/api/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

/** Creates the user without a password and e-mails them a link to set one. */
export async function inviteUser(body: InviteUserBody): Promise<User> {
  return (await api.post<{ user: User }>('/api/users', body)).user;
}

export function useInviteUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: inviteUser,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: userKeys.all }), qc.invalidateQueries({ queryKey: ['outbox'] })]),
  });
}
