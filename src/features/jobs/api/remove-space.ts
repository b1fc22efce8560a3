import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { jobKeys } from './keys';

/** Removes a space (kept on the server with its revisions) and, for Undo, brings it back; the job is fetched again after each. */
export function useRemoveSpace(jobId: string) {
  const qc = useQueryClient();
  const refresh = () => qc.invalidateQueries({ queryKey: jobKeys.detail(jobId) });
  return {
    remove: useMutation({ mutationFn: (spaceId: string) => api.delete(`/api/spaces/${encodeURIComponent(spaceId)}`), onSuccess: refresh }),
    restore: useMutation({ mutationFn: (spaceId: string) => api.post(`/api/spaces/${encodeURIComponent(spaceId)}/restore`), onSuccess: refresh }),
  };
}
