// Membership payloads: changing a member's role (owners only), and the route parameters naming a member.
// Roles come from lib/authz/roles.ts so that client bundles never load the Drizzle schema.
import { z } from 'zod';
import { ROLES } from '@/lib/authz/roles';
import { manuscriptIdSchema, userIdSchema } from './common';

export const memberRoleSchema = z.enum(ROLES, { error: `Choose one of: ${ROLES.join(', ')}` });

export const updateMemberSchema = z.object({ role: memberRoleSchema }).strict();
export type UpdateMember = z.infer<typeof updateMemberSchema>;

export const memberParamsSchema = z.object({ id: manuscriptIdSchema, userId: userIdSchema });
