import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Plan } from '../../../shared/plan/plan-schema';
import type { Takeoff, TakeoffProduct, TakeoffSettings } from '../../../shared/takeoff/compute-takeoff';
import { api } from '../../lib/api-client';

export type PlanResponse = {
  plan: Plan;
  revision: number;
  savedAt: string | null;
  space: { id: string; name: string; jobId: string; jobReference: string };
  canWrite: boolean;
  /** Whether this revision has its takeoff stored; Save stays available until it has. */
  takeoffStored: boolean;
  /** For read-only viewers, the takeoff artefact stored with this revision (prices zeroed for viewers without them); writers compute it live. */
  takeoff: Takeoff | null;
  /** The company's catalogue and settings: the editor's live takeoff uses the same inputs as the server. */
  takeoffInputs: { products: TakeoffProduct[]; settings: Partial<TakeoffSettings> };
};

export const planKeys = {
  plan: (spaceId: string) => ['spaces', spaceId, 'plan'] as const,
  revisions: (spaceId: string) => ['spaces', spaceId, 'revisions'] as const,
};

export function getPlan(spaceId: string, signal?: AbortSignal) {
  return api.get<PlanResponse>(`/api/spaces/${spaceId}/plan`, undefined, signal);
}

export function planQueryOptions(spaceId: string) {
  // The editor store owns the live plan once loaded: never refetch it behind the estimator's back.
  return queryOptions({
    queryKey: planKeys.plan(spaceId),
    queryFn: ({ signal }) => getPlan(spaceId, signal),
    staleTime: Infinity,
    refetchOnWindowFocus: false,
    refetchOnReconnect: false,
  });
}

export function usePlan(spaceId: string) {
  return useQuery(planQueryOptions(spaceId));
}
