// An invitation link: GET shows what it offers (the token is the secret, no session needed);
// POST accepts it, signed in with the invited address (empty body) or by signing up with name + password.
import { acceptInvitation, getInvitationByToken } from '@/db/queries/invitations';
import { hashPassword } from '@/lib/auth/password';
import { conflict, notFound, zodFieldErrors, HttpError } from '@/lib/http/errors';
import { route } from '@/lib/http/handler';
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
      throw new HttpError(400, 'Enter your name and a password to create your account', zodFieldErrors(signUp.error));
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
