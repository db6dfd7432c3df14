import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth';

/** Minutes a password-reset link stays usable. */
export const passwordResetValidMinutes = 60;

/** POST /api/auth/password-reset */
export const requestPasswordResetInputSchema = z.object({ email: emailSchema }).strict();
export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetInputSchema>;

/** POST /api/auth/password-reset/:token */
export const completePasswordResetInputSchema = z.object({ password: passwordSchema }).strict();
export type CompletePasswordResetInput = z.infer<typeof completePasswordResetInputSchema>;

/** The one answer to a reset request, whether or not an account uses the address. */
export const passwordResetRequestedMessage =
  'If a Headroom account uses that e-mail, a link to set a new password is on its way. It works for an hour.';

/** Error codes of GET/POST /api/auth/password-reset/:token (404). */
export const passwordResetErrorCodes = {
  notFound: 'reset_not_found',
  expired: 'reset_expired',
  used: 'reset_used',
} as const;
