import { Alert } from './alert';

/** The form-level error (not tied to one field), e.g. wrong e-mail or password, rate limit. */
export function FormError({ message }: { message?: string }) {
  if (!message) return null;
  return <Alert tone="error">{message}</Alert>;
}
