import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Job, JobPatch } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

export async function updateJob(id: string, patch: JobPatch): Promise<Job> {
  return (await api.patch<{ job: Job }>(`/api/jobs/${encodeURIComponent(id)}`, patch)).job;
}

/** Changes part of a job (stage, installer, address…) and refreshes the lists that show it. */
export function useUpdateJob(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (patch: JobPatch) => updateJob(id, patch),
    onSuccess: (job) => {
      qc.setQueryData(jobKeys.detail(id), job);
      return qc.invalidateQueries({ queryKey: jobKeys.all });
    },
  });
}
