// Invitation payloads: an owner invites an e-mail into a role; the invitee accepts, either signed in
// with the invited address (empty body) or by signing up with a name and a password.
import { z } from 'zod';
import { emailSchema, newPasswordSchema, personNameSchema } from './common';
import { memberRoleSchema } from './member';

export const createInvitationSchema = z.object({ email: emailSchema, role: memberRoleSchema });
export type CreateInvitation = z.infer<typeof createInvitationSchema>;

/** Invitation tokens are 32 random bytes in base64url (43 characters). */
export const invitationTokenSchema = z
  .string()
  .regex(/^[A-Za-z0-9_-]{43}$/, 'Not a valid invitation link');

export const invitationParamsSchema = z.object({ token: invitationTokenSchema });

export const signUpFromInvitationSchema = z.object({ name: personNameSchema, password: newPasswordSchema });
export type SignUpFromInvitation = z.infer<typeof signUpFromInvitationSchema>;

/**
 * Accepting: an empty object when signed in with the invited address; name + password to sign up.
 * Both fields are optional here; {@link signUpFromInvitationSchema} then demands them when there is no session.
 */
export const acceptInvitationSchema = z
  .object({ name: personNameSchema.optional(), password: newPasswordSchema.optional() })
  .strict();
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;
