// An invitation link: GET shows what it offers (the token is the secret, no session needed);
// POST accepts it, signed in with the invited address (empty body) or by signing up with name + password.
import { hashPassword } from '@/lib/auth/password';
import { invalid, notFound } from '@/lib/domain-error';
import { route } from '@/lib/http/handler';
import { acceptInvitation, assertOpenForSignUp } from '@/lib/invitations/accept-invitation';
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
    await assertOpenForSignUp({ token: params.token });
    const passwordHash = await hashPassword(signUp.data.password);
    const accepted = await acceptInvitation({ token: params.token, signUp: { name: signUp.data.name, passwordHash } });
    return { accepted };
  },
);
