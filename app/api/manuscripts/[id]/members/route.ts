// GET: the members of a manuscript with their roles (any member). POST: an owner invites an e-mail address
// into a role (201); the invitation e-mail carries the acceptance link.
import { deleteInvitationById } from '@/db/queries/invitations';
import { listMembers } from '@/db/queries/members';
import { upstreamFailed } from '@/lib/domain-error';
import { createInvitation, INVITATION_LIFETIME_MS } from '@/lib/invitations/create-invitation';
import { invitationMail } from '@/lib/invitations/invitation-mail';
import { appUrl } from '@/lib/http/app-url';
import { route } from '@/lib/http/handler';
import { sendMail } from '@/lib/mail/send-mail';
import { forgetHit, hit } from '@/lib/rate-limit/hit';
import { INVITATIONS_PER_MANUSCRIPT } from '@/lib/rate-limit/limits';
import { createInvitationSchema } from '@/lib/validations/invitation';
import { manuscriptParamsSchema } from '@/lib/validations/manuscript';
import type { MembersBody } from '@/lib/api-types';

export const GET = route(
  { params: manuscriptParamsSchema, manuscript: 'read' },
  async ({ access }) => ({ members: await listMembers({ manuscriptId: access.manuscript.id }) }) satisfies MembersBody,
);

export const POST = route(
  { params: manuscriptParamsSchema, body: createInvitationSchema, manuscript: 'manage', status: 201 },
  async ({ request, user, access, body }) => {
    const counted = await hit({
      ...INVITATIONS_PER_MANUSCRIPT,
      key: access.manuscript.id,
      message: 'This manuscript has sent as many invitations as allowed today; try again tomorrow',
    });
    const { invitation, token } = await createInvitation({
      manuscriptId: access.manuscript.id,
      email: body.email,
      role: body.role,
      invitedById: user.id,
    });
    const mail = invitationMail({
      url: `${appUrl(request)}/invite/${token}`,
      inviterName: user.name || user.email,
      manuscriptTitle: access.manuscript.title,
      role: body.role,
      days: Math.round(INVITATION_LIFETIME_MS / 86_400_000),
    });
    try {
      await sendMail({ to: invitation.email, ...mail });
    } catch (error) {
      console.error(error);
      await deleteInvitationById({ id: invitation.id });
      await forgetHit(counted);
      throw upstreamFailed('The invitation e-mail could not be sent; try again in a moment');
    }
    const { id, email, role, createdAt, expiresAt } = invitation;
    return { invitation: { id, email, role, createdAt, expiresAt } };
  },
);
