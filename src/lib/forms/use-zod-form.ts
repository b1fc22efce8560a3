import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, type FieldValues, type Resolver, type UseFormProps } from 'react-hook-form';
import type { z } from 'zod';

type FormSchema = z.ZodType<unknown, FieldValues>;

/**
 * `useForm` checked by a zod schema: the API's own schema from shared/api, or a form schema that
 * wraps it (typed text → the API's numbers, see money-field.ts). The handler gets the schema's
 * output, ready to send. A function builds the schema from the values being checked, for forms
 * where one field decides how another is read (the currency of the money fields).
 */
export function useZodForm<S extends FormSchema>(
  schema: S | ((values: z.input<S>) => S),
  props: Omit<UseFormProps<z.input<S>, unknown, z.output<S>>, 'resolver'> = {},
) {
  const resolver: Resolver<z.input<S>, unknown, z.output<S>> = typeof schema === 'function'
    ? (values, context, options) => (zodResolver(schema(values)) as Resolver<z.input<S>, unknown, z.output<S>>)(values, context, options)
    : (zodResolver(schema) as Resolver<z.input<S>, unknown, z.output<S>>);
  return useForm<z.input<S>, unknown, z.output<S>>({ ...props, resolver });
}
