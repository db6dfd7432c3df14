import { useEffect, useState, type ReactNode } from 'react';
import { Navigate, useSearchParams } from 'react-router-dom';
import { safeNext } from '@/config/paths';
import { useMe } from '@/lib/me';
import { PageSpinner } from '@/components/ui/spinner';
import { HeadroomMark } from '@/components/ui/logo';
import { Alert } from '@/components/ui/alert';
import { forgetSignedOutNotice, justSignedOut } from '@/lib/auth';

/**
 * The frame of the sign-in and sign-up pages. A signed-in visitor (including one who just
 * signed in here) is sent on to `?next=` or the builds list.
 */
export function AuthPage({
  title,
  lead,
  children,
}: {
  title: string;
  lead: string;
  children: (next: string | null) => ReactNode;
}) {
  const [params] = useSearchParams();
  const next = params.get('next');
  const me = useMe();
  // Just signed out here: say it worked, once (a reload or a later visit does not repeat it).
  const [signedOut] = useState(justSignedOut);
  useEffect(() => {
    if (signedOut) forgetSignedOutNotice();
  }, [signedOut]);

  if (me.data) return <Navigate to={safeNext(next)} replace />;
  if (me.isPending) return <PageSpinner />;

  return (
    <div className="mx-auto w-full max-w-md">
      {signedOut && (
        <Alert tone="ok" className="mb-4" title="You have signed out">
          Nobody can open your builds from this browser until you sign in again.
        </Alert>
      )}
      <div className="rounded-lg border border-rule bg-sheet p-5 shadow-sm sm:p-7">
        <div className="mb-5 flex items-center gap-3">
          <HeadroomMark className="size-10" />
          <div>
            <h1 className="text-2xl leading-tight font-bold">{title}</h1>
            <p className="text-ink-2">{lead}</p>
          </div>
        </div>
        {children(next)}
      </div>
    </div>
  );
}
