import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { InstallSettings } from '../../../../shared/api/schedule';
import { api } from '../../../lib/api-client';
import { scheduleKeys } from './keys';

export async function getInstallSettings(signal?: AbortSignal): Promise<InstallSettings> {
  return (await api.get<{ settings: InstallSettings }>('/api/schedule/settings', undefined, signal)).settings;
}

export const installSettingsQueryOptions = () => queryOptions({ queryKey: scheduleKeys.settings(), queryFn: ({ signal }) => getInstallSettings(signal) });

export function useInstallSettings() {
  return useQuery(installSettingsQueryOptions());
}

export function useUpdateInstallSettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (patch: Partial<InstallSettings>) => (await api.patch<{ settings: InstallSettings }>('/api/schedule/settings', patch)).settings,
    onSuccess: () => qc.invalidateQueries({ queryKey: scheduleKeys.all }),
  });
}
