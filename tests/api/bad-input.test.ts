// Bad input to the foundation API: missing fields, wrong types, oversize strings, unknown ids and malformed JSON
// are answered with 400 (per-field messages) or 404, and nothing is written to the database.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { HttpClient, signedInClient } from '../helpers/http-client';
import { tableCounts } from '../helpers/manuscript-rows';
import { createTestManuscript } from '../helpers/test-manuscripts';
import { createTestUser, type TestUser } from '../helpers/test-users';

let owner: TestUser;
let coauthor: TestUser;
let client: HttpClient;
let manuscriptId: string;
const UNKNOWN_ID = '00000000-0000-4000-8000-000000000000';
const UNKNOWN_TOKEN = 'A'.repeat(43);

beforeAll(async () => {
  owner = await createTestUser({ label: 'bad-owner' });
  coauthor = await createTestUser({ label: 'bad-coauthor' });
  client = await signedInClient(owner);
  const manuscript = await createTestManuscript({
    title: 'Bad input',
    members: [
      { user: owner, role: 'owner' },
      { user: coauthor, role: 'coauthor' },
    ],
  });
  manuscriptId = manuscript.id;
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

interface BadCase {
  name: string;
  method: string;
  path: () => string;
  body?: unknown;
  status: number;
  fields?: string[];
}

const CASES: BadCase[] = [
  // POST /api/manuscripts
  { name: 'create: missing title', method: 'POST', path: () => '/api/manuscripts', body: {}, status: 400, fields: ['title'] },
  { name: 'create: blank title', method: 'POST', path: () => '/api/manuscripts', body: { title: '   ' }, status: 400, fields: ['title'] },
  { name: 'create: title is a number', method: 'POST', path: () => '/api/manuscripts', body: { title: 42 }, status: 400, fields: ['title'] },
  { name: 'create: title of 201 characters', method: 'POST', path: () => '/api/manuscripts', body: { title: 'x'.repeat(201) }, status: 400, fields: ['title'] },
  {
    name: 'create: abstract of 5001 characters',
    method: 'POST',
    path: () => '/api/manuscripts',
    body: { title: 'ok', abstract: 'a'.repeat(5001) },
    status: 400,
    fields: ['abstract'],
  },
  { name: 'create: body is an array', method: 'POST', path: () => '/api/manuscripts', body: '[1,2]', status: 400 },
  { name: 'create: malformed JSON', method: 'POST', path: () => '/api/manuscripts', body: '{"title": "x",', status: 400 },
  { name: 'create: body is a JSON string', method: 'POST', path: () => '/api/manuscripts', body: '"title"', status: 400 },
  // PATCH /api/manuscripts/[id]
  { name: 'update: nothing to change', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}`, body: {}, status: 400 },
  { name: 'update: unknown status', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}`, body: { status: 'retracted' }, status: 400, fields: ['status'] },
  { name: 'update: unknown field', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}`, body: { slug: 'mine' }, status: 400 },
  { name: 'update: title null', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}`, body: { title: null }, status: 400, fields: ['title'] },
  { name: 'update: malformed JSON', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}`, body: '{title:1}', status: 400 },
  { name: 'update: id is not a UUID', method: 'PATCH', path: () => '/api/manuscripts/not-a-uuid', body: { title: 'x' }, status: 400, fields: ['id'] },
  { name: 'update: unknown id', method: 'PATCH', path: () => `/api/manuscripts/${UNKNOWN_ID}`, body: { title: 'x' }, status: 404 },
  { name: 'delete: unknown id', method: 'DELETE', path: () => `/api/manuscripts/${UNKNOWN_ID}`, status: 404 },
  // archive
  { name: 'archive: archived is a string', method: 'POST', path: () => `/api/manuscripts/${manuscriptId}/archive`, body: { archived: 'yes' }, status: 400, fields: ['archived'] },
  { name: 'archive: unknown id', method: 'POST', path: () => `/api/manuscripts/${UNKNOWN_ID}/archive`, body: {}, status: 404 },
  // invitations
  { name: 'invite: missing e-mail and role', method: 'POST', path: () => `/api/manuscripts/${manuscriptId}/members`, body: {}, status: 400, fields: ['email', 'role'] },
  {
    name: 'invite: not an e-mail',
    method: 'POST',
    path: () => `/api/manuscripts/${manuscriptId}/members`,
    body: { email: 'nobody-at-example', role: 'coauthor' },
    status: 400,
    fields: ['email'],
  },
  {
    name: 'invite: e-mail of 255 characters',
    method: 'POST',
    path: () => `/api/manuscripts/${manuscriptId}/members`,
    body: { email: `${'a'.repeat(243)}@example.org`, role: 'coauthor' },
    status: 400,
    fields: ['email'],
  },
  {
    name: 'invite: unknown role',
    method: 'POST',
    path: () => `/api/manuscripts/${manuscriptId}/members`,
    body: { email: 'new@example.org', role: 'referee' },
    status: 400,
    fields: ['role'],
  },
  { name: 'invite: malformed JSON', method: 'POST', path: () => `/api/manuscripts/${manuscriptId}/members`, body: 'email=x', status: 400 },
  {
    name: 'invite: unknown manuscript',
    method: 'POST',
    path: () => `/api/manuscripts/${UNKNOWN_ID}/members`,
    body: { email: 'new@example.org', role: 'coauthor' },
    status: 404,
  },
  // members
  { name: 'role change: unknown role', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}/members/${coauthor.id}`, body: { role: 'editor' }, status: 400, fields: ['role'] },
  { name: 'role change: role missing', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}/members/${coauthor.id}`, body: {}, status: 400, fields: ['role'] },
  { name: 'role change: unknown member', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}/members/${UNKNOWN_ID}`, body: { role: 'author' }, status: 404 },
  { name: 'role change: malformed user id', method: 'PATCH', path: () => `/api/manuscripts/${manuscriptId}/members/a%20b`, body: { role: 'author' }, status: 400, fields: ['userId'] },
  { name: 'remove: unknown member', method: 'DELETE', path: () => `/api/manuscripts/${manuscriptId}/members/${UNKNOWN_ID}`, status: 404 },
  // invitation links
  { name: 'invitation: malformed token', method: 'GET', path: () => '/api/invitations/short', status: 400, fields: ['token'] },
  { name: 'invitation: unknown token', method: 'GET', path: () => `/api/invitations/${UNKNOWN_TOKEN}`, status: 404 },
  { name: 'accept: unknown token', method: 'POST', path: () => `/api/invitations/${UNKNOWN_TOKEN}`, body: {}, status: 404 },
  { name: 'accept: malformed JSON', method: 'POST', path: () => `/api/invitations/${UNKNOWN_TOKEN}`, body: '{', status: 400 },
  { name: 'list: unknown scope', method: 'GET', path: () => '/api/manuscripts?scope=everything', status: 400, fields: ['scope'] },
];

describe('bad input is refused and writes nothing', () => {
  it.each(CASES)('$name -> $status', async (badCase) => {
    const before = await tableCounts();
    const response = await client.json(badCase.method, badCase.path(), badCase.body);
    expect(response.status, JSON.stringify(response.body)).toBe(badCase.status);
    expect(typeof response.body.error).toBe('string');
    for (const field of badCase.fields ?? []) {
      expect(response.body.fields?.[field]?.length, `fields.${field} in ${JSON.stringify(response.body)}`).toBeGreaterThan(0);
    }
    expect(await tableCounts()).toEqual(before);
  });

  it('refuses a body larger than 1 MB with 413', async () => {
    const before = await tableCounts();
    const response = await client.json('POST', '/api/manuscripts', { title: 'big', abstract: 'x'.repeat(1_100_000) });
    expect(response.status).toBe(413);
    expect(await tableCounts()).toEqual(before);
  });

  it('sign-up through an invitation validates name and password per field', async () => {
    const invited = await client.json('POST', `/api/manuscripts/${manuscriptId}/members`, {
      email: `bad-signup.${Date.now()}@fluxfolio.test`,
      role: 'coauthor',
    });
    expect(invited.status).toBe(201);
    // The token is only in the e-mail; an unknown token with a bad body is still a 400 first (validation before lookup).
    const anonymous = new HttpClient();
    const before = await tableCounts();
    const short = await anonymous.json('POST', `/api/invitations/${UNKNOWN_TOKEN}`, { name: 'x'.repeat(121), password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.fields.name.length).toBeGreaterThan(0);
    expect(short.body.fields.password.length).toBeGreaterThan(0);
    const missing = await anonymous.json('POST', `/api/invitations/${UNKNOWN_TOKEN}`, {});
    expect(missing.status).toBe(400);
    expect(missing.body.fields).toHaveProperty('name');
    expect(missing.body.fields).toHaveProperty('password');
    expect(await tableCounts()).toEqual(before);
  });
});
