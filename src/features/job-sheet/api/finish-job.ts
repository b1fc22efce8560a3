import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FinishBody } from '../../../../shared/api/job-sheet';
import { api } from '../../../lib/api-client';
import { sheetKeys } from './keys';

export async function finishJob(jobId: string, body: FinishBody): Promise<{ stage: string }> {
  return api.post<{ stage: string }>(`/api/jobs/${encodeURIComponent(jobId)}/finish`, body);
}

export function useFinishJob(jobId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: FinishBody) => finishJob(jobId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: sheetKeys.all }),
  });
}
