import type { Role } from './roles';

/** The actions the API and the UI gate on. */
export type Action =
  | 'users:manage'
  | 'customers:read'
  | 'customers:write'
  | 'jobs:read-all'
  | 'jobs:write'
  | 'jobs:assign'
  | 'plans:write'
  | 'prices:read'
  | 'settings:manage'
  | 'quotes:draft'
  | 'quotes:manage'
  | 'jobsheet:work'
  | 'outbox:read';

const GRANTS: Record<Role, ReadonlySet<Action>> = {
  office: new Set<Action>([
    'users:manage',
    'customers:read',
    'customers:write',
    'jobs:read-all',
    'jobs:write',
    'jobs:assign',
    'plans:write',
    'prices:read',
    'settings:manage',
    'quotes:draft',
    'quotes:manage',
    'outbox:read',
  ]),
  estimator: new Set<Action>(['customers:read', 'customers:write', 'jobs:read-all', 'jobs:write', 'plans:write', 'prices:read', 'quotes:draft']),
  // Installers see only jobs assigned to them and never prices.
  installer: new Set<Action>(['jobsheet:work']),
};

/** Whether a user with this role may perform the action. Used by the server's guards and the UI alike. */
export function can(user: { role: Role } | null | undefined, action: Action): boolean {
  return !!user && GRANTS[user.role].has(action);
}
