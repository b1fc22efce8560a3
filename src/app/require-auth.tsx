import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import type { Action } from '../../shared/auth/policies';
import { can } from '../../shared/auth/policies';
import { AppShell } from '../components/layout/app-shell';
import { ErrorState, LoadingState, PageHeader } from '../components/ui';
import { useMe } from '../features/auth/api/get-me';
import { CurrentUserContext, useCurrentUser } from '../features/auth/use-current-user';

/** Layout route: the app frame for a signed-in user, otherwise off to sign-in (and back afterwards). */
export function RequireAuth() {
  const me = useMe();
  const location = useLocation();
  if (me.isPending)
    return (
      <div className="notebook-paper min-h-dvh">
        <LoadingState label="Opening Quiltline…" />
      </div>
    );
  if (me.isError)
    return (
      <div className="notebook-paper min-h-dvh p-6">
        <ErrorState error={me.error} onRetry={() => me.refetch()} title="Quiltline could not reach its server" />
      </div>
    );
  if (!me.data) {
    const next = location.pathname + location.search;
    return <Navigate to={next && next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'} replace />;
  }
  return (
    <CurrentUserContext.Provider value={me.data}>
      <AppShell user={me.data} />
    </CurrentUserContext.Provider>
  );
}

/** Renders the page only for roles that may perform `action`; the server enforces the same rule. */
export function RequireAction({ action, children }: { action: Action; children: ReactNode }) {
  const user = useCurrentUser();
  if (!can(user, action)) {
    return (
      <div>
        <PageHeader title="Not available for your role" subtitle="This page belongs to another role in your company. Ask the office if you need it." />
      </div>
    );
  }
  return <>{children}</>;
}
