import { useQuery } from '@tanstack/react-query';
import type { JobNote, JobSheet } from '../../../../shared/api/job-sheet';
import { api } from '../../../lib/api-client';
import { invoiceKeys } from './keys';

/** The installer's notes from site (from the job sheet), for pricing variations on the invoice. */
export async function getSiteNotes(jobId: string, signal?: AbortSignal): Promise<JobNote[]> {
  return (await api.get<{ sheet: JobSheet }>(`/api/jobs/${encodeURIComponent(jobId)}/job-sheet`, undefined, signal)).sheet.notes;
}

export function useSiteNotes(jobId: string, enabled: boolean) {
  return useQuery({ queryKey: [...invoiceKeys.jobMoney(jobId), 'site-notes'], queryFn: ({ signal }) => getSiteNotes(jobId, signal), enabled, retry: false });
}
