import { queryOptions, useQuery } from '@tanstack/react-query';
import type { User } from '../../../../shared/api/users';
import { api } from '../../../lib/api-client';
import { userKeys } from './keys';

export async function getUsers(signal?: AbortSignal): Promise<User[]> {
  return (await api.get<{ users: User[] }>('/api/users', undefined, signal)).users;
}

export const usersQueryOptions = () => queryOptions({ queryKey: userKeys.list(), queryFn: ({ signal }) => getUsers(signal) });

export function useUsers(opts: { enabled?: boolean } = {}) {
  return useQuery({ ...usersQueryOptions(), enabled: opts.enabled ?? true });
}
