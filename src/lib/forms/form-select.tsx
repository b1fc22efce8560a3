import type { ChangeEvent, SelectHTMLAttributes } from 'react';
import { useController } from 'react-hook-form';
import { Select } from '../../components/ui';

type Props = Omit<SelectHTMLAttributes<HTMLSelectElement>, 'name' | 'value' | 'defaultValue'> & { name: string };

/**
 * A select bound to the form field `name`, controlled rather than registered: its options often
 * arrive after the form is filled (customers, installers), and the chosen one must show then.
 * `onChange` runs after the form has the new value.
 */
export function FormSelect({ name, onChange, children, ...rest }: Props) {
  const {
    field: { ref: selectRef, value, onBlur, onChange: setValue },
  } = useController({ name });
  return (
    <Select
      {...rest}
      name={name}
      ref={selectRef}
      value={value as string}
      onBlur={onBlur}
      onChange={(e: ChangeEvent<HTMLSelectElement>) => {
        setValue(e);
        onChange?.(e);
      }}
    >
      {children}
    </Select>
  );
}
