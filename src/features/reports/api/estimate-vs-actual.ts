import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApplySuggestionBody, EstimateVsActualReport, JobEstimateVsActual, SettingsChange } from '../../../../shared/api/actuals';
import type { Suggestions } from '../../../../shared/reports/suggestions';
import { api } from '../../../lib/api-client';

export const reportKeys = {
  all: ['reports'] as const,
  report: (from: string, to: string) => [...reportKeys.all, 'estimate-vs-actual', from, to] as const,
  suggestions: () => [...reportKeys.all, 'suggestions'] as const,
  job: (id: string) => [...reportKeys.all, 'job', id] as const,
};

export const reportQueryOptions = (from: string, to: string) =>
  queryOptions({
    queryKey: reportKeys.report(from, to),
    queryFn: ({ signal }) => api.get<EstimateVsActualReport>('/api/reports/estimate-vs-actual', { from, to }, signal),
  });
export const useReport = (from: string, to: string) => useQuery(reportQueryOptions(from, to));

export const useSuggestions = () =>
  useQuery({
    queryKey: reportKeys.suggestions(),
    queryFn: ({ signal }) => api.get<{ suggestions: Suggestions; history: SettingsChange[] }>('/api/reports/suggestions', { last: 20 }, signal),
  });

export function useApplySuggestion() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ApplySuggestionBody) => api.post<{ applied: string }>('/api/reports/suggestions/apply', body),
    onSettled: () => qc.invalidateQueries({ queryKey: reportKeys.all }),
  });
}

export const useJobEstimateVsActual = (jobId: string) =>
  useQuery({
    queryKey: reportKeys.job(jobId),
    queryFn: ({ signal }) => api.get<JobEstimateVsActual>(`/api/jobs/${encodeURIComponent(jobId)}/estimate-vs-actual`, undefined, signal),
  });
