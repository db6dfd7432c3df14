import { SignInForm } from '@/features/auth/components/sign-in-form';
import { AuthPage } from './auth-page';

export function SignInRoute() {
  return (
    <>
      <title>Sign in · Headroom</title>
      <AuthPage title="Sign in" lead="Back to your builds.">
        {(next) => <SignInForm next={next} />}
      </AuthPage>
    </>
  );
}
