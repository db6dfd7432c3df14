/**
 * The signed-in person's own account: their name, their e-mail address (changed only once
 * the new address confirms, by a mailed link) and their password (changed with the current
 * one; every other session ends).
 */
import { z } from 'zod';
import { displayNameSchema, emailSchema, passwordSchema } from './auth';

/** Asked before the e-mail or password changes: whoever holds an open session is not enough. */
const currentPasswordSchema = z
  .string({ message: 'Enter your current password' })
  .min(1, { message: 'Enter your current password' })
  .max(256, { message: 'Use at most 256 characters' });

/** PATCH /api/me */
export const updateProfileInputSchema = z.object({ displayName: displayNameSchema }).strict();
export type UpdateProfileInput = z.infer<typeof updateProfileInputSchema>;

/** POST /api/me/email */
export const changeEmailInputSchema = z
  .object({ email: emailSchema, currentPassword: currentPasswordSchema })
  .strict();
export type ChangeEmailInput = z.infer<typeof changeEmailInputSchema>;

/** PUT /api/me/password */
export const changePasswordInputSchema = z
  .object({ currentPassword: currentPasswordSchema, newPassword: passwordSchema })
  .strict();
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

/** Hours a link to confirm a new e-mail address works. */
export const emailChangeValidHours = 24;

/** The one answer to an e-mail change request, whether or not the address is free. */
export const emailChangeRequestedMessage = (email: string) =>
  `To finish, follow the link we sent to ${email}. It works for ${emailChangeValidHours} hours; until then your address stays as it is.`;

/** Error codes of GET/POST /api/email-changes/:token (404), and the 409 on confirming. */
export const emailChangeErrorCodes = {
  notFound: 'email_change_not_found',
  expired: 'email_change_expired',
  used: 'email_change_used',
  taken: 'email_taken',
} as const;

/** GET /api/email-changes/:token */
export type EmailChangePreview = { email: string; expiresAt: string };
