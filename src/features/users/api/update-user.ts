import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UpdateUserBody, User } from '../../../../shared/api/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

export async function updateUser(id: string, body: UpdateUserBody): Promise<User> {
  return (await api.patch<{ user: User }>(`/api/users/${encodeURIComponent(id)}`, body)).user;
}

/** Changes a user's name, role or active flag. */
export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, body }: { id: string; body: UpdateUserBody }) => updateUser(id, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: userKeys.all }),
  });
}
