import { useState, type FormEvent } from 'react';
import { requestResetBodySchema } from '../../../../shared/api/auth';
import { Alert, Button, Field, Input } from '../../../components/ui';
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '../../../lib/form-errors';
import { useRequestReset } from '../api/request-reset';

/** Asks for a reset link; says the same thing whether or not the address has an account. */
export function RequestResetForm() {
  const [email, setEmail] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const mutation = useRequestReset();

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const parsed = requestResetBodySchema.safeParse({ email: email.trim() });
    if (!parsed.success) {
      setErrors(zodFieldErrors(parsed.error));
      return;
    }
    setErrors({});
    mutation.mutate(parsed.data, { onError: (err) => setErrors(serverFieldErrors(err)) });
  }

  if (mutation.isSuccess) {
    return (
      <Alert tone="success">
        If <strong>{email.trim()}</strong> has an account, a link to set a new password is on its way. The link works once and expires.
      </Alert>
    );
  }

  const formError = mutation.isError && !errors.email ? formErrorMessage(mutation.error) : null;
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Request a password reset">
      {formError && <Alert>{formError}</Alert>}
      <Field label="E-mail" error={errors.email}>
        <Input type="email" name="email" autoComplete="username" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} autoFocus />
      </Field>
      <Button type="submit" busy={mutation.isPending} className="w-full">
        Send me a link
      </Button>
    </form>
  );
}
