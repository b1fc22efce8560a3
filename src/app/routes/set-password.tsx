import { useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layout/auth-layout';
import { Alert, ButtonLink } from '../../components/ui';
import { SetPasswordForm } from '../../features/auth/components/set-password-form';

/** The page an invite e-mail links to: choose a first password. */
export default function SetPasswordPage() {
  const [params] = useSearchParams();
  const token = params.get('token') ?? '';
  const [done, setDone] = useState(false);

  if (!token) {
    return (
      <AuthLayout title="Set your password">
        <Alert>This page needs the link from your invitation e-mail. Open the link again, or ask the office to invite you once more.</Alert>
      </AuthLayout>
    );
  }
  return (
    <AuthLayout title={done ? 'Password saved' : 'Welcome to Quiltline'} subtitle={done ? undefined : 'Choose a password to finish setting up your account.'}>
      {done ? (
        <div className="flex flex-col gap-4">
          <Alert tone="success">Your password is set. Sign in with your e-mail address and the new password.</Alert>
          <ButtonLink to="/sign-in" variant="primary">
            Go to sign in
          </ButtonLink>
        </div>
      ) : (
        <SetPasswordForm token={token} submitLabel="Save password" onDone={() => setDone(true)} />
      )}
    </AuthLayout>
  );
}

export function BackToSignIn() {
  return (
    <Link to="/sign-in" className="text-teal-dark hover:underline">
      Back to sign in
    </Link>
  );
}
