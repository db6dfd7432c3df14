import { useParams } from 'react-router-dom';
import { emailChangeErrorCodes as codes } from '@shared/schemas/account';
import { paths } from '@/config/paths';
import { useConfirmEmailChange } from '@/features/account/api/confirm-email-change';
import { useEmailChange } from '@/features/account/api/get-email-change';
import { AuthCard } from '@/features/auth/components/auth-card';
import { useMe } from '@/lib/me';
import { isApiError } from '@/lib/api-client';
import { Alert } from '@/components/ui/alert';
import { Button, ButtonLink } from '@/components/ui/button';
import { PageSpinner } from '@/components/ui/spinner';
import { ErrorState, NotFoundState } from '@/components/ui/states';

const refusals: Record<string, string> = {
  [codes.notFound]: 'Check that the whole link was copied from the mail.',
  [codes.expired]: 'Ask for a new one from your account page.',
  [codes.used]: 'Each link works once. Your address may already be changed: sign in to see.',
};

/** "/confirm-email/:token": the page behind the link mailed to a new address. */
export function ConfirmEmailRoute() {
  const { token = '' } = useParams();
  const me = useMe();
  const change = useEmailChange(token);
  const confirm = useConfirmEmailChange();
  const next = me.data ? paths.account.getHref() : paths.auth.signIn.getHref();

  let body;
  if (change.isPending) body = <PageSpinner label="Checking the link…" />;
  else if (change.isError) {
    const { error } = change;
    body =
      isApiError(error) && error.status === 404 ? (
        <NotFoundState
          title="This link cannot be used"
          titleAs="h1"
          actions={<ButtonLink to={next}>{me.data ? 'Your account' : 'Sign in'}</ButtonLink>}
        >
          {error.message} {refusals[error.code] ?? ''}
        </NotFoundState>
      ) : (
        <ErrorState
          title="Could not check the link"
          titleAs="h1"
          error={error}
          onRetry={() => void change.refetch()}
        />
      );
  } else if (confirm.isSuccess) {
    body = (
      <AuthCard title="Address changed" lead={<>Headroom now uses {confirm.data.email}.</>}>
        <div className="flex flex-col gap-4">
          <Alert tone="ok">Sign in with {confirm.data.email} from now on.</Alert>
          <ButtonLink to={next}>{me.data ? 'Back to your account' : 'Sign in'}</ButtonLink>
        </div>
      </AuthCard>
    );
  } else {
    body = (
      <AuthCard
        title="Confirm your new address"
        lead={
          <>
            Use <span className="font-semibold break-all">{change.data.email}</span> for your
            Headroom account?
          </>
        }
      >
        <div className="flex flex-col gap-4">
          {confirm.isError && <Alert tone="error">{confirm.error.message}</Alert>}
          <Button pending={confirm.isPending} onClick={() => confirm.mutate(token)}>
            Confirm this address
          </Button>
        </div>
      </AuthCard>
    );
  }
  return (
    <>
      <title>Confirm your address · Headroom</title>
      {body}
    </>
  );
}
