// One manuscript: GET (members and site admins), PATCH title/abstract/status (authors and owners),
// DELETE (owners; refused with 409 while the manuscript has a frozen snapshot).
import { countSnapshotsForManuscript, deleteManuscriptById, updateManuscript } from '@/db/queries/manuscripts';
import { allowedActions } from '@/lib/authz/manuscript-access';
import { route } from '@/lib/http/handler';
import { manuscriptParamsSchema, updateManuscriptSchema } from '@/lib/validations/manuscript';

export const GET = route({ params: manuscriptParamsSchema, manuscript: 'read' }, async ({ access }) => {
  const snapshotCount = await countSnapshotsForManuscript({ id: access.manuscript.id });
  return {
    manuscript: access.manuscript,
    role: access.role,
    memberRole: access.memberRole,
    viaAdmin: access.viaAdmin,
    snapshotCount,
    permissions: allowedActions(access.role, access.manuscript.archivedAt !== null),
  };
});

export const PATCH = route(
  { params: manuscriptParamsSchema, body: updateManuscriptSchema, manuscript: 'edit' },
  async ({ access, body }) => ({ manuscript: await updateManuscript({ id: access.manuscript.id, ...body }) }),
);

export const DELETE = route({ params: manuscriptParamsSchema, manuscript: 'delete' }, async ({ access }) => {
  await deleteManuscriptById({ id: access.manuscript.id });
  return { ok: true };
});
