import { FormProvider } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { isApiError } from '../../../lib/api-client';
import { setPasswordBodySchema } from '../../../../shared/api/auth';
import { Alert, Button, Input } from '../../../components/ui';
import { formErrorMessage } from '../../../lib/forms/server-errors';
import { FormField, showServerErrors, useZodForm } from '../../../lib/forms';
import { useSetPassword } from '../api/set-password';

type Values = { token: string; password: string; confirm: string };

/** The API's body plus the repeated password, which must match once a password is typed. */
const setPasswordFormSchema = (values: Values) =>
  setPasswordBodySchema
    .extend({ confirm: values.password ? z.literal(values.password, { error: 'the two passwords differ' }) : z.string() })
    .transform(({ token, password }) => ({ token, password }));

/** New password twice, sent with the single-use token from an invite or reset e-mail. */
export function SetPasswordForm({ token, submitLabel, onDone }: { token: string; submitLabel: string; onDone: () => void }) {
  const form = useZodForm(setPasswordFormSchema, { defaultValues: { token, password: '', confirm: '' } });
  const mutation = useSetPassword();
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (body) => {
    try {
      await mutation.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, form.setError);
      return;
    }
    onDone();
  });

  const tokenProblem = errors.token ? 'This link is not valid. Ask the office for a new one.' : null;
  const formError = tokenProblem ?? (mutation.isError && !errors.password ? formErrorMessage(mutation.error) : null);
  const linkUsedUp = isApiError(mutation.error) && mutation.error.code === 'invalid_token';

  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Set password">
        {formError && (
          <Alert>
            {formError}
            {linkUsedUp && (
              <>
                {' '}
                <Link to="/reset-password" className="font-medium underline">
                  Send me a new link
                </Link>
              </>
            )}
          </Alert>
        )}
        <FormField name="password" label="New password" hint="At least 10 characters. A short sentence is easy to remember.">
          <Input type="password" autoComplete="new-password" autoFocus {...form.register('password')} />
        </FormField>
        <FormField name="confirm" label="Repeat the password">
          <Input type="password" autoComplete="new-password" {...form.register('confirm')} />
        </FormField>
        <Button type="submit" busy={mutation.isPending} className="w-full">
          {submitLabel}
        </Button>
      </form>
    </FormProvider>
  );
}
