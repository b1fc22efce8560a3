import { FormProvider } from 'react-hook-form';
import { customerBodySchema, type Customer } from '../../../../shared/api/customers';
import { Alert, Button, Card, CardTitle } from '../../../components/ui';
import { showServerErrors, useZodForm } from '../../../lib/forms';
import { useCreateCustomer } from '../api/create-customer';
import { useUpdateCustomer } from '../api/update-customer';
import { CustomerFields, customerValues, emptyCustomer } from './customer-fields';

/** Creates a customer, or edits the one given; checked with the API's own schema. */
export function CustomerForm({ customer, onDone }: { customer?: Customer; onDone: (c?: Customer) => void }) {
  const form = useZodForm(customerBodySchema, { defaultValues: customer ? customerValues(customer) : emptyCustomer() });
  const create = useCreateCustomer();
  const update = useUpdateCustomer();
  const mutation = customer ? update : create;

  const onSubmit = form.handleSubmit(async (body) => {
    try {
      onDone(customer ? await update.mutateAsync({ id: customer.id, body }) : await create.mutateAsync(body));
    } catch (err) {
      showServerErrors(err, form.setError);
    }
  });

  const formError = form.formState.errors.root?.server?.message;
  return (
    <Card className="mb-5 border-straw/60">
      <CardTitle>{customer ? `Edit ${customer.name}` : 'New customer'}</CardTitle>
      <FormProvider {...form}>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={customer ? 'Edit customer' : 'New customer'}>
          {formError && <Alert>{formError}</Alert>}
          <CustomerFields />
          <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
            <Button variant="secondary" onClick={() => onDone()}>
              Cancel
            </Button>
            <Button type="submit" busy={mutation.isPending}>
              {customer ? 'Save customer' : 'Add customer'}
            </Button>
          </div>
        </form>
      </FormProvider>
    </Card>
  );
}
