import { useCallback, type ReactNode } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation, useNavigate } from 'react-router-dom';
import type { User } from '@shared/schemas/auth';
import { getMeQueryOptions, useMe } from '@/lib/me';
import { paths } from '@/config/paths';
import { PageSpinner } from '@/components/ui/spinner';
import { leaveDevice } from './offline-cache';
import { currentQueue } from './offline-queue';
import { CloudOff } from 'lucide-react';
import { EmptyState, ErrorState } from '@/components/ui/states';

const meKey = getMeQueryOptions().queryKey;

/**
 * True after the user pressed "Sign out": the route guard then sends them to a plain sign-in
 * page. After an expired session (a 401) it stays false, so sign-in brings them back (?next=).
 */
let signedOutOnPurpose = false;

/**
 * True from "Sign out" until the sign-in page has said so ("You have signed out"). Kept here,
 * not in the URL or the history entry: the route guard of the page being left may replace
 * the navigation, and a reload must not say it again.
 */
let signedOutNotice = false;

/** Whether the person has just signed out on purpose (for the sign-in page to confirm it). */
export function justSignedOut(): boolean {
  return signedOutNotice;
}

/** The sign-in page has shown the confirmation: a later visit does not repeat it. */
export function forgetSignedOutNotice(): void {
  signedOutNotice = false;
}

/** Drops everything cached for the previous user, keeping only the session query itself. */
function forgetUserData(queryClient: QueryClient): void {
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== meKey[0] });
}

/** The session ended on the server (any 401): forget the user; the route guard does the rest. */
export function handleSessionEnded(queryClient: QueryClient): void {
  signedOutOnPurpose = false;
  queryClient.setQueryData(meKey, null);
}

/** After sign-in or sign-up: cache the user; the auth pages then redirect on their own. */
export function useStartSession() {
  const queryClient = useQueryClient();
  return useCallback(
    (user: User) => {
      signedOutOnPurpose = false;
      signedOutNotice = false;
      forgetUserData(queryClient);
      queryClient.setQueryData(meKey, user);
    },
    [queryClient],
  );
}

export function useEndSession() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useCallback(() => {
    // Saved data goes with the user, unless writes still wait: they stay for their next sign-in.
    const { userId, items } = currentQueue();
    if (userId) void leaveDevice(userId, items.length > 0);
    // The router renders route changes in a transition, so the guard on the page being left
    // may still see the user vanish; the flag tells it not to add a ?next= back to that page.
    signedOutOnPurpose = true;
    signedOutNotice = true;
    void navigate(paths.auth.signIn.getHref(), { replace: true });
    queryClient.setQueryData(meKey, null);
    forgetUserData(queryClient);
  }, [navigate, queryClient]);
}

/** The signed-in user; only call below <RequireAuth>, where it is known to be present. */
export function useUser(): User {
  const { data } = useMe();
  if (!data) throw new Error('useUser() needs a signed-in user (use it inside <RequireAuth>)');
  return data;
}

/** Route guard: shows its children only to a signed-in user, else goes to sign-in with ?next=. */
export function RequireAuth({ children }: { children?: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending && me.fetchStatus === 'paused') {
    // No signal and no session known on this device (nobody signed in, or they signed out).
    return (
      <EmptyState
        icon={<CloudOff aria-hidden className="size-6" />}
        title="No signal: sign in when you are back online"
        titleAs="h1"
      >
        Signing in needs the network. Anything waiting to be sent stays on this phone.
      </EmptyState>
    );
  }
  if (me.isPending) return <PageSpinner label="Checking your session…" />;
  if (me.isError && me.data === undefined) {
    return (
      <ErrorState
        title="Could not check your session"
        error={me.error}
        onRetry={() => void me.refetch()}
      />
    );
  }
  if (!me.data) {
    const next = signedOutOnPurpose ? null : `${location.pathname}${location.search}`;
    return <Navigate to={paths.auth.signIn.getHref(next)} replace />;
  }
  return children ?? <Outlet />;
}
