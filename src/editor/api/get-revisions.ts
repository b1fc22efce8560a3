import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RevisionSummary } from '../../../shared/api/spaces';
import { api } from '../../lib/api-client';
import { planKeys } from './get-plan';

export function getRevisions(spaceId: string, signal?: AbortSignal) {
  return api.get<{ items: RevisionSummary[] }>(`/api/spaces/${spaceId}/revisions`, undefined, signal);
}

export function revisionsQueryOptions(spaceId: string) {
  return queryOptions({ queryKey: planKeys.revisions(spaceId), queryFn: ({ signal }) => getRevisions(spaceId, signal) });
}

export function useRevisions(spaceId: string, enabled: boolean) {
  return useQuery({ ...revisionsQueryOptions(spaceId), enabled });
}
