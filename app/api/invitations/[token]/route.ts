// An invitation link: GET shows what it offers (the token is the secret, no session needed);
// POST accepts it, signed in with the invited address (empty body) or by signing up with name + password.
import { hashPassword } from '@/lib/auth/password';
import { conflict, invalid, notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { acceptInvitation } from '@/lib/invitations/accept-invitation';
import { getInvitationByToken } from '@/lib/invitations/get-invitation';
import { fieldMessages } from '@/lib/validation-fields';
import {
  acceptInvitationSchema,
  invitationParamsSchema,
  signUpFromInvitationSchema,
} from '@/lib/validations/invitation';

export const GET = route({ params: invitationParamsSchema, auth: 'optional' }, async ({ params }) => {
  const invitation = await getInvitationByToken({ token: params.token });
  if (!invitation) throw notFound('This invitation does not exist or was replaced by a newer one');
  return { invitation };
});

export const POST = route(
  { params: invitationParamsSchema, body: acceptInvitationSchema, auth: 'optional', status: 201 },
  async ({ params, body, user }) => {
    if (user) return { accepted: await acceptInvitation({ token: params.token, user }) };
    const signUp = signUpFromInvitationSchema.safeParse(body);
    if (!signUp.success) {
      throw invalid('Enter your name and a password to create your account', fieldMessages(signUp.error.issues));
    }
    // Check the token before spending bcrypt time on a password: an unknown or spent token costs no hashing.
    const invitation = await getInvitationByToken({ token: params.token });
    if (!invitation) throw notFound('This invitation does not exist or was replaced by a newer one');
    if (invitation.acceptedAt) throw conflict('This invitation has already been used');
    if (invitation.expired) throw conflict('This invitation has expired; ask an owner of the manuscript to invite you again');
    if (invitation.accountExists) throw conflict('An account already uses this e-mail address; sign in to accept the invitation');
    const passwordHash = await hashPassword(signUp.data.password);
    const accepted = await acceptInvitation({ token: params.token, signUp: { name: signUp.data.name, passwordHash } });
    return { accepted };
  },
);
