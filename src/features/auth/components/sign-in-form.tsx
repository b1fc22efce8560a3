import { Link } from 'react-router-dom';
import { loginBodySchema, type Me } from '../../../../shared/api/auth';
import { Alert, Button, Input } from '../../../components/ui';
import { FormField, showServerErrors, trimmedText, useZodForm } from '../../../lib/forms';
import { FormProvider } from 'react-hook-form';
import { useLogin } from '../api/login';

const signInSchema = loginBodySchema.extend({ email: trimmedText(loginBodySchema.shape.email) });

/** E-mail and password; checks them with the server's own schema before sending. */
export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const form = useZodForm(signInSchema, { defaultValues: { email: '', password: '' } });
  const loginMutation = useLogin();

  const onSubmit = form.handleSubmit(async (body) => {
    let me: Me;
    try {
      me = await loginMutation.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, form.setError);
      return;
    }
    onSignedIn(me);
  });

  const formError = form.formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
        {formError && <Alert>{formError}</Alert>}
        <FormField name="email" label="E-mail">
          <Input type="email" autoComplete="username" inputMode="email" autoFocus {...form.register('email')} />
        </FormField>
        <FormField name="password" label="Password">
          <Input type="password" autoComplete="current-password" {...form.register('password')} />
        </FormField>
        <Button type="submit" busy={loginMutation.isPending} className="mt-1 w-full">
          Sign in
        </Button>
        <p className="text-center text-sm">
          <Link to="/reset-password" className="text-teal-dark underline-offset-2 hover:underline">
            Forgotten your password?
          </Link>
        </p>
      </form>
    </FormProvider>
  );
}
