// One member: PATCH changes the role (owners), DELETE removes the member (owners; any member may remove
// themselves). Neither may leave the manuscript without an owner (409).
import { removeMember, updateMemberRole } from '@/db/queries/members';
import { authorizeManuscript } from '@/lib/authz/manuscript-access';
import { route } from '@/lib/http/handler';
import { memberParamsSchema, updateMemberSchema } from '@/lib/validations/member';

export const PATCH = route(
  { params: memberParamsSchema, body: updateMemberSchema, manuscript: 'manage' },
  async ({ access, params, body }) => ({
    membership: await updateMemberRole({ manuscriptId: access.manuscript.id, userId: params.userId, role: body.role }),
  }),
);

export const DELETE = route({ params: memberParamsSchema, manuscript: 'read' }, async ({ user, access, params }) => {
  // Leaving is open to every member; removing someone else is an owner's act.
  if (params.userId !== user.id) await authorizeManuscript({ user, manuscriptId: params.id, need: 'manage' });
  await removeMember({ manuscriptId: access.manuscript.id, userId: params.userId });
  return { ok: true };
});
