import { useMutation } from '@tanstack/react-query';
import type { SetPasswordBody } from '../../../../shared/api/auth';
import { api } from '../../../lib/api-client';

export function setPassword(body: SetPasswordBody): Promise<unknown> {
  return api.post<unknown>('/api/auth/set-password', body);
}

export function useSetPassword() {
  return useMutation({ mutationFn: setPassword });
}
