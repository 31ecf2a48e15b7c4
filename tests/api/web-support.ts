// Support for the foundation web tests (API and browser), on top of tests/helpers: people, manuscripts and
// snapshots in the test database, an HTTP client whose cookie jar signs in through next-auth, and mailbox reading.
import { and, count, eq } from 'drizzle-orm';
import { db } from '@/db';
import {
  figures,
  invitations,
  manuscripts,
  memberships,
  results,
  snapshots,
  users,
  type MemberRole,
} from '@/db/schema';
import { APP_URL } from '../helpers/app';
import { createTestUser, RUN_TAG, TEST_PASSWORD } from '../helpers/db';
import { linksIn, waitForMailTo as waitForStoredMail, type StoredMessage } from '../helpers/mail';
import { listMessages } from '@/lib/mail/mailbox';

export { APP_URL };

/** A tag unique to this test run, so rows from earlier runs (snapshots can never be deleted) never collide. */
export const RUN = RUN_TAG;

export const PASSWORD = TEST_PASSWORD;

export interface TestUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** Create a user with password {@link PASSWORD} (a site admin with `isAdmin`). */
export async function createUser({ label, isAdmin = false }: { label: string; isAdmin?: boolean }): Promise<TestUser> {
  const user = await createTestUser({ label, role: isAdmin ? 'admin' : 'user' });
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

/** Create a manuscript with the given members (the first owner is recorded as creator). */
export async function createManuscript({
  title,
  members,
  archived = false,
}: {
  title: string;
  members: { user: TestUser; role: MemberRole }[];
  archived?: boolean;
}) {
  const slug = `${title.toLowerCase().replace(/[^a-z0-9]+/g, '-')}-${RUN}-${++manuscriptCounter}`;
  const owner = members.find((member) => member.role === 'owner');
  const [manuscript] = await db
    .insert(manuscripts)
    .values({ title, slug, abstract: 'Test abstract.', createdById: owner?.user.id, archivedAt: archived ? new Date() : null })
    .returning();
  if (members.length) {
    await db
      .insert(memberships)
      .values(members.map(({ user, role }) => ({ manuscriptId: manuscript.id, userId: user.id, role })));
  }
  return manuscript;
}
let manuscriptCounter = 0;

/** Freeze one snapshot for the manuscript (figure + result + snapshot rows), as the figures step would. */
export async function addSnapshot({ manuscriptId }: { manuscriptId: string }) {
  const [figure] = await db
    .insert(figures)
    .values({ manuscriptId, label: `fig-${RUN}-${++manuscriptCounter}`, kind: 'spectrum', params: {} })
    .returning();
  const [result] = await db
    .insert(results)
    .values({
      inputHash: `test-input-${RUN}-${manuscriptCounter}`,
      solverVersion: 'test',
      params: {},
      data: {},
      diagnostics: {},
      resultHash: `test-result-${RUN}-${manuscriptCounter}`,
    })
    .returning();
  await db.insert(snapshots).values({
    figureId: figure.id,
    manuscriptId,
    version: 1,
    kind: 'spectrum',
    label: figure.label,
    caption: '',
    params: {},
    solverVersion: 'test',
    resultId: result.id,
    resultHash: result.resultHash,
  });
}

/** Row counts of the tables the foundation routes write, to prove that refused requests wrote nothing. */
export async function tableCounts() {
  const [u] = await db.select({ n: count() }).from(users);
  const [m] = await db.select({ n: count() }).from(manuscripts);
  const [ms] = await db.select({ n: count() }).from(memberships);
  const [i] = await db.select({ n: count() }).from(invitations);
  return { users: u.n, manuscripts: m.n, memberships: ms.n, invitations: i.n };
}

export async function getManuscriptRow(id: string) {
  const [row] = await db.select().from(manuscripts).where(eq(manuscripts.id, id));
  return row ?? null;
}

export async function getMembershipRole(manuscriptId: string, userId: string): Promise<MemberRole | null> {
  const [row] = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.manuscriptId, manuscriptId), eq(memberships.userId, userId)));
  return row?.role ?? null;
}

// ---------------------------------------------------------------------------------------------
// HTTP with a cookie jar
// ---------------------------------------------------------------------------------------------

export class Client {
  readonly cookies = new Map<string, string>();

  cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join('; ');
  }

  private store(response: Response) {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      const expired = attributes.some((attribute) => /max-age=0|expires=thu, 01 jan 1970/i.test(attribute.trim()));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  /** A request to the app; redirects are not followed (tests look at them). */
  async request(pathname: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    // Like a browser on one of the app's pages: mutating requests carry the page's Origin (lib/http/cross-site.ts).
    if (!headers.has('origin')) headers.set('origin', new URL(APP_URL).origin);
    const response = await fetch(`${APP_URL}${pathname}`, { ...init, headers, redirect: 'manual' });
    this.store(response);
    return response;
  }

  /** JSON request; `body` is sent as given when it is a string (for malformed JSON tests), else stringified. */
  async json(method: string, pathname: string, body?: unknown): Promise<{ status: number; body: any }> {
    const response = await this.request(pathname, {
      method,
      headers: body === undefined ? {} : { 'content-type': 'application/json' },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
    });
    const text = await response.text();
    let parsed: unknown = null;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      parsed = text;
    }
    return { status: response.status, body: parsed };
  }

  async csrfToken(): Promise<string> {
    const response = await this.request('/api/auth/csrf');
    const { csrfToken } = (await response.json()) as { csrfToken: string };
    return csrfToken;
  }

  /** Password sign-in through next-auth's credentials callback. Returns the redirect location. */
  async signInWithPassword(email: string, password = PASSWORD): Promise<string> {
    const csrfToken = await this.csrfToken();
    const response = await this.request('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, email, password, callbackUrl: `${APP_URL}/dashboard` }),
    });
    await response.text();
    return response.headers.get('location') ?? '';
  }

  /** The next-auth session as the app reports it (null when signed out). */
  async session(): Promise<{ user?: { id: string; email: string; isAdmin: boolean } } | null> {
    const response = await this.request('/api/auth/session');
    const body = (await response.json()) as Record<string, unknown>;
    return Object.keys(body).length ? (body as { user?: { id: string; email: string; isAdmin: boolean } }) : null;
  }
}

export async function signedInClient(user: TestUser): Promise<Client> {
  const client = new Client();
  await client.signInWithPassword(user.email);
  return client;
}

// ---------------------------------------------------------------------------------------------
// Fake SMTP mailbox (scripts/smtp.mjs stores each received message as JSON in MAIL_DIR)
// ---------------------------------------------------------------------------------------------

export interface ReceivedMail {
  subject: string;
  /** Text and HTML parts together, for content checks and failure messages. */
  raw: string;
  /** Every link in the text part. */
  links: string[];
}

function toReceived(message: StoredMessage): ReceivedMail {
  return { subject: message.subject, raw: `${message.text}\n${message.html}`, links: linksIn(message) };
}

/** Messages addressed to `email` that arrived after `since` (ms epoch, with 1 s tolerance), oldest first. */
export async function mailsTo(email: string, since = 0): Promise<ReceivedMail[]> {
  const wanted = email.toLowerCase();
  const messages = await listMessages();
  return messages
    .filter((m) => m.to.some((to) => to.toLowerCase() === wanted) && m.receivedAt.getTime() >= since - 1000)
    .reverse()
    .map(toReceived);
}

/** Wait (polling the mailbox) for a message to `email` after `since` (ms epoch). */
export async function waitForMailTo(email: string, since: number, timeoutMs = 15_000): Promise<ReceivedMail> {
  return toReceived(await waitForStoredMail(email, { since: new Date(since), timeoutMs }));
}
