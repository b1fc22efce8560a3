import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { authKeys } from './get-me';

export function logout(): Promise<void> {
  return api.post<void>('/api/auth/logout');
}

/** Signs out and forgets every cached record, so the next user starts clean. */
export function useLogout() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSettled: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
