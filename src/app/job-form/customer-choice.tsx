import { useFormContext, useWatch } from 'react-hook-form';
import type { Customer } from '../../../shared/api/customers';
import { formatAddress } from '../../components/ui';
import { CustomerFields } from '../../features/customers/components/customer-fields';
import { FormField, FormSelect } from '../../lib/forms';
import type { JobFormValues } from './job-form-schema';

/** Pick one of the company's customers, or type a new one in place. */
export function CustomerChoice({
  customers,
  customersLoading,
  onCustomerPicked,
}: {
  customers: Customer[];
  customersLoading: boolean;
  onCustomerPicked: (c: Customer) => void;
}) {
  const { setValue, control } = useFormContext<JobFormValues>();
  const mode = useWatch({ control, name: 'mode' });
  const sorted = [...customers].sort((a, b) => a.name.localeCompare(b.name));
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-2 text-sm font-semibold">Customer</legend>
      <div role="radiogroup" aria-label="Customer" className="inline-flex w-fit rounded-md border border-graphite/25 bg-white/70 p-0.5 text-sm">
        {(['existing', 'new'] as const).map((m) => (
          <button
            key={m}
            type="button"
            role="radio"
            aria-checked={mode === m}
            onClick={() => setValue('mode', m)}
            className={`rounded px-3 py-1.5 font-medium ${mode === m ? 'bg-graphite text-white' : 'text-graphite-light hover:text-graphite'}`}
          >
            {m === 'existing' ? 'Existing customer' : 'New customer'}
          </button>
        ))}
      </div>
      {mode === 'existing' ? (
        <FormField name="customerId" label="Choose the customer" required hint={customersLoading ? 'Loading customers…' : undefined}>
          <FormSelect
            name="customerId"
            disabled={customersLoading}
            onChange={(e) => {
              const c = customers.find((x) => x.id === e.target.value);
              if (c) onCustomerPicked(c);
            }}
          >
            <option value="">— choose —</option>
            {sorted.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name} · {formatAddress(c.address)}
              </option>
            ))}
          </FormSelect>
        </FormField>
      ) : (
        <CustomerFields path="customer" />
      )}
    </fieldset>
  );
}
