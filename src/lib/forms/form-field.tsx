import type { ReactNode } from 'react';
import { get, useFormContext, useFormState } from 'react-hook-form';
import { Field } from '../../components/ui';

type Props = { name: string; label: ReactNode; hint?: ReactNode; required?: boolean; className?: string; children: ReactNode };

/**
 * A Field whose error is the form's message for `name` (client check or the server's 422 on that
 * path). The control inside gets the id, aria-invalid and aria-describedby from Field as before.
 */
export function FormField({ name, ...rest }: Props) {
  const { control } = useFormContext();
  const { errors } = useFormState({ control, name });
  const message = (get(errors, name) as { message?: string } | undefined)?.message;
  return <Field {...rest} error={message} />;
}

/** True when any field has a message (not counting the form's top message). */
export function hasFieldErrors(errors: Record<string, unknown>): boolean {
  return Object.keys(errors).some((k) => k !== 'root');
}
