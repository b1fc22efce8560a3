/**
 * The three signed-in roles of a company (customers have no account). Plain data with no zod, so
 * the app's first download (the shell and its navigation) does not carry the validation library;
 * the role's schema is in shared/api/common.ts.
 */
export const ROLES = ['office', 'estimator', 'installer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  office: 'Office',
  estimator: 'Estimator',
  installer: 'Installer',
};
