import { SignUpForm } from '@/features/auth/components/sign-up-form';
import { AuthPage } from './auth-page';

export function SignUpRoute() {
  return (
    <>
      <title>Create account · Headroom</title>
      <AuthPage title="Create your account" lead="Plan the build, keep the crew on the same page.">
        {(next) => <SignUpForm next={next} />}
      </AuthPage>
    </>
  );
}
