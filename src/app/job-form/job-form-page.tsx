import { FormProvider, useWatch } from 'react-hook-form';
import type { Customer } from '../../../shared/api/customers';
import type { Job } from '../../../shared/api/jobs';
import { can } from '../../../shared/auth/policies';
import { Alert, Button, ButtonLink, Card } from '../../components/ui';
import { addressValues } from '../../components/forms/address-fields';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useCreateCustomer } from '../../features/customers/api/create-customer';
import { useCustomers } from '../../features/customers/api/get-customers';
import { useCreateJob } from '../../features/jobs/api/create-job';
import { useUpdateJob } from '../../features/jobs/api/update-job';
import { JobFields } from '../../features/jobs/components/job-fields';
import { useInstallers } from '../../features/jobs/api/get-installers';
import { hasFieldErrors, showServerErrors, useZodForm } from '../../lib/forms';
import { CustomerChoice } from './customer-choice';
import { jobFormSchema, jobFormValues, newJobValues, type JobFormValues } from './job-form-schema';

/** Create a job (with a new or existing customer) or edit one; checked with the API's own schemas. */
export function JobFormPage({ job, onSaved }: { job?: Job; onSaved: (job: Job) => void }) {
  const user = useCurrentUser();
  const canAssign = can(user, 'jobs:assign');
  const customers = useCustomers();
  const installerOptions = useInstallers({ enabled: canAssign });
  const form = useZodForm((values: JobFormValues) => jobFormSchema(values, { canAssign }), { defaultValues: job ? jobFormValues(job) : newJobValues() });
  const { control, getValues, setValue, setError, formState } = form;
  const [mode, sameAddress] = useWatch({ control, name: ['mode', 'sameAddress'] });
  const createCustomer = useCreateCustomer();
  const createJob = useCreateJob();
  const updateJob = useUpdateJob(job?.id ?? '');
  const busy = createCustomer.isPending || createJob.isPending || updateJob.isPending;

  // Keep a deactivated installer who is still assigned visible, so saving does not silently unassign them.
  const installers = canAssign
    ? [
        ...(installerOptions.data ?? []),
        ...(job?.assignedInstaller && !installerOptions.data?.some((i) => i.id === job.assignedInstaller!.id) ? [job.assignedInstaller] : []),
      ]
    : null;
  const useCustomerAddress = mode === 'new' && sameAddress;

  function customerPicked(c: Customer) {
    const { line1, town } = getValues('propertyAddress');
    if (!line1 && !town) setValue('propertyAddress', addressValues(c.address));
  }

  const onSubmit = form.handleSubmit(async ({ customer, customerId, job: body }) => {
    let id = customerId;
    if (customer) {
      try {
        id = (await createCustomer.mutateAsync(customer)).id;
      } catch (err) {
        showServerErrors(err, setError, 'customer');
        return;
      }
      // If the job fails below, a retry must reuse this customer rather than create a second one
      // (and keep the property at its address).
      setValue('customerId', id);
      setValue('mode', 'existing');
      if (useCustomerAddress) setValue('propertyAddress', addressValues(customer.address));
    }
    try {
      const payload = { ...body, customerId: id! };
      onSaved(job ? await updateJob.mutateAsync(payload) : await createJob.mutateAsync(payload));
    } catch (err) {
      showServerErrors(err, setError);
    }
  });

  const formError = formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={job ? 'Edit job' : 'New job'}>
        {formError && <Alert>{formError}</Alert>}
        {hasFieldErrors(formState.errors) && !formError && <Alert>Some fields need attention.</Alert>}
        <Card>
          <CustomerChoice customers={customers.data ?? []} customersLoading={customers.isPending} onCustomerPicked={customerPicked} />
          {mode === 'new' && (
            <label className="mt-4 flex items-center gap-2 text-sm">
              <input type="checkbox" className="h-4 w-4 accent-teal-dark" {...form.register('sameAddress')} />
              The property is the customer's address
            </label>
          )}
        </Card>
        <Card>
          <JobFields installers={installers} showPropertyAddress={!useCustomerAddress} />
        </Card>
        <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <ButtonLink to={job ? `/jobs/${job.id}` : '/jobs'} variant="secondary">
            Cancel
          </ButtonLink>
          <Button type="submit" busy={busy}>
            {job ? 'Save changes' : 'Create job'}
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
