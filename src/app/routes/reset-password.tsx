import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layout/auth-layout';
import { Alert, ButtonLink } from '../../components/ui';
import { RequestResetForm } from '../../features/auth/components/request-reset-form';
import { SetPasswordForm } from '../../features/auth/components/set-password-form';
import { BackToSignIn } from './set-password';

/** Without a token: ask for a reset e-mail. With the e-mailed token: choose a new password. */
export default function ResetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token');
  const [done, setDone] = useState(false);

  if (!token) {
    return (
      <AuthLayout title="Reset your password" subtitle="We'll e-mail you a link to choose a new one." footer={<BackToSignIn />}>
        <RequestResetForm />
      </AuthLayout>
    );
  }
  return (
    <AuthLayout title={done ? 'Password changed' : 'Choose a new password'} footer={done ? undefined : <BackToSignIn />}>
      {done ? (
        <div className="flex flex-col gap-4">
          <Alert tone="success">Your new password is saved and the link can't be used again.</Alert>
          <ButtonLink to="/sign-in" variant="primary">
            Go to sign in
          </ButtonLink>
        </div>
      ) : (
        <SetPasswordForm token={token} submitLabel="Save new password" onDone={() => setDone(true)} />
      )}
    </AuthLayout>
  );
}
