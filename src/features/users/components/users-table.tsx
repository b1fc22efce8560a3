import { createColumnHelper, type Row } from '@tanstack/react-table';
import type { User } from '../../../../shared/api/users';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { DataTable } from '../../../components/data-table/data-table';
import { Alert, Button, EmptyState, Select } from '../../../components/ui';
import { formErrorMessage } from '../../../lib/forms/server-errors';
import { useResendInvite } from '../api/resend-invite';
import { useUpdateUser } from '../api/update-user';

const STATUS = ['Active', 'Invited', 'Deactivated'] as const;
const statusOf = (u: User) => (!u.active ? 'Deactivated' : !u.hasPassword ? 'Invited' : 'Active');

function Status({ user }: { user: User }) {
  const s = statusOf(user);
  if (s === 'Deactivated') return <span className="rounded-full bg-paper-dark px-2 py-0.5 text-xs text-graphite-light">Deactivated</span>;
  if (s === 'Invited') return <span className="rounded-full bg-straw-light px-2 py-0.5 text-xs">Invited</span>;
  return <span className="rounded-full bg-teal-light/60 px-2 py-0.5 text-xs text-teal-dark">Active</span>;
}

const col = createColumnHelper<User>();
const rank =
  <T,>(list: readonly T[]) =>
  (a: Row<User>, b: Row<User>, id: string) =>
    list.indexOf(a.getValue(id)) - list.indexOf(b.getValue(id));

type Props = { users: User[]; currentUserId: string; filter?: string };

/**
 * The company's users, sortable by name, role and status and filtered by the page's search: role
 * changes, resending an invitation and deactivation in place (not for your own account). On a
 * phone the status folds under the name and the buttons stack under the role.
 */
export function UsersTable({ users, currentUserId, filter }: Props) {
  const update = useUpdateUser();
  const resend = useResendInvite();
  const pendingId = update.isPending ? update.variables?.id : undefined;
  const columns = [
    col.accessor('name', {
      header: 'Name',
      sortingFn: (a, b) => a.original.name.localeCompare(b.original.name),
      meta: { className: 'max-w-[13rem] sm:max-w-none', searchText: (u) => `${u.name} ${u.email}` },
      cell: (c) => {
        const u = c.row.original;
        return (
          <>
            <div className="truncate font-medium">
              {u.name} {u.id === currentUserId && <span className="text-xs font-normal text-graphite-light">(you)</span>}
            </div>
            <div className="truncate text-xs text-graphite-light">{u.email}</div>
            <div className="mt-1 sm:hidden">
              <Status user={u} />
            </div>
          </>
        );
      },
    }),
    col.accessor(statusOf, {
      id: 'status',
      header: 'Status',
      sortingFn: rank(STATUS),
      meta: { className: 'hidden w-32 sm:table-cell' },
      cell: (c) => <Status user={c.row.original} />,
    }),
    // The role and the buttons share a cell so that on a phone they stack beside the name.
    col.accessor('role', {
      header: 'Role',
      sortingFn: rank(ROLES),
      meta: { className: 'w-px sm:w-auto', searchText: (u) => ROLE_LABELS[u.role] },
      cell: (c) => {
        const u = c.row.original;
        const self = u.id === currentUserId;
        return (
          <div className="flex flex-col items-end gap-1 sm:flex-row sm:items-center">
            <Select
              aria-label={`Role of ${u.name}`}
              className="h-9 w-32 sm:w-40"
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
            {!self && (
              <div className="flex flex-col items-end gap-1 sm:ml-auto sm:flex-row">
                {u.active && !u.hasPassword && (
                  <Button
                    size="sm"
                    variant="ghost"
                    aria-label={`Resend invite to ${u.name}`}
                    busy={resend.isPending && resend.variables === u.id}
                    onClick={() => resend.mutate(u.id)}
                  >
                    Resend invite
                  </Button>
                )}
                <Button
                  size="sm"
                  variant={u.active ? 'danger-ghost' : 'secondary'}
                  aria-label={`${u.active ? 'Deactivate' : 'Reactivate'} ${u.name}`}
                  busy={pendingId === u.id}
                  onClick={() => update.mutate({ id: u.id, body: { active: !u.active } })}
                >
                  {u.active ? 'Deactivate' : 'Reactivate'}
                </Button>
              </div>
            )}
          </div>
        );
      },
    }),
  ];
  return (
    <div className="flex flex-col gap-3">
      {update.isError && <Alert>{formErrorMessage(update.error)}</Alert>}
      {resend.isError && <Alert>{formErrorMessage(resend.error)}</Alert>}
      {resend.isSuccess && <Alert tone="success">A new invitation is on its way to {resend.data.email}.</Alert>}
      <DataTable
        label="Users"
        data={users}
        columns={columns as never}
        rowId={(u) => u.id}
        filter={filter}
        pageSize={25}
        rowClassName={(u) => (u.active ? undefined : 'bg-paper/60')}
        noMatch={<EmptyState title="No user matches">Nothing matches “{filter}”.</EmptyState>}
      />
    </div>
  );
}
