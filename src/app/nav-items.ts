import { can } from '../../shared/auth/policies';
import type { Role } from '../../shared/auth/roles';

export type NavItem = { to: string; label: string };

/**
 * The main navigation for a signed-in user, from the same policies the server enforces.
 * `outbox` says whether the server runs the development outbox (it is not mounted in production).
 */
export function navItemsFor(user: { role: Role } | null | undefined, opts: { outbox?: boolean } = {}): NavItem[] {
  if (!user) return [];
  const items: NavItem[] = [];
  if (can(user, 'jobs:read-all')) items.push({ to: '/jobs', label: 'Jobs' });
  else if (can(user, 'jobsheet:work')) items.push({ to: '/my-jobs', label: 'My jobs' });
  if (can(user, 'jobs:read-all')) items.push({ to: '/schedule', label: 'Schedule' });
  if (can(user, 'customers:read')) items.push({ to: '/customers', label: 'Customers' });
  if (can(user, 'quotes:manage')) items.push({ to: '/invoices', label: 'Invoices' });
  if (can(user, 'reports:read')) items.push({ to: '/reports/estimate-vs-actual', label: 'Report' });
  if (can(user, 'users:manage')) items.push({ to: '/users', label: 'Users' });
  if (can(user, 'settings:manage')) items.push({ to: '/settings', label: 'Settings' });
  if (can(user, 'outbox:read') && opts.outbox !== false) items.push({ to: '/outbox', label: 'Outbox' });
  return items;
}

/** Where "/" sends a user: the installer's own list, everyone else the jobs list. */
export function homePathFor(user: { role: Role }): string {
  return can(user, 'jobs:read-all') ? '/jobs' : '/my-jobs';
}
