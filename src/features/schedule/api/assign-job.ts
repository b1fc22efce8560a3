import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AssignBody, AssignResult } from '../../../../shared/api/schedule';
import { api } from '../../../lib/api-client';
import { scheduleKeys } from './keys';

export function assignJob(body: AssignBody): Promise<AssignResult> {
  return api.post<AssignResult>('/api/schedule/assign', body);
}

export function useAssignJob() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: assignJob,
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: scheduleKeys.all }), qc.invalidateQueries({ queryKey: ['jobs'] })]),
  });
}
