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

/**
 * The form's message for one control outside a Field (a cell of a table of lines): the props that
 * mark the control invalid and point it at the message, and the message itself to show under it.
 */
export function useFieldError(name: string) {
  const { errors } = useFormState({ name });
  const message = (get(errors, name) as { message?: string } | undefined)?.message;
  const id = `${name.replace(/\./g, '-')}-error`;
  return {
    props: message ? { 'aria-invalid': true as const, 'aria-describedby': id } : {},
    node: message ? (
      <p id={id} className="text-xs font-medium text-brick-dark">
        {message}
      </p>
    ) : null,
  };
}

/** True when any field has a message (not counting the form's top message). */
export function hasFieldErrors(errors: Record<string, unknown>): boolean {
  return Object.keys(errors).some((k) => k !== 'root');
}
