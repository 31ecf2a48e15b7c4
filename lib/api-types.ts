// The JSON shapes our API answers with, as the client sees them (dates arrive as ISO strings).
// Shared by hooks/ and client components so that both ends agree on field names.
import type { ManuscriptStatus, MemberRole } from '@/db/schema';
import type { ManuscriptAction } from '@/lib/authz/manuscript-access';

export interface ManuscriptListItemJson {
  id: string;
  slug: string;
  title: string;
  status: ManuscriptStatus;
  archivedAt: string | null;
  updatedAt: string;
  role: MemberRole | null;
  memberCount: number;
}

export interface ManuscriptJson {
  id: string;
  slug: string;
  title: string;
  abstract: string;
  status: ManuscriptStatus;
  archivedAt: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface ManuscriptDetailJson {
  manuscript: ManuscriptJson;
  role: MemberRole;
  memberRole: MemberRole | null;
  viaAdmin: boolean;
  snapshotCount: number;
  permissions: Record<ManuscriptAction, boolean>;
}

export interface MemberJson {
  userId: string;
  name: string | null;
  email: string;
  role: MemberRole;
  joinedAt: string;
}

export interface PendingInvitationJson {
  id: string;
  email: string;
  role: MemberRole;
  invitedByName: string | null;
  createdAt: string;
  expiresAt: string;
}

export interface InvitationDetailsJson {
  id: string;
  email: string;
  role: MemberRole;
  manuscriptId: string;
  manuscriptSlug: string;
  manuscriptTitle: string;
  invitedByName: string | null;
  expiresAt: string;
  acceptedAt: string | null;
  expired: boolean;
  accountExists: boolean;
}

export interface AcceptedInvitationJson {
  manuscriptId: string;
  manuscriptSlug: string;
  role: MemberRole;
  userId: string;
  email: string;
  accountCreated: boolean;
}
