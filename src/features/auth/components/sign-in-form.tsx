import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { loginBodySchema, type Me } from '../../../../shared/api/auth';
import { Alert, Button, Field, Input } from '../../../components/ui';
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '../../../lib/form-errors';
import { useLogin } from '../api/login';

/** E-mail and password; checks them with the server's own schema before sending. */
export function SignInForm({ onSignedIn }: { onSignedIn: (me: Me) => void }) {
  const [email, setEmail] = useState('');
  const [password, setPassword] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const loginMutation = useLogin();

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const parsed = loginBodySchema.safeParse({ email: email.trim(), password });
    if (!parsed.success) {
      setErrors(zodFieldErrors(parsed.error));
      return;
    }
    setErrors({});
    loginMutation.mutate(parsed.data, {
      onSuccess: (me) => onSignedIn(me),
      onError: (err) => setErrors(serverFieldErrors(err)),
    });
  }

  const formError = loginMutation.isError && !Object.keys(errors).length ? formErrorMessage(loginMutation.error) : null;

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Sign in">
      {formError && <Alert>{formError}</Alert>}
      <Field label="E-mail" error={errors.email}>
        <Input type="email" name="email" autoComplete="username" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} autoFocus />
      </Field>
      <Field label="Password" error={errors.password}>
        <Input type="password" name="password" autoComplete="current-password" value={password} onChange={(e) => setPassword(e.target.value)} />
      </Field>
      <Button type="submit" busy={loginMutation.isPending} className="mt-1 w-full">
        Sign in
      </Button>
      <p className="text-center text-sm">
        <Link to="/reset-password" className="text-teal-dark underline-offset-2 hover:underline">
          Forgotten your password?
        </Link>
      </p>
    </form>
  );
}
