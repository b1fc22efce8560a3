import { useMutation, useQueryClient } from '@tanstack/react-query';
import { IDEMPOTENCY_HEADER, type FinishBody } from '../../../../shared/api/job-sheet';
import { apiRequest, isApiError } from '../../../lib/api-client';
import { enqueue } from '../offline/outbox';
import { sheetKeys } from './keys';

type Finished = { stage: string; queued?: boolean };

/**
 * Marks the job installed with its actuals. Sent at once with the form's Idempotency-Key; with no
 * signal (or a server not answering) it goes into the outbox under that same key, so however
 * often it is resent the server records it once.
 */
export async function finishJob(jobId: string, body: FinishBody, key: string): Promise<Finished> {
  const url = `/api/jobs/${encodeURIComponent(jobId)}/finish`;
  try {
    return await apiRequest<Finished>(url, { method: 'POST', body, headers: { [IDEMPOTENCY_HEADER]: key } });
  } catch (e) {
    if (!isApiError(e) || (e.status !== 0 && e.status < 500)) throw e;
    await enqueue({ jobId, kind: 'finish', url, body: body as Record<string, unknown>, key });
    return { stage: 'scheduled', queued: true };
  }
}

export function useFinishJob(jobId: string, key: string) {
  const qc = useQueryClient();
  return useMutation({
    // Run even with no signal: finishJob puts it in the outbox then. TanStack's default ('online')
    // would hold the mutation in memory until signal came back, lost if the app is closed meanwhile.
    networkMode: 'always',
    mutationFn: (body: FinishBody) => finishJob(jobId, body, key),
    onSuccess: (out) => (out.queued ? undefined : qc.invalidateQueries({ queryKey: sheetKeys.all })),
  });
}
