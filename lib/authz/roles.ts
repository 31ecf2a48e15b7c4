// Manuscript roles and their ranking: owner > author > coauthor, each including the rights of the next.
// Labels and one-line descriptions shown in the interface live here too, so every screen words roles the same way.
// Type-only import: this file is also bundled into client components, which must not pull in the Drizzle schema.
import type { MemberRole } from '@/db/schema';

/** All roles, most rights first (the order of the database enum `member_role`). */
export const ROLES = ['owner', 'author', 'coauthor'] as const satisfies readonly MemberRole[];
// Compile-time guard: the list above names every role of the database enum.
const everyRoleListed: Exclude<MemberRole, (typeof ROLES)[number]> extends never ? true : false = true;
void everyRoleListed;

const RANK: Record<MemberRole, number> = { owner: 3, author: 2, coauthor: 1 };

/**
 * True when `role` has at least the rights of `minimum`.
 *
 * @example
 * roleAtLeast('owner', 'author'); // true
 * roleAtLeast('coauthor', 'author'); // false
 */
export function roleAtLeast(role: MemberRole | null | undefined, minimum: MemberRole): boolean {
  if (!role) return false;
  return RANK[role] >= RANK[minimum];
}

/** The role with more rights of the two (used when an invitation meets an existing membership). */
export function higherRole(a: MemberRole, b: MemberRole): MemberRole {
  return RANK[a] >= RANK[b] ? a : b;
}

export const ROLE_LABELS: Record<MemberRole, string> = {
  owner: 'Owner',
  author: 'Author',
  coauthor: 'Coauthor',
};

export const ROLE_DESCRIPTIONS: Record<MemberRole, string> = {
  owner: 'Manages members, archives or deletes the manuscript, and does everything an author does.',
  author: 'Edits figure notes and figures, starts solver runs, and does everything a coauthor does.',
  coauthor: 'Reads the manuscript: notes, figures and snapshots.',
};

/** The same rights addressed to the person holding the role ("As coauthor, you …"), for e-mails and the dashboard. */
export const ROLE_RIGHTS_FOR_YOU: Record<MemberRole, string> = {
  owner: 'manage members, archive or delete the manuscript, and do everything an author does',
  author: 'edit figure notes and figures, start solver runs, and do everything a coauthor does',
  coauthor: 'read the manuscript: its notes, figures and snapshots',
};
