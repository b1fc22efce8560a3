import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginBody, Me } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';
import { authKeys } from './get-me';

export async function login(body: LoginBody): Promise<Me> {
  return (await api.post<{ user: Me }>('/api/auth/login', body)).user;
}

/** Signs in; drops whatever a previous user left in the cache and stores the new user. */
export function useLogin() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: (me) => {
      qc.removeQueries({ predicate: (q) => q.queryKey[0] !== authKeys.all[0] });
      qc.setQueryData(authKeys.me(), me);
    },
  });
}
