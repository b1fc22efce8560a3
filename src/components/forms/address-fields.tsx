import type { Address } from '../../../shared/api/customers';
import { Field, Input } from '../ui';

export type AddressValues = { line1: string; line2: string; town: string; postcode: string };
export const emptyAddress = (): AddressValues => ({ line1: '', line2: '', town: '', postcode: '' });
export const addressValues = (a: Partial<Address> | null | undefined): AddressValues => ({
  line1: a?.line1 ?? '',
  line2: a?.line2 ?? '',
  town: a?.town ?? '',
  postcode: a?.postcode ?? '',
});

/**
 * The four lines of a UK-style address. `errors` is keyed by full path; `path` is this address's
 * prefix in it ("propertyAddress", "customer.address").
 */
export function AddressFields({
  value,
  onChange,
  errors,
  path,
}: {
  value: AddressValues;
  onChange: (next: AddressValues) => void;
  errors: Record<string, string>;
  path: string;
}) {
  const set = (k: keyof AddressValues) => (e: React.ChangeEvent<HTMLInputElement>) => onChange({ ...value, [k]: e.target.value });
  return (
    <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
      <Field label="Address line 1" error={errors[`${path}.line1`]} required className="sm:col-span-2">
        <Input name={`${path}.line1`} autoComplete="address-line1" value={value.line1} onChange={set('line1')} />
      </Field>
      <Field label="Address line 2" error={errors[`${path}.line2`]} className="sm:col-span-2">
        <Input name={`${path}.line2`} autoComplete="address-line2" value={value.line2} onChange={set('line2')} />
      </Field>
      <Field label="Town" error={errors[`${path}.town`]} required>
        <Input name={`${path}.town`} autoComplete="address-level2" value={value.town} onChange={set('town')} />
      </Field>
      <Field label="Postcode" error={errors[`${path}.postcode`]} required>
        <Input name={`${path}.postcode`} autoComplete="postal-code" className="font-mono uppercase" value={value.postcode} onChange={set('postcode')} />
      </Field>
    </div>
  );
}
