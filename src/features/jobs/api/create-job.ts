import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Job, JobBody } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

export async function createJob(body: JobBody): Promise<Job> {
  return (await api.post<{ job: Job }>('/api/jobs', body)).job;
}

export function useCreateJob() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createJob,
    onSuccess: (job) => {
      qc.setQueryData(jobKeys.detail(job.id), job);
      return qc.invalidateQueries({ queryKey: jobKeys.lists() });
    },
  });
}
