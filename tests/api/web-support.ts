// Support for the foundation web tests (API and browser): people and manuscripts written straight into the test
// database, an HTTP client with a cookie jar that signs in through next-auth, and a reader for the fake SMTP mailbox.
import { readdir, readFile, stat } from 'node:fs/promises';
import path from 'node:path';
import bcrypt from 'bcryptjs';
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

export const APP_URL = (process.env.APP_URL || 'http://127.0.0.1:3100').replace(/\/+$/, '');
export const MAIL_DIR = path.resolve(process.env.MAIL_DIR || '.data/mail');

/** A tag unique to this test run, so rows from earlier runs (snapshots can never be deleted) never collide. */
export const RUN = Date.now().toString(36);

export const PASSWORD = 'correct horse battery';
// Cost 4 keeps the suite quick; bcrypt.compare reads the cost from the hash, so the app verifies it as usual.
const PASSWORD_HASH = bcrypt.hashSync(PASSWORD, 4);

export interface TestUser {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** Create a user with password {@link PASSWORD}. */
export async function createUser({ label, isAdmin = false }: { label: string; isAdmin?: boolean }): Promise<TestUser> {
  const email = `${label}.${RUN}@fluxfolio.test`.toLowerCase();
  const name = `${label[0].toUpperCase()}${label.slice(1)} Tester`;
  const [row] = await db
    .insert(users)
    .values({ email, name, passwordHash: PASSWORD_HASH, isAdmin, emailVerified: new Date() })
    .returning();
  return { id: row.id, email: row.email, name, isAdmin };
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
// Fake SMTP mailbox (the SMTP server writes one JSON file per received message into MAIL_DIR)
// ---------------------------------------------------------------------------------------------

export interface ReceivedMail {
  file: string;
  raw: string;
  subject: string;
  links: string[];
}

async function jsonFiles(dir: string): Promise<string[]> {
  const out: string[] = [];
  let entries: import('node:fs').Dirent[] = [];
  try {
    entries = await readdir(dir, { withFileTypes: true });
  } catch {
    return out;
  }
  for (const entry of entries) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) out.push(...(await jsonFiles(full)));
    else if (entry.name.endsWith('.json')) out.push(full);
  }
  return out;
}

function decodeLinks(raw: string): string[] {
  // JSON escapes "&" as \u0026 in some writers and "/" as \/; undo those before matching.
  const text = raw.replace(/\\u0026/g, '&').replace(/\\\//g, '/').replace(/&amp;/g, '&');
  return [...new Set(text.match(/https?:\/\/[^\s"'<>\\)]+/g) ?? [])];
}

/** Messages addressed to `email` that arrived after `since` (ms epoch), oldest first. */
export async function mailsTo(email: string, since = 0): Promise<ReceivedMail[]> {
  const found: { mtime: number; mail: ReceivedMail }[] = [];
  for (const file of await jsonFiles(MAIL_DIR)) {
    const info = await stat(file);
    if (info.mtimeMs < since - 1000) continue; // tolerate coarse file timestamps
    const raw = await readFile(file, 'utf8');
    let data: any;
    try {
      data = JSON.parse(raw);
    } catch {
      continue;
    }
    const recipients = JSON.stringify(data.to ?? data.envelope ?? data.headers ?? data).toLowerCase();
    if (!recipients.includes(email.toLowerCase())) continue;
    found.push({ mtime: info.mtimeMs, mail: { file, raw, subject: String(data.subject ?? ''), links: decodeLinks(raw) } });
  }
  return found.sort((a, b) => a.mtime - b.mtime).map((entry) => entry.mail);
}

/** Wait (polling the mailbox) for a message to `email` after `since`; fails after `timeoutMs`. */
export async function waitForMailTo(email: string, since: number, timeoutMs = 15_000): Promise<ReceivedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const mails = await mailsTo(email, since);
    if (mails.length) return mails[mails.length - 1];
    if (Date.now() > deadline) throw new Error(`No mail to ${email} arrived in ${MAIL_DIR} within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
}
