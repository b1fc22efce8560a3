/** Query keys of the installer's views; invalidate `all` after anything is sent. */
export const sheetKeys = {
  all: ['job-sheet'] as const,
  myJobs: () => [...sheetKeys.all, 'my-jobs'] as const,
  sheet: (jobId: string) => [...sheetKeys.all, 'sheet', jobId] as const,
};

/** The sheet's data URL; the service worker keeps it for offline use. */
export const sheetUrl = (jobId: string) => `/api/jobs/${encodeURIComponent(jobId)}/job-sheet`;
