import { Button, EmptyState, ErrorState, LoadingState, PageHeader } from '../../components/ui';
import { useOutbox } from '../../features/outbox/api/get-outbox';
import { MailStatusList } from '../../features/outbox/components/mail-status-list';
import { OutboxList } from '../../features/outbox/components/outbox-list';
import { isApiError } from '../../lib/api-client';
import { RequireAction } from '../require-auth';

/** Development only: every e-mail the app sent, caught by the local SMTP stand-in. */
export default function OutboxPage() {
  return (
    <RequireAction action="outbox:read">
      <Outbox />
    </RequireAction>
  );
}

// Separate so the query runs only for roles that may read the outbox.
function Outbox() {
  const outbox = useOutbox();
  return (
    <>
      <PageHeader
        title="Outbox"
        subtitle="In development no e-mail leaves this machine: invitations, password resets and quotes land here instead."
        actions={
          <Button variant="secondary" onClick={() => outbox.refetch()} busy={outbox.isFetching && !outbox.isPending}>
            Refresh
          </Button>
        }
      />
      <MailStatusList />
      {outbox.isPending ? (
        <LoadingState label="Loading messages…" />
      ) : outbox.isError ? (
        isApiError(outbox.error) && outbox.error.status === 404 ? (
          <EmptyState title="No outbox on this server">The outbox exists only in development; in production e-mail goes to the real mail server.</EmptyState>
        ) : (
          <ErrorState error={outbox.error} onRetry={() => outbox.refetch()} />
        )
      ) : !outbox.data.enabled ? (
        <EmptyState title="E-mail goes to a real mail server">This server sends through an SMTP relay, so there is nothing to show here.</EmptyState>
      ) : outbox.data.messages.length === 0 ? (
        <EmptyState title="No messages yet">Invite a colleague or request a password reset and the e-mail appears here.</EmptyState>
      ) : (
        <OutboxList messages={outbox.data.messages} />
      )}
    </>
  );
}
