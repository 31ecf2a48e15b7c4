// GET: the invitations of a manuscript that are still pending (owners).
// Accepted and expired invitations are left out.
import { listPendingInvitations } from '@/db/queries/invitations';
import { route } from '@/lib/http/handler';
import { manuscriptParamsSchema } from '@/lib/validations/manuscript';
import type { PendingInvitationsBody } from '@/lib/api-types';

export const GET = route(
  { params: manuscriptParamsSchema, manuscript: 'manage' },
  async ({ access }) => ({ invitations: await listPendingInvitations({ manuscriptId: access.manuscript.id }) }) satisfies PendingInvitationsBody,
);
