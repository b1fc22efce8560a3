import { FormProvider } from 'react-hook-form';
import { inviteUserBodySchema } from '../../../../shared/api/users';
import { ROLES, ROLE_LABELS } from '../../../../shared/auth/roles';
import { Alert, Button, Card, CardTitle, Input } from '../../../components/ui';
import { FormField, FormSelect, showServerErrors, trimmedText, useZodForm } from '../../../lib/forms';
import { useInviteUser } from '../api/invite-user';

const inviteFormSchema = inviteUserBodySchema.extend({ email: trimmedText(inviteUserBodySchema.shape.email) });

/** Name, e-mail and role of a new colleague; the server e-mails them a link to set a password. */
export function InviteUserForm({ onDone }: { onDone: (invitedEmail?: string) => void }) {
  const form = useZodForm(inviteFormSchema, { defaultValues: { name: '', email: '', role: 'estimator' } });
  const invite = useInviteUser();

  const onSubmit = form.handleSubmit(async (body) => {
    try {
      await invite.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, form.setError);
      return;
    }
    onDone(body.email);
  });

  const formError = form.formState.errors.root?.server?.message;
  return (
    <Card className="mb-5 border-straw/60">
      <CardTitle>Invite a colleague</CardTitle>
      <FormProvider {...form}>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Invite a colleague">
          {formError && <Alert>{formError}</Alert>}
          <div className="grid grid-cols-1 gap-3 sm:grid-cols-3">
            <FormField name="name" label="Name" required>
              <Input autoFocus {...form.register('name')} />
            </FormField>
            <FormField name="email" label="E-mail" required>
              <Input type="email" inputMode="email" {...form.register('email')} />
            </FormField>
            <FormField name="role" label="Role">
              <FormSelect name="role">
                {ROLES.map((r) => (
                  <option key={r} value={r}>
                    {ROLE_LABELS[r]}
                  </option>
                ))}
              </FormSelect>
            </FormField>
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
      </FormProvider>
    </Card>
  );
}
