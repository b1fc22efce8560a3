import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InstallerOption } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

/** Active installers of the company, for assigning a job (office and estimators may read them). */
export async function getInstallers(signal?: AbortSignal): Promise<InstallerOption[]> {
  return (await api.get<{ installers: InstallerOption[] }>('/api/jobs/installers', undefined, signal)).installers;
}

export const installersQueryOptions = () =>
  queryOptions({ queryKey: [...jobKeys.all, 'installers'] as const, queryFn: ({ signal }) => getInstallers(signal), staleTime: 5 * 60_000 });

export function useInstallers(opts: { enabled?: boolean } = {}) {
  return useQuery({ ...installersQueryOptions(), enabled: opts.enabled ?? true });
}
