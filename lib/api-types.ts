// The one home of the JSON our API answers with and of the data pages hand to client components, derived from the Drizzle
// row types and query results (`Jsonified`: dates become ISO strings) so a column change reaches handlers, loaders and hooks.
import type { PendingInvitation } from '@/db/queries/invitations';
import type { ManuscriptListItem } from '@/db/queries/manuscripts';
import type { MemberListItem } from '@/db/queries/members';
import type { NoteRevisionSummary } from '@/db/queries/notes';
import type { Figure, Manuscript, MemberRole, NoteRevision, Result, Run, Snapshot } from '@/db/schema';
import type { z } from 'zod';
import type { ManuscriptAction } from '@/lib/authz/manuscript-access';
import type { AcceptedInvitation } from '@/lib/invitations/accept-invitation';
import type { InvitationDetails } from '@/lib/invitations/get-invitation';
import type { updateFigureSchema } from '@/lib/validations/figure';

/** A server value as it arrives after JSON.stringify / JSON.parse: Date becomes an ISO string, recursively. */
export type Jsonified<T> = T extends Date
  ? string
  : T extends readonly unknown[]
    ? { [K in keyof T]: Jsonified<T[K]> }
    : T extends object
      ? { [K in keyof T]: Jsonified<T[K]> }
      : T;

/** A stored view spec (partial Vega-Lite) as the client reads it. */
export type ViewSpecJson = Record<string, unknown>;

/** A row whose `viewSpec` jsonb column is typed as the client reads it. */
type WithViewSpec<T> = Omit<T, 'viewSpec'> & { viewSpec: ViewSpecJson | null };

// Manuscripts, members and invitations

export type ManuscriptListItemJson = Jsonified<ManuscriptListItem>;
/** Body of GET /api/manuscripts. */
export type ManuscriptsBody = { manuscripts: ManuscriptListItem[] };
export type ManuscriptsResponse = Jsonified<ManuscriptsBody>;

export type ManuscriptJson = Jsonified<Pick<Manuscript, 'id' | 'slug' | 'title' | 'abstract' | 'status' | 'archivedAt' | 'createdAt' | 'updatedAt'>>;

export interface ManuscriptDetailJson {
  manuscript: ManuscriptJson;
  role: MemberRole;
  memberRole: MemberRole | null;
  viaAdmin: boolean;
  snapshotCount: number;
  permissions: Record<ManuscriptAction, boolean>;
}

/** Body of GET /api/manuscripts/[id]/members. */
export type MembersBody = { members: MemberListItem[] };
export type MemberJson = Jsonified<MemberListItem>;
export type MembersResponse = Jsonified<MembersBody>;

/** Body of GET /api/manuscripts/[id]/invitations. */
export type PendingInvitationsBody = { invitations: PendingInvitation[] };
export type PendingInvitationJson = Jsonified<PendingInvitation>;
export type PendingInvitationsResponse = Jsonified<PendingInvitationsBody>;

export type InvitationDetailsJson = Jsonified<InvitationDetails>;
export type AcceptedInvitationJson = Jsonified<AcceptedInvitation>;

// Figures, runs, results and snapshots

/** A figure as its blocks and pages show it. */
export type FigureView = WithViewSpec<Jsonified<Pick<Figure, 'id' | 'label' | 'kind' | 'title' | 'caption' | 'params' | 'viewSpec'>>>;

/** A run as the client sees it (the API's full row carries more; these are what the UI reads). */
export type RunView = Jsonified<
  Pick<Run, 'id' | 'figureId' | 'status' | 'progress' | 'message' | 'error' | 'fromCache' | 'createdAt' | 'finishedAt' | 'params'>
>;

/** The parts of a stored result that GET /api/runs/[id] sends. */
export type RunResultBody = Pick<Result, 'id' | 'resultHash' | 'solverVersion' | 'data' | 'diagnostics'>;

/** Body of GET /api/runs/[id]: the run row and, once it succeeded, its result. */
export type RunBody = { run: Run; result: RunResultBody | null };
export type RunResponse = Jsonified<RunBody>;

/** Body of POST /api/figures/[id]/runs. */
export type StartRunBody = { run: Run; fromCache: boolean };
export type StartRunResponse = Jsonified<StartRunBody>;

/** Body of POST /api/runs/[id]/cancel. */
export type CancelRunBody = { run: Run };
export type CancelRunResponse = Jsonified<CancelRunBody>;

/** Body of POST /api/runs/[id]/freeze. */
export type FreezeRunBody = { snapshot: Snapshot };
export type FreezeRunResponse = Jsonified<FreezeRunBody>;

/** A snapshot row as the API sends it. */
export type SnapshotJson = Jsonified<Snapshot>;

/** Body of GET /api/figures/[id]: the figure row, its snapshots, its newest run and the caller's role. */
export type FigureBody = { figure: Figure; snapshots: Snapshot[]; latestRun: Run | null; role: MemberRole };
export type FigureResponse = Jsonified<FigureBody>;

/**
 * Request of PATCH /api/figures/[id] (the zod schema's input). `params` leave the kind's form as loose field values; the
 * handler validates them with the same schema.
 */
export type FigurePatch = Omit<z.input<typeof updateFigureSchema>, 'params'> & { params?: unknown };

/** Body of PATCH /api/figures/[id]. */
export type UpdateFigureBody = { figure: Figure };
export type UpdateFigureResponse = Jsonified<UpdateFigureBody>;

// Notes and their figure blocks

export type SnapshotSummary = Jsonified<Pick<Snapshot, 'id' | 'version' | 'frozenAt'>>;

/** A pinned snapshot with the data to draw it. */
export type PinnedView = WithViewSpec<Jsonified<Pick<Snapshot, 'version' | 'params' | 'caption' | 'viewSpec'>>> & {
  snapshotId: Snapshot['id'];
  data: Result['data'];
};

export interface NoteFigure {
  figure: FigureView;
  snapshots: SnapshotSummary[];
  /** The newest run in any state (shows progress or the failure reason). */
  latestRun: RunView | null;
  /** The newest succeeded run and its result data (what a block that follows the latest run draws). */
  latestResult: { run: RunView; data: Result['data']; params: Result['params'] } | null;
  /** Snapshot results for the versions the note pins. */
  pinned: Record<number, PinnedView>;
}

export interface NoteFigureData {
  manuscriptId: string;
  manuscriptSlug: string;
  /** Keyed by label; a label with no figure is absent (the block then says so). */
  figures: Record<string, NoteFigure>;
}

/** Body of GET /api/notes/[id]/revisions (the list) and of ?from=&to= (the pair). */
export type RevisionsBody = { revisions: NoteRevisionSummary[] };
export type RevisionsResponse = Jsonified<RevisionsBody>;
export type RevisionPairBody = { from: NoteRevision; to: NoteRevision };
export type RevisionPairResponse = Jsonified<RevisionPairBody>;

// The snapshot page

export interface SnapshotPageData {
  snapshot: WithViewSpec<
    Jsonified<
      Pick<
        Snapshot,
        'id' | 'version' | 'kind' | 'label' | 'caption' | 'params' | 'viewSpec' | 'solverVersion' | 'gitCommit' | 'resultHash' | 'frozenAt' | 'runId'
      >
    >
  >;
  manuscript: Pick<Manuscript, 'id' | 'slug' | 'title'>;
  figureTitle: Figure['title'];
  frozenBy: string | null;
  data: Result['data'];
  siblings: Pick<Snapshot, 'id' | 'version'>[];
  url: string;
  citation: string;
  bibtex: string;
  latex: { one: string; two: string };
}
