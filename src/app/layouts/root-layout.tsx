import { Suspense, useState } from 'react';
import { Link, Outlet, ScrollRestoration, useLocation } from 'react-router-dom';
import { LogOut, UserRound } from 'lucide-react';
import { useMe } from '@/lib/me';
import { useSignOut } from '@/features/auth/api/sign-out';
import { paths } from '@/config/paths';
import { currentQueue } from '@/lib/offline-queue';
import { Button, ButtonLink } from '@/components/ui/button';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { Wordmark } from '@/components/ui/logo';
import { PageSpinner } from '@/components/ui/spinner';
import { OfflineStatus } from './offline-status';

function SignOutButton() {
  const signOut = useSignOut();
  const [waiting, setWaiting] = useState(0);
  return (
    <>
      <Button
        variant="on-ink"
        size="sm"
        pending={signOut.isPending}
        icon={<LogOut aria-hidden className="size-4" />}
        onClick={() => {
          // Entries still waiting on this phone: ask before leaving them.
          const n = currentQueue().items.length;
          if (n) setWaiting(n);
          else signOut.mutate();
        }}
        title={signOut.isError ? 'Sign-out failed; try again' : undefined}
      >
        Sign out
      </Button>
      <ConfirmDialog
        open={waiting > 0}
        title="Sign out with entries waiting?"
        confirmLabel="Sign out anyway"
        tone="primary"
        pending={signOut.isPending}
        onClose={() => setWaiting(0)}
        onConfirm={() => signOut.mutate(undefined, { onSettled: () => setWaiting(0) })}
      >
        {waiting === 1 ? '1 entry has' : `${waiting} entries have`} not reached Headroom yet. They
        stay on this phone and are sent when you sign in again with this account, never with
        another.
      </ConfirmDialog>
    </>
  );
}

/** After signing in from the header, an invitation or a build page is where to come back to. */
const comesBackTo = (pathname: string) =>
  pathname.startsWith('/invite/') || pathname.startsWith(paths.builds.list.path);

function Header() {
  const me = useMe();
  const { pathname, search } = useLocation();
  // The landing and auth pages carry their own sign-in links; one per page is enough.
  const hideSignIn =
    pathname === paths.home.path ||
    pathname === paths.auth.signIn.path ||
    pathname === paths.auth.signUp.path;
  const user = me.data;
  return (
    <header className="bg-ink text-white print:hidden">
      <div className="mx-auto flex min-h-16 max-w-5xl items-center justify-between gap-3 px-4">
        <Link
          to={user ? paths.builds.list.getHref() : paths.home.getHref()}
          className="-ml-1 flex min-h-11 items-center rounded px-1"
          aria-label="Headroom, home"
        >
          <Wordmark />
        </Link>
        {user ? (
          <div className="flex min-w-0 items-center gap-2 sm:gap-3">
            <Link
              to={paths.account.getHref()}
              className="flex min-h-11 min-w-0 items-center gap-1.5 rounded px-1 text-white/85 hover:text-white hover:underline"
              title={`${user.email} — your account`}
            >
              <UserRound aria-hidden className="size-4 shrink-0" />
              <span
                className="max-w-[7.5rem] truncate sm:max-w-[14rem]"
                data-testid="signed-in-user"
              >
                {user.displayName}
              </span>
              <span className="sr-only">: your account</span>
            </Link>
            <SignOutButton />
          </div>
        ) : (
          !hideSignIn &&
          !me.isPending && (
            <ButtonLink
              to={paths.auth.signIn.getHref(comesBackTo(pathname) ? pathname + search : undefined)}
              variant="on-ink"
              size="sm"
            >
              Sign in
            </ButtonLink>
          )
        )}
      </div>
    </header>
  );
}

/** Every page: the ink header, the page in the middle, a quiet footer. */
export function RootLayout() {
  return (
    <div className="flex min-h-dvh flex-col">
      <ScrollRestoration />
      <a
        href="#main"
        className="sr-only z-50 rounded bg-white px-3 py-2 text-ink focus:not-sr-only focus:absolute focus:top-2 focus:left-2"
      >
        Skip to content
      </a>
      <Header />
      <OfflineStatus />
      <main
        id="main"
        className="mx-auto w-full max-w-5xl flex-1 px-4 py-6 sm:py-8 print:max-w-none print:p-0"
      >
        <Suspense fallback={<PageSpinner />}>
          <Outlet />
        </Suspense>
      </main>
    </div>
  );
}
