/** Query keys of quotes: `all` after any change; a job's list; one quote. */
export const quoteKeys = {
  all: ['quotes'] as const,
  forJob: (jobId: string) => [...quoteKeys.all, 'job', jobId] as const,
  detail: (id: string) => [...quoteKeys.all, 'detail', id] as const,
  public: (token: string) => ['public-quote', token] as const,
};
