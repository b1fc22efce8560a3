import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { isApiError } from '../../../lib/api-client';
import { setPasswordBodySchema } from '../../../../shared/api/auth';
import { Alert, Button, Field, Input } from '../../../components/ui';
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '../../../lib/form-errors';
import { useSetPassword } from '../api/set-password';

/** New password twice, sent with the single-use token from an invite or reset e-mail. */
export function SetPasswordForm({ token, submitLabel, onDone }: { token: string; submitLabel: string; onDone: () => void }) {
  const [password, setPassword] = useState('');
  const [confirm, setConfirm] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const mutation = useSetPassword();

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const parsed = setPasswordBodySchema.safeParse({ token, password });
    const next: FieldErrors = parsed.success ? {} : zodFieldErrors(parsed.error);
    if (password && confirm !== password) next.confirm = 'the two passwords differ';
    if (Object.keys(next).length || !parsed.success) {
      setErrors(next);
      return;
    }
    setErrors({});
    mutation.mutate(parsed.data, { onSuccess: onDone, onError: (err) => setErrors(serverFieldErrors(err)) });
  }

  const tokenProblem = errors.token ? 'This link is not valid. Ask the office for a new one.' : null;
  const formError = tokenProblem ?? (mutation.isError && !errors.password ? formErrorMessage(mutation.error) : null);

  const linkUsedUp = isApiError(mutation.error) && mutation.error.code === 'invalid_token';

  return (
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
      <Field label="New password" error={errors.password} hint="At least 10 characters. A short sentence is easy to remember.">
        <Input type="password" name="password" autoComplete="new-password" value={password} onChange={(e) => setPassword(e.target.value)} autoFocus />
      </Field>
      <Field label="Repeat the password" error={errors.confirm}>
        <Input type="password" name="confirm" autoComplete="new-password" value={confirm} onChange={(e) => setConfirm(e.target.value)} />
      </Field>
      <Button type="submit" busy={mutation.isPending} className="w-full">
        {submitLabel}
      </Button>
    </form>
  );
}
