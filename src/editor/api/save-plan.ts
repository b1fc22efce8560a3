import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Plan } from '../../../shared/plan/plan-schema';
import { api } from '../../lib/api-client';
import { adoptSavedRevision } from './plan-cache';

export type SaveResult = { plan: Plan; revision: number; createdAt: string; netAreaM2: number };

export function savePlan(spaceId: string, body: { plan: Plan; baseRevision: number; note?: string }) {
  return api.put<SaveResult>(`/api/spaces/${spaceId}/plan`, body);
}

/** PUT the plan as the next revision; a stale base answers 409 (ApiError.status). */
export function useSavePlan(spaceId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: { plan: Plan; baseRevision: number; note?: string }) => savePlan(spaceId, body),
    onSuccess: (res) => adoptSavedRevision(qc, spaceId, res),
  });
}
