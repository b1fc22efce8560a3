import { Navigate, useNavigate, useSearchParams } from 'react-router-dom';
import { AuthLayout } from '../../components/layout/auth-layout';
import { LoadingState } from '../../components/ui';
import { useMe } from '../../features/auth/api/get-me';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { homePathFor } from '../nav-items';

/** Only same-site paths are followed after sign-in, never another origin. */
function safeNext(next: string | null): string | null {
  return next && next.startsWith('/') && !next.startsWith('//') ? next : null;
}

export default function SignInPage() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const me = useMe();
  const next = safeNext(params.get('next'));

  if (me.isPending) return <LoadingState />;
  if (me.data) return <Navigate to={next ?? homePathFor(me.data)} replace />;

  return (
    <AuthLayout title="Sign in" subtitle="Use the e-mail address your company's office invited.">
      <SignInForm onSignedIn={(user) => navigate(next ?? homePathFor(user), { replace: true })} />
    </AuthLayout>
  );
}
