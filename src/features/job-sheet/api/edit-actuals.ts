import { useMutation } from '@tanstack/react-query';
import type { EditActualsBody, StoredActuals } from '../../../../shared/api/actuals';
import { api } from '../../../lib/api-client';

/**
 * Corrects what was used on a finished job, naming the version it was read at (a 409 means someone
 * saved a correction since). Online only: a correction queued offline could only meet a newer version.
 */
export function useEditActuals(jobId: string, onSaved: () => unknown) {
  return useMutation({
    // Fail at once with no signal (rather than wait unseen in memory), so the person knows it was not saved.
    networkMode: 'always',
    mutationFn: (body: EditActualsBody) => api.put<{ actuals: StoredActuals }>(`/api/jobs/${encodeURIComponent(jobId)}/actuals`, body),
    onSettled: onSaved,
  });
}
