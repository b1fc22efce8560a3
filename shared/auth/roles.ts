import { z } from 'zod';

/** The three signed-in roles of a company Customers have no account. */
export const ROLES = ['office', 'estimator', 'installer'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const ROLE_LABELS: Record<Role, string> = {
  office: 'Office',
  estimator: 'Estimator',
  installer: 'Installer',
};
