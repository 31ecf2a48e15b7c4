// An invitation link: GET shows what it offers (the token is the secret, no session needed);
// POST accepts it, signed in with the invited address (empty body) or by signing up with name + password.
import { acceptInvitation, getInvitationByToken } from '@/db/queries/invitations';
import { hashPassword } from '@/lib/auth/password';
import { notFound, zodFieldErrors, HttpError } from '@/lib/http/errors';
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
    const passwordHash = await hashPassword(signUp.data.password);
    const accepted = await acceptInvitation({ token: params.token, signUp: { name: signUp.data.name, passwordHash } });
    return { accepted };
  },
);
