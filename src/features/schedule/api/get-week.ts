import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ScheduleWeek } from '../../../../shared/api/schedule';
import { api } from '../../../lib/api-client';
import { scheduleKeys } from './keys';

export function getWeek(weekStart: string, signal?: AbortSignal): Promise<ScheduleWeek> {
  return api.get<ScheduleWeek>('/api/schedule', { weekStart }, signal);
}

export const weekQueryOptions = (weekStart: string) =>
  queryOptions({ queryKey: scheduleKeys.week(weekStart), queryFn: ({ signal }) => getWeek(weekStart, signal), placeholderData: keepPreviousData });

export function useWeek(weekStart: string) {
  return useQuery(weekQueryOptions(weekStart));
}
