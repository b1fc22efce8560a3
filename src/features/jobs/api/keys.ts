import type { JobListQuery } from '../../../../shared/api/jobs';

/** Query keys of jobs: invalidate `all` after any change to a job, its customer or its spaces. */
export const jobKeys = {
  all: ['jobs'] as const,
  lists: () => [...jobKeys.all, 'list'] as const,
  list: (query: JobListQuery) => [...jobKeys.lists(), query] as const,
  details: () => [...jobKeys.all, 'detail'] as const,
  detail: (id: string) => [...jobKeys.details(), id] as const,
};
