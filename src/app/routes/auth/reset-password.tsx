import { useState } from 'react';
import { flushSync } from 'react-dom';
import { useNavigate, useParams } from 'react-router-dom';
import { passwordResetErrorCodes as codes } from '../../../../shared/schemas/password-reset';
import { paths } from '../../../config/paths';
import { usePasswordReset } from '../../../features/auth/api/get-password-reset';
import { AuthCard } from '../../../features/auth/components/auth-card';
import { ResetPasswordForm } from '../../../features/auth/components/reset-password-form';
import { isApiError } from '../../../lib/api-client';
import { ButtonLink } from '../../../components/ui/button';
import { PageSpinner } from '../../../components/ui/spinner';
import { ErrorState, NotFoundState } from '../../../components/ui/states';

const refusalTitles: Record<string, string> = {
  [codes.notFound]: 'This link is not valid',
  [codes.expired]: 'This link has expired',
  [codes.used]: 'This link has been used',
};

function ResetLink({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = usePasswordReset(token);

  if (reset.isPending) return <PageSpinner label="Checking the link…" />;
  if (reset.isError) {
    const { error } = reset;
    if (isApiError(error) && error.status === 404) {
      return (
        <NotFoundState
          title={refusalTitles[error.code] ?? 'This link cannot be used'}
          titleAs="h1"
          actions={
            <>
              <ButtonLink to={paths.auth.forgotPassword.getHref()}>Ask for a new link</ButtonLink>
              <ButtonLink to={paths.auth.signIn.getHref()} variant="secondary">
                Sign in
              </ButtonLink>
            </>
          }
        >
          {error.message}
        </NotFoundState>
      );
    }
    return (
      <ErrorState
        title="Could not check the link"
        titleAs="h1"
        error={error}
        onRetry={() => void reset.refetch()}
      />
    );
  }

  return (
    <AuthCard
      title="Set a new password"
      lead={
        <>
          For <span className="font-semibold break-all">{reset.data.email}</span>
        </>
      }
    >
      <ResetPasswordForm token={token} email={reset.data.email} onDone={onDone} />
    </AuthCard>
  );
}

/** "/reset-password/:token": the page behind the link in a reset mail. */
export function ResetPasswordRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  // Once the password is set, the link is used: stop showing (and re-checking) it.
  const [done, setDone] = useState(false);

  return (
    <>
      <title>Set a new password · Headroom</title>
      {done ? (
        <PageSpinner label="Signing you in…" />
      ) : (
        <ResetLink
          token={token}
          onDone={() => {
            // Drop the used link's view before the new session's cache reset re-renders it.
            flushSync(() => setDone(true));
            void navigate(paths.builds.list.getHref(), { replace: true });
          }}
        />
      )}
    </>
  );
}
