import { useFormContext } from 'react-hook-form';
import type { Address } from '../../../shared/api/customers';
import { FormField } from '../../lib/forms';
import { Input } from '../ui';

export type AddressValues = { line1: string; line2: string; town: string; postcode: string };
export const emptyAddress = (): AddressValues => ({ line1: '', line2: '', town: '', postcode: '' });
export const addressValues = (a: Partial<Address> | null | undefined): AddressValues => ({
  line1: a?.line1 ?? '',
  line2: a?.line2 ?? '',
  town: a?.town ?? '',
  postcode: a?.postcode ?? '',
});

/** The four lines of a UK-style address, at `path` of the enclosing form ("propertyAddress", "customer.address"). */
export function AddressFields({ path }: { path: string }) {
  const { register } = useFormContext();
  return (
    <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
      <FormField name={`${path}.line1`} label="Address line 1" required className="sm:col-span-2">
        <Input autoComplete="address-line1" {...register(`${path}.line1`)} />
      </FormField>
      <FormField name={`${path}.line2`} label="Address line 2" className="sm:col-span-2">
        <Input autoComplete="address-line2" {...register(`${path}.line2`)} />
      </FormField>
      <FormField name={`${path}.town`} label="Town" required>
        <Input autoComplete="address-level2" {...register(`${path}.town`)} />
      </FormField>
      <FormField name={`${path}.postcode`} label="Postcode" required>
        <Input autoComplete="postal-code" className="font-mono uppercase" {...register(`${path}.postcode`)} />
      </FormField>
    </div>
  );
}
