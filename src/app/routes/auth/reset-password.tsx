import { useState } from 'react';
import { flushSync } from 'react-dom';
import { useNavigate, useParams } from 'react-router-dom';
import {
  passwordResetErrorCodes as codes,
  passwordResetValidMinutes,
} from '@shared/schemas/password-reset';
import { paths } from '@/config/paths';
import { usePasswordReset } from '@/features/auth/api/get-password-reset';
import { AuthCard } from '@/features/auth/components/auth-card';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';
import { isApiError } from '@/lib/api-client';
import { ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState, NotFoundState } from '@/components/ui/states';

// The server's message repeats the title; the page says what to do next instead.
const refusals: Record<string, { title: string; text: string }> = {
  [codes.notFound]: {
    title: 'This link is not valid',
    text: 'Check that the whole link was copied from the mail, or ask for a new one.',
  },
  [codes.expired]: {
    title: 'This link has expired',
    text: `Links to set a new password work for ${passwordResetValidMinutes} minutes. Ask for a new one.`,
  },
  [codes.used]: {
    title: 'This link has been used',
    text: 'Each link works once. Ask for a new one if you still need to set a password.',
  },
};

function ResetLink({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = usePasswordReset(token);

  if (reset.isPending) return <PageSpinner label="Checking the link…" />;
  if (reset.isError) {
    const { error } = reset;
    if (isApiError(error) && error.status === 404) {
      return (
        <NotFoundState
          title={refusals[error.code]?.title ?? 'This link cannot be used'}
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
          {refusals[error.code]?.text ?? error.message}
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
          For <span className="font-semibold break-words">{reset.data.email}</span>
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
