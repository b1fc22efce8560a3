import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { PaymentSettingsBody, PaymentSettingsView } from '../../../../shared/api/payments';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

export const getPaymentSettings = (signal?: AbortSignal) => api.get<PaymentSettingsView>('/api/payments/settings', undefined, signal);
export const putPaymentSettings = (body: PaymentSettingsBody) => api.put<PaymentSettingsView>('/api/payments/settings', body);

export const paymentSettingsQueryOptions = () => queryOptions({ queryKey: invoiceKeys.paymentSettings(), queryFn: ({ signal }) => getPaymentSettings(signal) });

export function usePaymentSettings() {
  return useQuery(paymentSettingsQueryOptions());
}

export function useUpdatePaymentSettings() {
  const qc = useQueryClient();
  return useMutation({ mutationFn: putPaymentSettings, onSuccess: (view) => qc.setQueryData(invoiceKeys.paymentSettings(), view) });
}
