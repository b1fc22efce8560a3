import type { Me } from '../../../shared/api/auth';
import { ROLE_LABELS } from '../../../shared/auth/roles';
import { Button } from '../ui';

function initials(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  return ((parts[0]?.[0] ?? '') + (parts.length > 1 ? parts[parts.length - 1][0] : '')).toUpperCase();
}

/** Who is signed in, for which company and in which role, and the sign-out control. */
export function UserMenu({ user, onSignOut, signingOut }: { user: Me; onSignOut: () => void; signingOut?: boolean }) {
  return (
    <div className="flex items-center gap-3">
      {/* Narrow desktops show initials (full name on hover and to screen readers); wide ones the name and company. */}
      <span
        title={`${user.name} · ${ROLE_LABELS[user.role]} · ${user.organisation.name}`}
        className="flex h-8 w-8 items-center justify-center rounded-full border border-timber/40 bg-straw-light font-mono text-xs font-medium text-timber xl:hidden"
      >
        <span aria-hidden>{initials(user.name)}</span>
        <span className="sr-only">Signed in as {user.name}</span>
      </span>
      <div className="hidden min-w-0 max-w-[16rem] text-right leading-tight xl:block" data-testid="signed-in-user">
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
