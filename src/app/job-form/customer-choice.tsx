import type { Customer } from '../../../shared/api/customers';
import { Field, formatAddress, Select } from '../../components/ui';
import { CustomerFields, type CustomerValues } from '../../features/customers/components/customer-fields';

export type CustomerMode = 'existing' | 'new';

/** Pick one of the company's customers, or type a new one in place. */
export function CustomerChoice({
  mode,
  onModeChange,
  customers,
  customersLoading,
  customerId,
  onCustomerId,
  newCustomer,
  onNewCustomer,
  errors,
}: {
  mode: CustomerMode;
  onModeChange: (m: CustomerMode) => void;
  customers: Customer[];
  customersLoading: boolean;
  customerId: string;
  onCustomerId: (id: string) => void;
  newCustomer: CustomerValues;
  onNewCustomer: (v: CustomerValues) => void;
  errors: Record<string, string>;
}) {
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
            onClick={() => onModeChange(m)}
            className={`rounded px-3 py-1.5 font-medium ${mode === m ? 'bg-graphite text-white' : 'text-graphite-light hover:text-graphite'}`}
          >
            {m === 'existing' ? 'Existing customer' : 'New customer'}
          </button>
        ))}
      </div>
      {mode === 'existing' ? (
        <Field label="Choose the customer" error={errors.customerId} required hint={customersLoading ? 'Loading customers…' : undefined}>
          <Select name="customerId" value={customerId} onChange={(e) => onCustomerId(e.target.value)} disabled={customersLoading}>
            <option value="">— choose —</option>
            {sorted.map((c) => (
              <option key={c.id} value={c.id}>
                {c.name} · {formatAddress(c.address)}
              </option>
            ))}
          </Select>
        </Field>
      ) : (
        <CustomerFields value={newCustomer} onChange={onNewCustomer} errors={errors} path="customer" />
      )}
    </fieldset>
  );
}
