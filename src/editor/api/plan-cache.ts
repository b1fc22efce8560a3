import type { QueryClient } from '@tanstack/react-query';
import { jobKeys } from '../../features/jobs/api/keys';
import { planKeys, type PlanResponse } from './get-plan';
import type { Plan } from '../../../shared/plan/plan-schema';

/**
 * After a save or a restore: the cached plan becomes the revision just stored (so reopening the
 * plan in the same tab starts from it and its next save raises no conflict against one's own),
 * and the revision list and the job (its spaces' latest revision and time) are fetched again.
 */
export function adoptSavedRevision(qc: QueryClient, spaceId: string, res: { plan: Plan; revision: number; createdAt: string }): void {
  const cached = qc.setQueryData<PlanResponse>(planKeys.plan(spaceId), (old) =>
    old ? { ...old, plan: res.plan, revision: res.revision, savedAt: res.createdAt, takeoffStored: true } : old,
  );
  // Not awaited: the save is done; these refetch in the background (only when on screen).
  void qc.invalidateQueries({ queryKey: planKeys.revisions(spaceId) });
  void qc.invalidateQueries({ queryKey: cached ? jobKeys.detail(cached.space.jobId) : jobKeys.details() });
  void qc.invalidateQueries({ queryKey: jobKeys.lists() });
}
