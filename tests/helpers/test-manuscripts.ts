// Manuscripts for the tests in the test database: one factory for a manuscript with members (unique slug, the title as
// given), the standard team of owner, author, coauthor, site admin and outsider, and a frozen snapshot row.
import { figures, manuscripts, memberships, results, snapshots, type Manuscript, type ManuscriptStatus, type MemberRole } from '@/db/schema';
import type { TaskSpec } from '@/lib/physics/schemas';
import { testDb, uniqueTag } from './db';
import { createTestUser, type TestUser } from './test-users';

/** A member to add: a user (only the id matters) in a role. */
export interface TestMember {
  user: { id: string };
  role: MemberRole;
}

function slugOf(title: string, tag: string): string {
  return `${title.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'manuscript'}-${tag}`;
}

/**
 * Create a manuscript with a unique slug and the given members; the first owner is recorded as its creator.
 *
 * @param options.owner - shorthand for one member in the role 'owner' (put before `members`)
 * @example
 * const manuscript = await createTestManuscript({ title: 'Bad input', members: [{ user: owner, role: 'owner' }] });
 */
export async function createTestManuscript({
  title = 'Test manuscript',
  owner,
  members = [],
  status = 'draft',
  archived = false,
}: {
  title?: string;
  owner?: { id: string };
  members?: TestMember[];
  status?: ManuscriptStatus;
  archived?: boolean;
} = {}): Promise<Manuscript> {
  const everyone: TestMember[] = owner ? [{ user: owner, role: 'owner' }, ...members] : members;
  const creator = everyone.find((member) => member.role === 'owner');
  const [manuscript] = await testDb
    .insert(manuscripts)
    .values({
      title,
      slug: slugOf(title, uniqueTag()),
      abstract: 'An abstract written by a test.',
      status,
      archivedAt: archived ? new Date() : null,
      createdById: creator?.user.id ?? null,
    })
    .returning();
  if (everyone.length > 0) {
    await testDb
      .insert(memberships)
      .values(everyone.map(({ user, role }) => ({ manuscriptId: manuscript.id, userId: user.id, role })));
  }
  return manuscript;
}

/** Make a user a member of a manuscript in a role. */
export async function addTestMember({ manuscriptId, userId, role }: { manuscriptId: string; userId: string; role: MemberRole }): Promise<void> {
  await testDb.insert(memberships).values({ manuscriptId, userId, role });
}

export interface TestTeam {
  manuscript: Manuscript;
  owner: TestUser;
  author: TestUser;
  coauthor: TestUser;
  /** A site admin who is not a member. */
  admin: TestUser;
  /** A signed-in user with no membership. */
  outsider: TestUser;
}

/**
 * A manuscript with an owner, an author and a coauthor, plus a non-member site admin and an outsider.
 *
 * @example
 * const { manuscript, author } = await createTestTeam({ title: 'Runs API' });
 */
export async function createTestTeam({ title = 'Team manuscript' }: { title?: string } = {}): Promise<TestTeam> {
  const owner = await createTestUser({ label: 'owner' });
  const author = await createTestUser({ label: 'author' });
  const coauthor = await createTestUser({ label: 'coauthor' });
  const admin = await createTestUser({ role: 'admin', label: 'admin' });
  const outsider = await createTestUser({ label: 'outsider' });
  const manuscript = await createTestManuscript({
    title,
    owner,
    members: [
      { user: author, role: 'author' },
      { user: coauthor, role: 'coauthor' },
    ],
  });
  return { manuscript, owner, author, coauthor, admin, outsider };
}

/** A valid small spectrum spec for rows that only need to exist; nothing computes it. */
const ROW_SPEC: TaskSpec = { task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.25 }, tubes: [], levels: 4 };

/** Freeze one snapshot v1 for the manuscript (figure + result + snapshot rows, no solver run), as the figures step would. */
export async function addTestSnapshot({ manuscriptId }: { manuscriptId: string }): Promise<void> {
  const tag = uniqueTag();
  const [figure] = await testDb
    .insert(figures)
    .values({ manuscriptId, label: `fig-${tag}`, kind: 'spectrum', params: ROW_SPEC })
    .returning();
  const [result] = await testDb
    .insert(results)
    .values({
      inputHash: `test-input-${tag}`,
      solverVersion: 'test',
      params: ROW_SPEC,
      data: {},
      diagnostics: {},
      resultHash: `test-result-${tag}`,
    })
    .returning();
  await testDb.insert(snapshots).values({
    figureId: figure.id,
    manuscriptId,
    version: 1,
    kind: 'spectrum',
    label: figure.label,
    caption: '',
    params: ROW_SPEC,
    solverVersion: 'test',
    resultId: result.id,
    resultHash: result.resultHash,
  });
}
