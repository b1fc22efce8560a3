export const scheduleKeys = {
  all: ['schedule'] as const,
  week: (weekStart: string) => [...scheduleKeys.all, 'week', weekStart] as const,
  settings: () => [...scheduleKeys.all, 'settings'] as const,
};
