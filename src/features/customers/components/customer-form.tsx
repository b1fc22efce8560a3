import { useState, type FormEvent } from 'react';
import { customerBodySchema, type Customer } from '../../../../shared/api/customers';
import { Alert, Button, Card, CardTitle } from '../../../components/ui';
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '../../../lib/form-errors';
import { useCreateCustomer } from '../api/create-customer';
import { useUpdateCustomer } from '../api/update-customer';
import { CustomerFields, customerValues, emptyCustomer, type CustomerValues } from './customer-fields';

/** Creates a customer, or edits the one given. */
export function CustomerForm({ customer, onDone }: { customer?: Customer; onDone: (c?: Customer) => void }) {
  const [values, setValues] = useState<CustomerValues>(() => (customer ? customerValues(customer) : emptyCustomer()));
  const [errors, setErrors] = useState<FieldErrors>({});
  const create = useCreateCustomer();
  const update = useUpdateCustomer();
  const mutation = customer ? update : create;

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const parsed = customerBodySchema.safeParse(values);
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    const onError = (err: unknown) => setErrors(serverFieldErrors(err));
    if (customer) update.mutate({ id: customer.id, body: parsed.data }, { onSuccess: onDone, onError });
    else create.mutate(parsed.data, { onSuccess: onDone, onError });
  }

  const formError = mutation.isError && !Object.keys(errors).length ? formErrorMessage(mutation.error) : null;
  return (
    <Card className="mb-5 border-straw/60">
      <CardTitle>{customer ? `Edit ${customer.name}` : 'New customer'}</CardTitle>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={customer ? 'Edit customer' : 'New customer'}>
        {formError && <Alert>{formError}</Alert>}
        <CustomerFields value={values} onChange={setValues} errors={errors} />
        <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={() => onDone()}>
            Cancel
          </Button>
          <Button type="submit" busy={mutation.isPending}>
            {customer ? 'Save customer' : 'Add customer'}
          </Button>
        </div>
      </form>
    </Card>
  );
}
