import { Suspense, useState } from 'react';
import { Link, Navigate, NavLink, Outlet, useLocation } from 'react-router-dom';
import { ROLE_LABELS } from '@shared/domain';
import { can } from '@shared/permissions';
import type { UserDto } from '@shared/api';
import { ProblemAlert } from '@/components/ui/alert';
import { Button } from '@/components/ui/button';
import { cn } from '@/components/ui/cn';
import { Loading } from '@/components/ui/states';
import { useSession, useSignedOutOnPurpose } from '@/features/auth/api/get-session';
import { useLogout } from '@/features/auth/api/logout';
import { UnsentIndicator } from '@/features/outbox/components/outbox-panel';
import { downloadUnsent } from '@/features/outbox/export-unsent';
import { isUnsent, listOutbox } from '@/features/outbox/outbox-store';
import { useOutboxSender } from '@/features/outbox/use-outbox';
import { Logo } from './logo';

function navClass({ isActive }: { isActive: boolean }) {
  return cn(
    'inline-flex min-h-11 items-center rounded-md px-3 text-sm font-medium',
    isActive ? 'bg-white/15 text-white' : 'text-brand-100 hover:bg-white/10 hover:text-white',
  );
}

function Header({ user }: { user: UserDto }) {
  const logout = useLogout();
  // Signing out with records still on this phone warns first (they are kept unless exported and cleared by the browser).
  const [unsentWarning, setUnsentWarning] = useState(0);
  // The service worker's copy of the last read answers (session, projects, holes) goes with the session.
  const forgetReads = () => void (typeof caches === 'undefined' ? undefined : caches.delete('tl-api').catch(() => undefined));
  const signOut = async () => {
    const unsent = (await listOutbox().catch(() => [])).filter(isUnsent).length;
    if (unsent > 0 && unsentWarning === 0) setUnsentWarning(unsent);
    else logout.mutate(undefined, { onSuccess: forgetReads });
  };
  return (
    <header className="bg-brand-900 text-white">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-4 px-3 py-1 sm:px-6">
        <Link to="/projects" className="flex min-h-11 items-center gap-2 text-lg font-semibold tracking-tight">
          <Logo className="size-7 text-brand-200" />
          Threadline
        </Link>
        <nav aria-label="Main" className="order-3 -mx-1 flex w-full gap-1 border-t border-white/10 py-1 sm:order-none sm:mx-0 sm:w-auto sm:border-0">
          <NavLink to="/projects" className={navClass}>
            Projects
          </NavLink>
          {can(user.role, 'user.manage') && (
            <NavLink to="/users" className={navClass}>
              Users
            </NavLink>
          )}
          {can(user.role, 'mail.admin') && (
            <NavLink to="/mail" className={navClass}>
              Mail
            </NavLink>
          )}
        </nav>
        <div className="ml-auto flex items-center gap-3">
          <UnsentIndicator />
          <div className="min-w-0 text-right leading-tight">
            <p className="max-w-40 truncate text-sm font-medium sm:max-w-none" data-testid="signed-in-user">
              {user.name}
            </p>
            <p className="text-xs text-brand-200">{ROLE_LABELS[user.role]}</p>
          </div>
          <Button variant="inverse" size="sm" busy={logout.isPending} onClick={() => void signOut()}>
            Sign out
          </Button>
        </div>
      </div>
      {unsentWarning > 0 && (
        <div role="alertdialog" aria-label="Unsent records" className="mx-auto max-w-7xl px-3 pb-3 sm:px-6">
          <div className="space-y-2 rounded-lg bg-caution-100 p-3 text-sm text-caution-900">
            <p className="font-semibold">
              {unsentWarning} record{unsentWarning === 1 ? ' is' : 's are'} on this phone only and not yet on the server.
            </p>
            <p>Signing out keeps them on this phone; they are sent the next time Threadline is open here with a connection. Export them first if this phone is shared or leaving the site.</p>
            <div className="flex flex-wrap gap-2">
              <Button size="sm" variant="secondary" onClick={() => void downloadUnsent()}>
                Export unsent
              </Button>
              <Button size="sm" busy={logout.isPending} onClick={() => logout.mutate(undefined, { onSuccess: forgetReads })}>
                Keep them here and sign out
              </Button>
              <Button size="sm" variant="ghost" onClick={() => setUnsentWarning(0)}>
                Stay signed in
              </Button>
            </div>
          </div>
        </div>
      )}
      {logout.isError && (
        <div className="mx-auto max-w-7xl px-3 pb-2 sm:px-6">
          <ProblemAlert error={logout.error} />
        </div>
      )}
    </header>
  );
}

/**
 * The signed-in frame: checks the session (sending signed-out visitors to sign in, then back),
 * shows the header, and renders the page.
 */
export function AppShell() {
  const session = useSession();
  useOutboxSender();
  const signedOutOnPurpose = useSignedOutOnPurpose();
  const location = useLocation();

  if (session.isPending) return <Loading label="Opening Threadline…" className="justify-center py-24" />;
  if (session.isError) {
    return (
      <main className="mx-auto max-w-lg space-y-4 p-6">
        <ProblemAlert error={session.error} />
        <Button onClick={() => void session.refetch()}>Try again</Button>
      </main>
    );
  }
  if (!session.data) {
    // After an expiry, come back here once signed in again; after "Sign out", start afresh.
    const next = `${location.pathname}${location.search}`;
    const back = !signedOutOnPurpose && next !== '/' && next !== '/projects';
    return <Navigate to={back ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'} replace />;
  }

  return (
    <div className="flex min-h-dvh flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2 focus:text-brand-800">
        Skip to content
      </a>
      <Header user={session.data.user} />
      <main id="main" className="mx-auto w-full max-w-7xl grow px-3 py-4 sm:px-6 sm:py-6">
        <Suspense fallback={<Loading label="Loading page…" />}>
          <Outlet />
        </Suspense>
      </main>
      <footer className="mx-auto w-full max-w-7xl px-3 pb-4 text-xs text-ink-500 sm:px-6">
        Threadline is a design and record-keeping aid. Clearances must be checked by a licensed engineer; call the one-call centre before any digging.
      </footer>
    </div>
  );
}
