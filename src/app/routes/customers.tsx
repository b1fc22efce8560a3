import { useState } from 'react';
import type { Customer } from '../../../shared/api/customers';
import { can } from '../../../shared/auth/policies';
import { Button, EmptyState, ErrorState, Field, Input, LoadingState, PageHeader } from '../../components/ui';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useCustomers } from '../../features/customers/api/get-customers';
import { CustomerForm } from '../../features/customers/components/customer-form';
import { CustomersTable } from '../../features/customers/components/customers-table';
import { RequireAction } from '../require-auth';

type Editing = { kind: 'new' } | { kind: 'edit'; customer: Customer } | null;

export default function CustomersPage() {
  return (
    <RequireAction action="customers:read">
      <Customers />
    </RequireAction>
  );
}

// Separate so its queries run only for roles that may use the page.
function Customers() {
  const user = useCurrentUser();
  const customers = useCustomers();
  const [editing, setEditing] = useState<Editing>(null);
  const [q, setQ] = useState('');
  const canWrite = can(user, 'customers:write');

  return (
    <>
      <PageHeader
        title="Customers"
        subtitle="The people whose lofts you survey and insulate."
        actions={canWrite && !editing ? <Button onClick={() => setEditing({ kind: 'new' })}>New customer</Button> : null}
      />
      {editing && (
        <CustomerForm
          key={editing.kind === 'edit' ? editing.customer.id : 'new'}
          customer={editing.kind === 'edit' ? editing.customer : undefined}
          onDone={() => setEditing(null)}
        />
      )}
      {customers.isPending ? (
        <LoadingState label="Loading customers…" />
      ) : customers.isError ? (
        <ErrorState error={customers.error} onRetry={() => customers.refetch()} title="The customers could not be loaded" />
      ) : customers.data.length === 0 ? (
        <EmptyState title="No customers yet" action={canWrite && !editing ? <Button onClick={() => setEditing({ kind: 'new' })}>New customer</Button> : null}>
          Add a customer here, or while creating a job.
        </EmptyState>
      ) : (
        <>
          <Field label="Find a customer" className="mb-3 max-w-md">
            <Input type="search" value={q} onChange={(e) => setQ(e.target.value)} placeholder="Name, e-mail, phone or address" />
          </Field>
          <CustomersTable
            customers={customers.data}
            filter={q}
            noMatch={<EmptyState title="No customer matches">Nothing matches “{q}”.</EmptyState>}
            onEdit={
              canWrite
                ? (customer) => {
                    setEditing({ kind: 'edit', customer });
                    window.scrollTo?.({ top: 0 });
                  }
                : undefined
            }
          />
        </>
      )}
    </>
  );
}
