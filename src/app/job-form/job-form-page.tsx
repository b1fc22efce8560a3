import { useState, type FormEvent } from 'react';
import { customerBodySchema } from '../../../shared/api/customers';
import { jobBodySchema, type Job } from '../../../shared/api/jobs';
import { can } from '../../../shared/auth/policies';
import { Alert, Button, ButtonLink, Card } from '../../components/ui';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useCreateCustomer } from '../../features/customers/api/create-customer';
import { useCustomers } from '../../features/customers/api/get-customers';
import { emptyCustomer, type CustomerValues } from '../../features/customers/components/customer-fields';
import { useCreateJob } from '../../features/jobs/api/create-job';
import { useUpdateJob } from '../../features/jobs/api/update-job';
import { emptyJob, jobBodyFrom, JobFields, jobValues, type JobValues } from '../../features/jobs/components/job-fields';
import { useInstallers } from '../../features/jobs/api/get-installers';
import { addressValues } from '../../components/forms/address-fields';
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '../../lib/form-errors';
import { CustomerChoice, type CustomerMode } from './customer-choice';

// Stands in for the id of a customer not yet created, so the job schema can check everything else first.
const PENDING_CUSTOMER_ID = '00000000-0000-4000-8000-000000000000';

function prefixed(errors: FieldErrors, prefix: string): FieldErrors {
  return Object.fromEntries(Object.entries(errors).map(([k, v]) => [`${prefix}.${k}`, v]));
}

/** Create a job (with a new or existing customer) or edit one; checked with the API's own schemas. */
export function JobFormPage({ job, onSaved }: { job?: Job; onSaved: (job: Job) => void }) {
  const user = useCurrentUser();
  const canAssign = can(user, 'jobs:assign');
  const customers = useCustomers();
  const installerOptions = useInstallers({ enabled: canAssign });
  const [mode, setMode] = useState<CustomerMode>(job ? 'existing' : 'new');
  const [customerId, setCustomerId] = useState(job?.customer.id ?? '');
  const [newCustomer, setNewCustomer] = useState<CustomerValues>(emptyCustomer);
  const [sameAddress, setSameAddress] = useState(!job);
  const [values, setValues] = useState<JobValues>(() => (job ? jobValues(job) : emptyJob()));
  const [errors, setErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
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

  function pickCustomer(id: string) {
    setCustomerId(id);
    const c = customers.data?.find((x) => x.id === id);
    if (c && !values.propertyAddress.line1 && !values.propertyAddress.town) setValues({ ...values, propertyAddress: addressValues(c.address) });
  }

  async function onSubmit(e: FormEvent) {
    e.preventDefault();
    setFormError(null);
    const jobInput = { ...values, propertyAddress: useCustomerAddress ? newCustomer.address : values.propertyAddress };
    let next: FieldErrors = {};
    const customerParsed = mode === 'new' ? customerBodySchema.safeParse(newCustomer) : null;
    if (customerParsed && !customerParsed.success) next = prefixed(zodFieldErrors(customerParsed.error), 'customer');
    const body = jobBodyFrom(jobInput, mode === 'new' ? PENDING_CUSTOMER_ID : customerId, { canAssign });
    const jobParsed = jobBodySchema.safeParse(body);
    if (!jobParsed.success) {
      const jobErrors = zodFieldErrors(jobParsed.error);
      // With the customer's address reused, its errors are already shown on the customer fields.
      if (useCustomerAddress) for (const k of Object.keys(jobErrors)) if (k.startsWith('propertyAddress.')) delete jobErrors[k];
      next = { ...next, ...jobErrors };
    }
    setErrors(next);
    if (Object.keys(next).length || !jobParsed.success) return;

    let id = customerId;
    if (mode === 'new' && customerParsed?.success) {
      try {
        const created = await createCustomer.mutateAsync(customerParsed.data);
        id = created.id;
        // If the job fails below, a retry must reuse this customer rather than create a second one.
        setCustomerId(id);
        setMode('existing');
      } catch (err) {
        setErrors(prefixed(serverFieldErrors(err), 'customer'));
        setFormError(formErrorMessage(err));
        return;
      }
    }
    try {
      const payload = { ...jobParsed.data, customerId: id };
      const saved = job ? await updateJob.mutateAsync(payload) : await createJob.mutateAsync(payload);
      onSaved(saved);
    } catch (err) {
      setErrors(serverFieldErrors(err));
      setFormError(formErrorMessage(err));
    }
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={job ? 'Edit job' : 'New job'}>
      {formError && <Alert>{formError}</Alert>}
      {Object.keys(errors).length > 0 && !formError && <Alert>Some fields need attention.</Alert>}
      <Card>
        <CustomerChoice
          mode={mode}
          onModeChange={setMode}
          customers={customers.data ?? []}
          customersLoading={customers.isPending}
          customerId={customerId}
          onCustomerId={pickCustomer}
          newCustomer={newCustomer}
          onNewCustomer={setNewCustomer}
          errors={errors}
        />
        {mode === 'new' && (
          <label className="mt-4 flex items-center gap-2 text-sm">
            <input type="checkbox" className="h-4 w-4 accent-teal-dark" checked={sameAddress} onChange={(e) => setSameAddress(e.target.checked)} />
            The property is the customer's address
          </label>
        )}
      </Card>
      <Card>
        <JobFields value={values} onChange={setValues} errors={errors} installers={installers} showPropertyAddress={!useCustomerAddress} />
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
  );
}
