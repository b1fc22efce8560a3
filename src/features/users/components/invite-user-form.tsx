import { useState, type FormEvent } from 'react';
import { inviteUserBodySchema } from '../../../../shared/api/users';
import { ROLES, ROLE_LABELS, type Role } from '../../../../shared/auth/roles';
import { Alert, Button, Card, CardTitle, Field, Input, Select } from '../../../components/ui';
import { formErrorMessage, serverFieldErrors, zodFieldErrors, type FieldErrors } from '../../../lib/form-errors';
import { useInviteUser } from '../api/invite-user';

/** Name, e-mail and role of a new colleague; the server e-mails them a link to set a password. */
export function InviteUserForm({ onDone }: { onDone: (invitedEmail?: string) => void }) {
  const [name, setName] = useState('');
  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('estimator');
  const [errors, setErrors] = useState<FieldErrors>({});
  const invite = useInviteUser();

  function onSubmit(e: FormEvent) {
    e.preventDefault();
    const parsed = inviteUserBodySchema.safeParse({ name, email: email.trim(), role });
    if (!parsed.success) return setErrors(zodFieldErrors(parsed.error));
    setErrors({});
    invite.mutate(parsed.data, { onSuccess: () => onDone(parsed.data.email), onError: (err) => setErrors(serverFieldErrors(err)) });
  }

  const formError = invite.isError && !Object.keys(errors).length ? formErrorMessage(invite.error) : null;
  return (
    <Card className="mb-5 border-straw/60">
      <CardTitle>Invite a colleague</CardTitle>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Invite a colleague">
        {formError && <Alert>{formError}</Alert>}
        <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
          <Field label="Name" error={errors.name} required>
            <Input name="name" value={name} onChange={(e) => setName(e.target.value)} autoFocus />
          </Field>
          <Field label="E-mail" error={errors.email} required>
            <Input type="email" name="email" inputMode="email" value={email} onChange={(e) => setEmail(e.target.value)} />
          </Field>
          <Field label="Role" error={errors.role}>
            <Select name="role" value={role} onChange={(e) => setRole(e.target.value as Role)}>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </Select>
          </Field>
        </div>
        <div className="flex flex-col-reverse gap-2 sm:flex-row sm:justify-end">
          <Button variant="secondary" onClick={() => onDone()}>
            Cancel
          </Button>
          <Button type="submit" busy={invite.isPending}>
            Send invitation
          </Button>
        </div>
      </form>
    </Card>
  );
}
