import { AddressFields, addressValues, emptyAddress, type AddressValues } from '../../../components/forms/address-fields';
import { Field, Input } from '../../../components/ui';
import type { Customer } from '../../../../shared/api/customers';

export type CustomerValues = { name: string; email: string; phone: string; address: AddressValues };
export const emptyCustomer = (): CustomerValues => ({ name: '', email: '', phone: '', address: emptyAddress() });
export const customerValues = (c: Customer): CustomerValues => ({
  name: c.name,
  email: c.email ?? '',
  phone: c.phone ?? '',
  address: addressValues(c.address),
});

/** Name, contact details and address of a customer; errors keyed by `${path}.name` etc. (path "" for top level). */
export function CustomerFields({
  value,
  onChange,
  errors,
  path = '',
}: {
  value: CustomerValues;
  onChange: (next: CustomerValues) => void;
  errors: Record<string, string>;
  path?: string;
}) {
  const key = (k: string) => (path ? `${path}.${k}` : k);
  return (
    <div className="flex flex-col gap-3">
      <Field label="Customer name" error={errors[key('name')]} required>
        <Input name={key('name')} autoComplete="name" value={value.name} onChange={(e) => onChange({ ...value, name: e.target.value })} />
      </Field>
      <div className="grid grid-cols-1 gap-3 sm:grid-cols-2">
        <Field label="E-mail" error={errors[key('email')]} hint="Quotes are sent here.">
          <Input type="email" name={key('email')} inputMode="email" value={value.email} onChange={(e) => onChange({ ...value, email: e.target.value })} />
        </Field>
        <Field label="Phone" error={errors[key('phone')]}>
          <Input type="tel" name={key('phone')} inputMode="tel" value={value.phone} onChange={(e) => onChange({ ...value, phone: e.target.value })} />
        </Field>
      </div>
      <AddressFields value={value.address} onChange={(address) => onChange({ ...value, address })} errors={errors} path={key('address')} />
    </div>
  );
}
