import type { Me } from '../../../shared/api/auth';
import { ROLE_LABELS } from '../../../shared/auth/roles';
import { Button } from '../ui';

/** Who is signed in, for which company and in which role, and the sign-out control. */
export function UserMenu({ user, onSignOut, signingOut }: { user: Me; onSignOut: () => void; signingOut?: boolean }) {
  return (
    <div className="flex items-center gap-3">
      <div className="min-w-0 text-right leading-tight" data-testid="signed-in-user">
        <div className="truncate text-sm font-medium text-graphite">{user.name}</div>
        <div className="truncate text-xs text-graphite-light">
          {ROLE_LABELS[user.role]} · {user.organisation.name}
        </div>
      </div>
      <Button variant="secondary" size="sm" onClick={onSignOut} busy={signingOut}>
        Sign out
      </Button>
    </div>
  );
}
