import type { User } from '../../../../shared/api/users';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { Alert, Button, Select, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { formErrorMessage } from '../../../lib/form-errors';
import { useUpdateUser } from '../api/update-user';

function Status({ user }: { user: User }) {
  if (!user.active) return <span className="rounded-full bg-paper-dark px-2 py-0.5 text-xs text-graphite-light">Deactivated</span>;
  if (!user.hasPassword) return <span className="rounded-full bg-straw-light px-2 py-0.5 text-xs">Invited</span>;
  return <span className="rounded-full bg-teal-light/60 px-2 py-0.5 text-xs text-teal-dark">Active</span>;
}

/** The company's users: role changes and deactivation in place (not for your own account). */
export function UsersTable({ users, currentUserId }: { users: User[]; currentUserId: string }) {
  const update = useUpdateUser();
  const pendingId = update.isPending ? update.variables?.id : undefined;
  return (
    <div className="flex flex-col gap-3">
      {update.isError && <Alert>{formErrorMessage(update.error)}</Alert>}
      <Table aria-label="Users">
        <THead>
          <tr>
            <Th>Name</Th>
            <Th>Role</Th>
            <Th>Status</Th>
            <Th className="w-px"><span className="sr-only">Actions</span></Th>
          </tr>
        </THead>
        <TBody>
          {users.map((u) => {
            const self = u.id === currentUserId;
            return (
              <Tr key={u.id} className={u.active ? undefined : 'opacity-70'}>
                <Td>
                  <div className="font-medium">
                    {u.name} {self && <span className="text-xs font-normal text-graphite-light">(you)</span>}
                  </div>
                  <div className="break-all text-xs text-graphite-light">{u.email}</div>
                </Td>
                <Td>
                  <Select
                    aria-label={`Role of ${u.name}`}
                    className="h-9 w-36"
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
                </Td>
                <Td>
                  <Status user={u} />
                </Td>
                <Td>
                  {!self && (
                    <Button
                      size="sm"
                      variant={u.active ? 'ghost' : 'secondary'}
                      className={u.active ? 'text-brick-dark hover:bg-brick-light/30' : undefined}
                      busy={pendingId === u.id}
                      onClick={() => update.mutate({ id: u.id, body: { active: !u.active } })}
                    >
                      {u.active ? 'Deactivate' : 'Reactivate'}
                    </Button>
                  )}
                </Td>
              </Tr>
            );
          })}
        </TBody>
      </Table>
    </div>
  );
}
