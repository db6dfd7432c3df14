import { useLocation } from 'react-router-dom';
import { AuthCard } from '@/features/auth/components/auth-card';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

/** "/forgot-password": ask for a link to set a new password (linked from sign-in). */
export function ForgotPasswordRoute() {
  // The sign-in page hands over what was typed there, so it need not be typed twice.
  const state: unknown = useLocation().state;
  const email =
    state && typeof state === 'object' && 'email' in state && typeof state.email === 'string'
      ? state.email
      : '';
  return (
    <>
      <title>Forgot your password · Headroom</title>
      <AuthCard title="Forgot your password?" lead="We'll e-mail you a link to set a new one.">
        <ForgotPasswordForm initialEmail={email} />
      </AuthCard>
    </>
  );
}
