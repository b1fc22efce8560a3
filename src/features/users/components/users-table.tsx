import type { User } from '../../../../shared/api/users';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { Alert, Button, Select } from '../../../components/ui';
import { formErrorMessage } from '../../../lib/forms/server-errors';
import { useResendInvite } from '../api/resend-invite';
import { useUpdateUser } from '../api/update-user';

function Status({ user }: { user: User }) {
  if (!user.active) return <span className="rounded-full bg-paper-dark px-2 py-0.5 text-xs text-graphite-light">Deactivated</span>;
  if (!user.hasPassword) return <span className="rounded-full bg-straw-light px-2 py-0.5 text-xs">Invited</span>;
  return <span className="rounded-full bg-teal-light/60 px-2 py-0.5 text-xs text-teal-dark">Active</span>;
}

const row = 'flex flex-wrap items-center gap-x-3 gap-y-2 px-4 py-3 sm:grid sm:grid-cols-[minmax(0,1fr)_10rem_6.5rem_13.5rem]';

/**
 * The company's users: role changes and deactivation in place (not for your own account).
 * A ruled list rather than a table so that on a phone each person folds onto two lines.
 */
export function UsersTable({ users, currentUserId }: { users: User[]; currentUserId: string }) {
  const update = useUpdateUser();
  const resend = useResendInvite();
  const pendingId = update.isPending ? update.variables?.id : undefined;
  return (
    <div className="flex flex-col gap-3">
      {update.isError && <Alert>{formErrorMessage(update.error)}</Alert>}
      {resend.isError && <Alert>{formErrorMessage(resend.error)}</Alert>}
      {resend.isSuccess && <Alert tone="success">A new invitation is on its way to {resend.data.email}.</Alert>}
      <div className="overflow-hidden rounded-lg border border-paper-line bg-white/85 shadow-sm">
        <div aria-hidden className={`${row} !hidden bg-paper-dark/70 py-2 text-xs font-semibold uppercase tracking-wide text-graphite-light sm:!grid`}>
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
                <div className="min-w-0 flex-1 sm:col-start-1 sm:row-start-1">
                  <div className="truncate font-medium">
                    {u.name} {self && <span className="text-xs font-normal text-graphite-light">(you)</span>}
                  </div>
                  <div className="truncate text-xs text-graphite-light">{u.email}</div>
                </div>
                <div className="shrink-0 sm:col-start-3 sm:row-start-1">
                  <Status user={u} />
                </div>
                {/* On a phone the role and the buttons share the second line; on a desktop they are columns. */}
                <div className="flex w-full flex-wrap items-center gap-2 sm:contents">
                  <Select
                    aria-label={`Role of ${u.name}`}
                    className="h-9 min-w-[9rem] flex-1 sm:col-start-2 sm:row-start-1 sm:w-full"
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
                  <div className="ml-auto flex shrink-0 justify-end gap-1 sm:col-start-4 sm:row-start-1">
                    {!self && u.active && !u.hasPassword && (
                      <Button size="sm" variant="ghost" busy={resend.isPending && resend.variables === u.id} onClick={() => resend.mutate(u.id)}>
                        Resend invite
                      </Button>
                    )}
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
                </div>
              </li>
            );
          })}
        </ul>
      </div>
    </div>
  );
}
