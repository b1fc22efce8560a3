import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DepositStatus, PaymentTimelineEntry } from '../../../../shared/api/payments';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

export async function getDeposit(quoteId: string, signal?: AbortSignal): Promise<DepositStatus> {
  return (await api.get<{ deposit: DepositStatus }>(`/api/payments/deposits/${encodeURIComponent(quoteId)}`, undefined, signal)).deposit;
}

export const depositQueryOptions = (quoteId: string) =>
  queryOptions({ queryKey: invoiceKeys.deposit(quoteId), queryFn: ({ signal }) => getDeposit(quoteId, signal) });

/** A quote's deposit: none asked, due, or paid (amount and time). */
export function useDeposit(quoteId: string) {
  return useQuery(depositQueryOptions(quoteId));
}

export async function getPaymentTimeline(jobId: string, signal?: AbortSignal): Promise<PaymentTimelineEntry[]> {
  return (await api.get<{ entries: PaymentTimelineEntry[] }>(`/api/payments/jobs/${encodeURIComponent(jobId)}/timeline`, undefined, signal)).entries;
}

export const paymentTimelineQueryOptions = (jobId: string) =>
  queryOptions({ queryKey: invoiceKeys.jobMoney(jobId), queryFn: ({ signal }) => getPaymentTimeline(jobId, signal) });

/** The money events of a job (deposit paid, invoice issued/paid, credit notes, refunds), oldest first. */
export function usePaymentTimeline(jobId: string) {
  return useQuery(paymentTimelineQueryOptions(jobId));
}
