import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../lib/api-client';
import { adoptSavedRevision } from './plan-cache';
import type { SaveResult } from './save-plan';

export function restoreRevision(spaceId: string, revision: number, baseRevision: number) {
  return api.post<SaveResult>(`/api/spaces/${spaceId}/revisions/${revision}/restore`, { baseRevision });
}

/** Saves an old revision as the newest (nothing is overwritten). */
export function useRestoreRevision(spaceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ revision, baseRevision }: { revision: number; baseRevision: number }) => restoreRevision(spaceId, revision, baseRevision),
    onSuccess: (res) => adoptSavedRevision(qc, spaceId, res),
  });
}
