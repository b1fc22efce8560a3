import { useState } from 'react';
import { Link } from 'react-router-dom';
import { can } from '../../../shared/auth/policies';
import { Alert, Button, EmptyState, ErrorState, Field, Input, LoadingState, PageHeader } from '../../components/ui';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useUsers } from '../../features/users/api/get-users';
import { InviteUserForm } from '../../features/users/components/invite-user-form';
import { UsersTable } from '../../features/users/components/users-table';
import { RequireAction } from '../require-auth';

export default function UsersPage() {
  return (
    <RequireAction action="users:manage">
      <Users />
    </RequireAction>
  );
}

// Separate so its queries run only for roles that may use the page.
function Users() {
  const me = useCurrentUser();
  const users = useUsers();
  const [inviting, setInviting] = useState(false);
  const [invited, setInvited] = useState<string | null>(null);
  const [q, setQ] = useState('');
  // The first order, before a header is chosen: active people first, by role, then name.
  const order = { office: 0, estimator: 1, installer: 2 } as const;
  const sorted = [...(users.data ?? [])].sort((a, b) => Number(b.active) - Number(a.active) || order[a.role] - order[b.role] || a.name.localeCompare(b.name));

  return (
    <>
      <PageHeader
        title="Users"
        subtitle="Everyone in your company who signs in to Quiltline, and what their role lets them do."
        actions={
          !inviting ? (
            <Button
              onClick={() => {
                setInviting(true);
                setInvited(null);
              }}
            >
              Invite a colleague
            </Button>
          ) : null
        }
      />
      {inviting && (
        <InviteUserForm
          onDone={(email) => {
            setInviting(false);
            if (email) setInvited(email);
          }}
        />
      )}
      {invited && (
        <div className="mb-4">
          <Alert tone="success">
            Invitation sent to <strong>{invited}</strong>. The link in it lets them choose a password.
            {can(me, 'outbox:read') && (
              <>
                {' '}
                In development the message is in the{' '}
                <Link to="/outbox" className="underline">
                  Outbox
                </Link>
                .
              </>
            )}
          </Alert>
        </div>
      )}
      {users.isPending ? (
        <LoadingState label="Loading users…" />
      ) : users.isError ? (
        <ErrorState error={users.error} onRetry={() => users.refetch()} title="The users could not be loaded" />
      ) : sorted.length === 0 ? (
        <EmptyState title="No users" />
      ) : (
        <>
          <Field label="Find a user" className="mb-3 max-w-md">
            <Input type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Name, e-mail, role or status" />
          </Field>
          <UsersTable users={sorted} currentUserId={me.id} filter={q} />
        </>
      )}
    </>
  );
}
