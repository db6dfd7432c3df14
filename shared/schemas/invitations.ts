import { z } from 'zod';
import type { Role } from '@shared/permissions';
import { displayNameSchema, emailSchema, passwordSchema } from './auth';
import { roleSchema } from './builds';

export { invitationValidDays } from '@shared/invitations/rules';

/** POST /api/builds/:buildId/invitations */
export const createInvitationInputSchema = z
  .object({ email: emailSchema, role: roleSchema })
  .strict();
export type CreateInvitationInput = z.infer<typeof createInvitationInputSchema>;

/**
 * POST /api/invitations/:token/accept. Signed in: an empty body. Signed out:
 * a password and a name create the account for the invited address.
 */
export const acceptInvitationInputSchema = z
  .object({ password: passwordSchema.optional(), displayName: displayNameSchema.optional() })
  .strict()
  .superRefine((v, ctx) => {
    if (v.password !== undefined && v.displayName === undefined) {
      ctx.addIssue({ code: 'custom', path: ['displayName'], message: 'Enter your name' });
    }
    if (v.displayName !== undefined && v.password === undefined) {
      ctx.addIssue({ code: 'custom', path: ['password'], message: 'Enter a password' });
    }
  });
export type AcceptInvitationInput = z.infer<typeof acceptInvitationInputSchema>;

export const invitationStatuses = ['pending', 'expired'] as const;
export type InvitationStatus = (typeof invitationStatuses)[number];

/** An open invitation as the owner sees it (never its token). */
export type Invitation = {
  id: string;
  email: string;
  role: Role;
  status: InvitationStatus;
  invitedBy: string | null;
  createdAt: string;
  lastSentAt: string;
  sendCount: number;
  expiresAt: string;
};

/** GET /api/invitations/:token — what the invited person sees before accepting. */
export type InvitationPreview = {
  buildId: string;
  buildName: string;
  role: Role;
  email: string;
  inviterName: string | null;
  /** The invited address already has an account: sign in, then accept. */
  accountExists: boolean;
  expiresAt: string;
};

/** Error codes of the public invitation routes (all 404 but the last two). */
export const invitationErrorCodes = {
  notFound: 'invitation_not_found',
  expired: 'invitation_expired',
  revoked: 'invitation_revoked',
  used: 'invitation_used',
  /** 403: signed in with an account whose e-mail is not the invited one. */
  otherAccount: 'invitation_other_account',
  /** 401: signed out and no password/displayName given. */
  signInToAccept: 'sign_in_to_accept',
} as const;
