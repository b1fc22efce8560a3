import { Suspense, useEffect, useState } from 'react';
import { Link, Outlet, useLocation, useMatches, useNavigate } from 'react-router-dom';
import type { Me } from '../../../shared/api/auth';
import { ROLE_LABELS } from '../../../shared/auth/roles';
import { can } from '../../../shared/auth/policies';
import { navItemsFor } from '../../app/nav-items';
import { useLogout } from '../../features/auth/api/logout';
import { useOutboxAvailable } from '../../features/outbox/api/get-outbox';
import { Button, LoadingState } from '../ui';
import { Logo } from './logo';
import { MainNav } from './main-nav';
import { UserMenu } from './user-menu';

/** The signed-in frame: top bar with role-aware navigation (a menu on phones) and the page below. */
export function AppShell({ user }: { user: Me }) {
  const [menuOpen, setMenuOpen] = useState(false);
  const location = useLocation();
  const navigate = useNavigate();
  const logout = useLogout();
  const outbox = useOutboxAvailable(can(user, 'outbox:read'));
  const items = navItemsFor(user, { outbox });
  // A route with handle { fullWidth: true } (the plan editor) gets the whole window below the header.
  const fullWidth = useMatches().some((m) => (m.handle as { fullWidth?: boolean } | undefined)?.fullWidth);

  // Navigating closes the menu (adjusted during render, not in an effect).
  const [menuPath, setMenuPath] = useState(location.pathname);
  if (menuPath !== location.pathname) {
    setMenuPath(location.pathname);
    setMenuOpen(false);
  }
  useEffect(() => {
    if (!menuOpen) return;
    const onKey = (e: KeyboardEvent) => e.key === 'Escape' && setMenuOpen(false);
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [menuOpen]);

  function signOut() {
    logout.mutate(undefined, { onSettled: () => navigate('/sign-in', { replace: true }) });
  }

  return (
    <div className="notebook-paper min-h-dvh">
      <header className="sticky top-0 z-30 border-b border-paper-line bg-paper">
        <div className={`mx-auto flex h-14 items-center gap-4 px-4 ${fullWidth ? '' : 'max-w-6xl'}`}>
          <Link to="/" aria-label="Quiltline home" className="shrink-0">
            <Logo />
          </Link>
          <nav aria-label="Main" className="hidden min-w-0 flex-1 overflow-x-auto [scrollbar-width:none] lg:block">
            <MainNav items={items} />
          </nav>
          <div className="ml-auto hidden shrink-0 lg:block">
            <UserMenu user={user} onSignOut={signOut} signingOut={logout.isPending} />
          </div>
          <Button
            variant="ghost"
            size="sm"
            className="ml-auto lg:hidden"
            aria-expanded={menuOpen}
            aria-controls="phone-menu"
            onClick={() => setMenuOpen((o) => !o)}
          >
            <svg viewBox="0 0 20 20" width="20" height="20" aria-hidden>
              {menuOpen ? (
                <path d="M5 5l10 10M15 5L5 15" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
              ) : (
                <path d="M3 6h14M3 10h14M3 14h14" stroke="currentColor" strokeWidth="1.8" strokeLinecap="round" />
              )}
            </svg>
            Menu
          </Button>
        </div>
        {menuOpen && (
          <div id="phone-menu" className="border-t border-paper-line bg-paper px-4 pb-4 pt-2 shadow-md lg:hidden">
            <nav aria-label="Main">
              <MainNav items={items} vertical onNavigate={() => setMenuOpen(false)} />
            </nav>
            <div className="mt-3 flex items-center justify-between gap-3 border-t border-paper-line pt-3">
              <div className="min-w-0 leading-tight">
                <div className="truncate text-sm font-medium">{user.name}</div>
                <div className="truncate text-xs text-graphite-light">
                  {ROLE_LABELS[user.role]} · {user.organisation.name}
                </div>
              </div>
              <Button variant="secondary" size="sm" onClick={signOut} busy={logout.isPending}>
                Sign out
              </Button>
            </div>
          </div>
        )}
      </header>
      <main className={fullWidth ? 'w-full' : 'mx-auto max-w-6xl px-4 py-6 sm:py-8'}>
        <Suspense fallback={<LoadingState />}>
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
