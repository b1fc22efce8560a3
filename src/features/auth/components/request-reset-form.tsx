import { FormProvider } from 'react-hook-form';
import { requestResetBodySchema } from '../../../../shared/api/auth';
import { Alert, Button, Input } from '../../../components/ui';
import { FormField, showServerErrors, trimmedText, useZodForm } from '../../../lib/forms';
import { useRequestReset } from '../api/request-reset';

const requestResetFormSchema = requestResetBodySchema.extend({ email: trimmedText(requestResetBodySchema.shape.email) });

/** Asks for a reset link; says the same thing whether or not the address has an account. */
export function RequestResetForm() {
  const form = useZodForm(requestResetFormSchema, { defaultValues: { email: '' } });
  const mutation = useRequestReset();

  const onSubmit = form.handleSubmit(async (body) => {
    try {
      await mutation.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, form.setError);
    }
  });

  if (mutation.isSuccess) {
    return (
      <Alert tone="success">
        If <strong>{form.getValues('email').trim()}</strong> has an account, a link to set a new password is on its way. The link works once and expires.
      </Alert>
    );
  }

  const formError = form.formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Request a password reset">
        {formError && <Alert>{formError}</Alert>}
        <FormField name="email" label="E-mail">
          <Input type="email" autoComplete="username" inputMode="email" autoFocus {...form.register('email')} />
        </FormField>
        <Button type="submit" busy={mutation.isPending} className="w-full">
          Send me a link
        </Button>
      </form>
    </FormProvider>
  );
}
