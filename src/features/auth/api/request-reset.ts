import { useMutation } from '@tanstack/react-query';
import type { RequestResetBody } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';

export function requestReset(body: RequestResetBody): Promise<unknown> {
  return api.post<unknown>('/api/auth/request-reset', body);
}

export function useRequestReset() {
  return useMutation({ mutationFn: requestReset });
}
