import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SpaceBody } from '../../../../shared/api/spaces';
import type { SpaceSummary } from '../../../../shared/api/jobs';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

export async function createSpace(jobId: string, body: SpaceBody): Promise<SpaceSummary> {
  return (await api.post<{ space: SpaceSummary }>(`/api/jobs/${encodeURIComponent(jobId)}/spaces`, body)).space;
}

/** Adds a loft space to a job; the job is fetched again so its list of spaces is current. */
export function useCreateSpace(jobId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SpaceBody) => createSpace(jobId, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: jobKeys.detail(jobId) }),
  });
}
