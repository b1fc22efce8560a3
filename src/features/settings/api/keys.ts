export const settingsKeys = {
  all: ['settings'] as const,
  company: () => [...settingsKeys.all, 'company'] as const,
  catalogue: (resource: string) => [...settingsKeys.all, 'catalogue', resource] as const,
};
