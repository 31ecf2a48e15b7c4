// Authorisation matrix: every manuscript route against every caller (no session, outsider, coauthor, author,
// owner, site admin). Outsiders get 404, like for a manuscript that does not exist; members below the action's role 403.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import type { MemberRole } from '@/db/schema';
import { HttpClient, signedInClient } from '../helpers/http-client';
import { getManuscriptRow, getMembershipRole } from '../helpers/manuscript-rows';
import { addTestSnapshot, createTestManuscript } from '../helpers/test-manuscripts';
import { createTestUser, type TestUser } from '../helpers/test-users';

type Caller = 'anonymous' | 'outsider' | 'coauthor' | 'author' | 'owner' | 'admin';
const CALLERS: Caller[] = ['anonymous', 'outsider', 'coauthor', 'author', 'owner', 'admin'];

const people = {} as Record<Exclude<Caller, 'anonymous'> | 'extra', TestUser>;
const clients = {} as Record<Caller, HttpClient>;

/** A fresh manuscript with the standard cast, so that every request meets the same state. */
async function freshManuscript(options: { archived?: boolean } = {}) {
  return createTestManuscript({
    title: 'Matrix manuscript',
    archived: options.archived,
    members: [
      { user: people.owner, role: 'owner' },
      { user: people.author, role: 'author' },
      { user: people.coauthor, role: 'coauthor' },
      { user: people.extra, role: 'coauthor' },
    ],
  });
}

/** Expected status per caller for an action needing `minimum` (the design in lib/authz/manuscript-access.ts). */
function expected(minimum: MemberRole, okStatus: number): Record<Caller, number> {
  const rank: Record<MemberRole, number> = { coauthor: 1, author: 2, owner: 3 };
  const member = (role: MemberRole) => (rank[role] >= rank[minimum] ? okStatus : 403);
  return {
    anonymous: 401,
    outsider: 404,
    coauthor: member('coauthor'),
    author: member('author'),
    owner: okStatus,
    admin: okStatus,
  };
}

interface RouteCase {
  name: string;
  minimum: MemberRole;
  okStatus: number;
  send: (client: HttpClient, ids: { id: string }) => Promise<{ status: number; body: any }>;
}

const ROUTES: RouteCase[] = [
  { name: 'GET /api/manuscripts/[id]', minimum: 'coauthor', okStatus: 200, send: (c, { id }) => c.json('GET', `/api/manuscripts/${id}`) },
  {
    name: 'PATCH /api/manuscripts/[id]',
    minimum: 'author',
    okStatus: 200,
    send: (c, { id }) => c.json('PATCH', `/api/manuscripts/${id}`, { title: 'Renamed by the matrix' }),
  },
  { name: 'DELETE /api/manuscripts/[id]', minimum: 'owner', okStatus: 200, send: (c, { id }) => c.json('DELETE', `/api/manuscripts/${id}`) },
  {
    name: 'POST /api/manuscripts/[id]/archive',
    minimum: 'owner',
    okStatus: 200,
    send: (c, { id }) => c.json('POST', `/api/manuscripts/${id}/archive`, {}),
  },
  { name: 'GET /api/manuscripts/[id]/members', minimum: 'coauthor', okStatus: 200, send: (c, { id }) => c.json('GET', `/api/manuscripts/${id}/members`) },
  {
    name: 'POST /api/manuscripts/[id]/members (invite)',
    minimum: 'owner',
    okStatus: 201,
    send: (c, { id }) => c.json('POST', `/api/manuscripts/${id}/members`, { email: `invitee.${id.slice(0, 8)}@fluxfolio.test`, role: 'coauthor' }),
  },
  {
    name: 'PATCH /api/manuscripts/[id]/members/[userId]',
    minimum: 'owner',
    okStatus: 200,
    send: (c, { id }) => c.json('PATCH', `/api/manuscripts/${id}/members/${people.extra.id}`, { role: 'author' }),
  },
  {
    name: 'DELETE /api/manuscripts/[id]/members/[userId] (someone else)',
    minimum: 'owner',
    okStatus: 200,
    send: (c, { id }) => c.json('DELETE', `/api/manuscripts/${id}/members/${people.extra.id}`),
  },
  {
    name: 'GET /api/manuscripts/[id]/invitations',
    minimum: 'owner',
    okStatus: 200,
    send: (c, { id }) => c.json('GET', `/api/manuscripts/${id}/invitations`),
  },
];

beforeAll(async () => {
  people.owner = await createTestUser({ label: 'matrix-owner' });
  people.author = await createTestUser({ label: 'matrix-author' });
  people.coauthor = await createTestUser({ label: 'matrix-coauthor' });
  people.outsider = await createTestUser({ label: 'matrix-outsider' });
  people.extra = await createTestUser({ label: 'matrix-extra' });
  people.admin = await createTestUser({ label: 'matrix-admin', role: 'admin' });
  clients.anonymous = new HttpClient();
  for (const caller of CALLERS.filter((name) => name !== 'anonymous')) {
    clients[caller] = await signedInClient(people[caller as Exclude<Caller, 'anonymous'>]);
  }
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

describe('sessions', () => {
  it('carry the user id and the admin flag', async () => {
    const owner = await clients.owner.session();
    expect(owner?.user).toMatchObject({ id: people.owner.id, email: people.owner.email, isAdmin: false });
    const admin = await clients.admin.session();
    expect(admin?.user).toMatchObject({ id: people.admin.id, isAdmin: true });
    expect(await clients.anonymous.session()).toBeNull();
  });
});

describe.each(ROUTES)('$name', (routeCase) => {
  const table = expected(routeCase.minimum, routeCase.okStatus);
  const allowed = CALLERS.filter((caller) => table[caller] < 400);
  const refused = CALLERS.filter((caller) => table[caller] >= 400);

  it.each(allowed)(`%s: ${routeCase.okStatus}`, async (caller) => {
    const manuscript = await freshManuscript();
    const response = await routeCase.send(clients[caller], { id: manuscript.id });
    expect(response.status, JSON.stringify(response.body)).toBe(routeCase.okStatus);
  });

  it.each(refused)('%s: refused, and nothing changes', async (caller) => {
    const manuscript = await freshManuscript();
    const response = await routeCase.send(clients[caller], { id: manuscript.id });
    expect(response.status, JSON.stringify(response.body)).toBe(table[caller]);
    expect(typeof response.body.error).toBe('string');
    const row = await getManuscriptRow(manuscript.id);
    expect(row).not.toBeNull();
    expect(row!.title).toBe('Matrix manuscript');
    expect(row!.archivedAt).toBeNull();
    expect(await getMembershipRole(manuscript.id, people.extra.id)).toBe('coauthor');
  });
});

describe('an outsider cannot tell a hidden manuscript from a missing one', () => {
  it('answers both with the same 404 body', async () => {
    const manuscript = await freshManuscript();
    const hidden = await clients.outsider.json('GET', `/api/manuscripts/${manuscript.id}`);
    const missing = await clients.outsider.json('GET', '/api/manuscripts/00000000-0000-4000-8000-000000000000');
    expect(hidden.status).toBe(404);
    // Status, body and content type (the rest of the headers carry a date and a per-response CSP nonce).
    const seen = ({ status, body, headers }: typeof hidden) => ({ status, body, contentType: headers.get('content-type') });
    expect(seen(missing)).toEqual(seen(hidden));
  });
});

describe('leaving a manuscript', () => {
  it.each(['coauthor', 'author'] as const)('a %s may remove themselves', async (caller) => {
    const manuscript = await freshManuscript();
    const response = await clients[caller].json('DELETE', `/api/manuscripts/${manuscript.id}/members/${people[caller].id}`);
    expect(response.status).toBe(200);
    expect(await getMembershipRole(manuscript.id, people[caller].id)).toBeNull();
  });

  it('an outsider gets 404 and anonymous 401', async () => {
    const manuscript = await freshManuscript();
    const path = `/api/manuscripts/${manuscript.id}/members/${people.outsider.id}`;
    expect((await clients.outsider.json('DELETE', path)).status).toBe(404);
    expect((await clients.anonymous.json('DELETE', path)).status).toBe(401);
  });
});

describe('the list of manuscripts', () => {
  it('needs a session and shows only my manuscripts with my role', async () => {
    const manuscript = await freshManuscript();
    expect((await clients.anonymous.json('GET', '/api/manuscripts')).status).toBe(401);
    const mine = await clients.coauthor.json('GET', '/api/manuscripts');
    expect(mine.status).toBe(200);
    const item = mine.body.manuscripts.find((entry: { id: string }) => entry.id === manuscript.id);
    expect(item).toMatchObject({ role: 'coauthor', memberCount: 4 });
    const outsider = await clients.outsider.json('GET', '/api/manuscripts');
    expect(outsider.status).toBe(200);
    expect(outsider.body.manuscripts.some((entry: { id: string }) => entry.id === manuscript.id)).toBe(false);
  });

  it('lists every manuscript for a site admin only', async () => {
    const manuscript = await freshManuscript();
    const all = await clients.admin.json('GET', '/api/manuscripts?scope=all');
    expect(all.status).toBe(200);
    expect(all.body.manuscripts.find((entry: { id: string }) => entry.id === manuscript.id)).toMatchObject({ role: null });
    expect((await clients.owner.json('GET', '/api/manuscripts?scope=all')).status).toBe(403);
  });

  it('lets anyone signed in create a manuscript, as its owner', async () => {
    expect((await clients.anonymous.json('POST', '/api/manuscripts', { title: 'Nope' })).status).toBe(401);
    const created = await clients.coauthor.json('POST', '/api/manuscripts', { title: `Matrix created ${Date.now()}` });
    expect(created.status).toBe(201);
    expect(await getMembershipRole(created.body.manuscript.id, people.coauthor.id)).toBe('owner');
  });
});

describe('state rules', () => {
  it('refuses edits to an archived manuscript (409) but still lets members read it', async () => {
    const manuscript = await freshManuscript({ archived: true });
    expect((await clients.author.json('PATCH', `/api/manuscripts/${manuscript.id}`, { title: 'x' })).status).toBe(409);
    expect((await clients.coauthor.json('GET', `/api/manuscripts/${manuscript.id}`)).status).toBe(200);
    const restored = await clients.owner.json('POST', `/api/manuscripts/${manuscript.id}/archive`, { archived: false });
    expect(restored.status).toBe(200);
    expect(restored.body.manuscript.archivedAt).toBeNull();
    expect((await clients.author.json('PATCH', `/api/manuscripts/${manuscript.id}`, { title: 'Back' })).status).toBe(200);
  });

  it('refuses to delete a manuscript with a frozen snapshot (409), for owners and admins alike', async () => {
    const manuscript = await freshManuscript();
    await addTestSnapshot({ manuscriptId: manuscript.id });
    for (const caller of ['owner', 'admin'] as const) {
      const response = await clients[caller].json('DELETE', `/api/manuscripts/${manuscript.id}`);
      expect(response.status).toBe(409);
      expect(response.body.error).toMatch(/snapshot/i);
    }
    expect(await getManuscriptRow(manuscript.id)).not.toBeNull();
    const detail = await clients.owner.json('GET', `/api/manuscripts/${manuscript.id}`);
    expect(detail.body.snapshotCount).toBe(1);
  });

  it('never leaves a manuscript without an owner (409)', async () => {
    const manuscript = await freshManuscript();
    const demote = await clients.owner.json('PATCH', `/api/manuscripts/${manuscript.id}/members/${people.owner.id}`, { role: 'author' });
    expect(demote.status).toBe(409);
    const leave = await clients.owner.json('DELETE', `/api/manuscripts/${manuscript.id}/members/${people.owner.id}`);
    expect(leave.status).toBe(409);
    expect(await getMembershipRole(manuscript.id, people.owner.id)).toBe('owner');
    // With a second owner, the first may step down.
    const promote = await clients.owner.json('PATCH', `/api/manuscripts/${manuscript.id}/members/${people.author.id}`, { role: 'owner' });
    expect(promote.status).toBe(200);
    const stepDown = await clients.owner.json('PATCH', `/api/manuscripts/${manuscript.id}/members/${people.owner.id}`, { role: 'coauthor' });
    expect(stepDown.status).toBe(200);
    expect(await getMembershipRole(manuscript.id, people.owner.id)).toBe('coauthor');
  });

  it('a site admin acting as owner is reported as such', async () => {
    const manuscript = await freshManuscript();
    const detail = await clients.admin.json('GET', `/api/manuscripts/${manuscript.id}`);
    expect(detail.body).toMatchObject({ role: 'owner', memberRole: null, viaAdmin: true });
    expect(detail.body.permissions).toMatchObject({ read: true, edit: true, manage: true, delete: true });
    const coauthor = await clients.coauthor.json('GET', `/api/manuscripts/${manuscript.id}`);
    expect(coauthor.body.permissions).toMatchObject({ read: true, comment: true, edit: false, run: false, manage: false });
  });
});
