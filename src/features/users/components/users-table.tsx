import type { User } from '../../../../shared/api/users';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { Alert, Button, Select } from '../../../components/ui';
import { formErrorMessage } from '../../../lib/form-errors';
import { useUpdateUser } from '../api/update-user';

function Status({ user }: { user: User }) {
  if (!user.active) return <span className="rounded-full bg-paper-dark px-2 py-0.5 text-xs text-graphite-light">Deactivated</span>;
  if (!user.hasPassword) return <span className="rounded-full bg-straw-light px-2 py-0.5 text-xs">Invited</span>;
  return <span className="rounded-full bg-teal-light/60 px-2 py-0.5 text-xs text-teal-dark">Active</span>;
}

const row = 'grid grid-cols-[minmax(0,1fr)_auto] items-center gap-x-3 gap-y-2 px-4 py-3 sm:grid-cols-[minmax(0,1fr)_10rem_7rem_7.5rem]';

/**
 * The company's users: role changes and deactivation in place (not for your own account).
 * A ruled list rather than a table so that on a phone each person folds onto two lines.
 */
export function UsersTable({ users, currentUserId }: { users: User[]; currentUserId: string }) {
  const update = useUpdateUser();
  const pendingId = update.isPending ? update.variables?.id : undefined;
  return (
    <div className="flex flex-col gap-3">
      {update.isError && <Alert>{formErrorMessage(update.error)}</Alert>}
      <div className="overflow-hidden rounded-lg border border-paper-line bg-white/85 shadow-sm">
        <div aria-hidden className={`${row} hidden bg-paper-dark/70 py-2 text-xs font-semibold uppercase tracking-wide text-graphite-light sm:grid`}>
          <span>Name</span>
          <span>Role</span>
          <span>Status</span>
          <span />
        </div>
        <ul aria-label="Users" className="divide-y divide-paper-line">
          {users.map((u) => {
            const self = u.id === currentUserId;
            return (
              <li key={u.id} className={`${row} ${u.active ? '' : 'bg-paper/60'}`}>
                <div className="min-w-0">
                  <div className="truncate font-medium">
                    {u.name} {self && <span className="text-xs font-normal text-graphite-light">(you)</span>}
                  </div>
                  <div className="truncate text-xs text-graphite-light">{u.email}</div>
                </div>
                <div className="justify-self-end sm:order-none sm:justify-self-stretch">
                  <Status user={u} />
                </div>
                <Select
                  aria-label={`Role of ${u.name}`}
                  className="h-9 w-full sm:order-first sm:col-start-2 sm:row-start-1"
                  value={u.role}
                  disabled={self || pendingId === u.id}
                  onChange={(e) => update.mutate({ id: u.id, body: { role: e.target.value as Role } })}
                >
                  {ROLES.map((r) => (
                    <option key={r} value={r}>
                      {ROLE_LABELS[r]}
                    </option>
                  ))}
                </Select>
                <div className="justify-self-end">
                  {!self && (
                    <Button
                      size="sm"
                      variant={u.active ? 'danger-ghost' : 'secondary'}
                      busy={pendingId === u.id}
                      onClick={() => update.mutate({ id: u.id, body: { active: !u.active } })}
                    >
                      {u.active ? 'Deactivate' : 'Reactivate'}
                    </Button>
                  )}
                </div>
              </li>
            );
          })}
        </ul>
      </div>
    </div>
  );
}
