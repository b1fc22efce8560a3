import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CompanySettings, CompanySettingsBody } from '../../../../shared/api/settings';
import { api, ApiError } from '../../../lib/api-client';
import { settingsKeys } from './keys';

export async function getCompanySettings(signal?: AbortSignal): Promise<CompanySettings> {
  return (await api.get<{ settings: CompanySettings }>('/api/settings', undefined, signal)).settings;
}
export const companySettingsQueryOptions = () => queryOptions({ queryKey: settingsKeys.company(), queryFn: ({ signal }) => getCompanySettings(signal) });
export function useCompanySettings() {
  return useQuery(companySettingsQueryOptions());
}

export function useSaveCompanySettings() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: CompanySettingsBody) => (await api.put<{ settings: CompanySettings }>('/api/settings', body)).settings,
    onSuccess: (s) => qc.setQueryData(settingsKeys.company(), s),
  });
}

/** Uploads a PNG or JPEG logo (multipart, field "logo"). */
export function useUploadLogo() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (file: File) => {
      const form = new FormData();
      form.append('logo', file);
      const res = await fetch('/api/settings/logo', { method: 'POST', body: form, credentials: 'same-origin' });
      const body = await res.json().catch(() => null);
      if (!res.ok) throw new ApiError(res.status, body?.error?.code ?? 'error', body?.error?.message ?? 'The logo could not be uploaded.');
      return body.settings as CompanySettings;
    },
    onSuccess: (s) => qc.setQueryData(settingsKeys.company(), s),
  });
}
