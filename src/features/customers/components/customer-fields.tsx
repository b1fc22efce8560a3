import { useFormContext } from 'react-hook-form';
import { AddressFields, addressValues, emptyAddress, type AddressValues } from '../../../components/forms/address-fields';
import { Input } from '../../../components/ui';
import { FormField } from '../../../lib/forms';
import type { Customer } from '../../../../shared/api/customers';

export type CustomerValues = { name: string; email: string; phone: string; address: AddressValues };
export const emptyCustomer = (): CustomerValues => ({ name: '', email: '', phone: '', address: emptyAddress() });
export const customerValues = (c: Customer): CustomerValues => ({
  name: c.name,
  email: c.email ?? '',
  phone: c.phone ?? '',
  address: addressValues(c.address),
});

/** Name, contact details and address of a customer, at `path` of the enclosing form ("" for the top level). */
export function CustomerFields({ path = '' }: { path?: string }) {
  const { register } = useFormContext();
  const key = (k: string) => (path ? `${path}.${k}` : k);
  return (
    <div className="flex flex-col gap-3">
      <FormField name={key('name')} label="Customer name" required>
        <Input autoComplete="name" {...register(key('name'))} />
      </FormField>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <FormField name={key('email')} label="E-mail" hint="Quotes are sent here.">
          <Input type="email" inputMode="email" {...register(key('email'))} />
        </FormField>
        <FormField name={key('phone')} label="Phone">
          <Input type="tel" inputMode="tel" {...register(key('phone'))} />
        </FormField>
      </div>
      <AddressFields path={key('address')} />
    </div>
  );
}
