// The edge mapping of errors (no database): each domain error code answers with its HTTP status and the JSON body
// `{ error, fields }`; zod and solver errors become 400 with per-field messages; anything else is a 500.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import {
  conflict,
  DomainError,
  forbidden,
  invalid,
  isDomainError,
  notFound,
  tooLarge,
  unauthenticated,
  unavailable,
  upstreamFailed,
  type DomainErrorCode,
} from '@/lib/domain-error';
import { STATUS_OF_CODE, toErrorResponse } from '@/lib/http/errors';
import { LimitError, SpecError } from '@/lib/physics/errors';
import { fieldKey, fieldMessages } from '@/lib/validation-fields';

async function answer(error: unknown): Promise<{ status: number; body: { error: string; fields?: Record<string, string[]> } }> {
  const response = toErrorResponse(error);
  return { status: response.status, body: await response.json() };
}

afterEach(() => vi.restoreAllMocks());

describe('domain error -> HTTP status', () => {
  // The statuses the API has always answered with (tests/api/bad-input and authz-matrix check them per route).
  const cases: [DomainError, DomainErrorCode, number][] = [
    [invalid('Bad', { email: ['Enter an e-mail address'] }), 'invalid', 400],
    [unauthenticated(), 'unauthenticated', 401],
    [forbidden(), 'forbidden', 403],
    [notFound('Manuscript not found'), 'not-found', 404],
    [conflict('This run has already finished and cannot be cancelled'), 'conflict', 409],
    [tooLarge(), 'too-large', 413],
    [upstreamFailed('The invitation e-mail could not be sent; try again in a moment'), 'upstream-failed', 502],
    [unavailable('The run queue is not available; try again in a moment'), 'unavailable', 503],
  ];

  it.each(cases)('%s has code %s and answers %i with its message', async (error, code, status) => {
    expect(error.code).toBe(code);
    expect(STATUS_OF_CODE[code]).toBe(status);
    const { status: got, body } = await answer(error);
    expect(got).toBe(status);
    expect(body.error).toBe(error.message);
  });

  it('carries per-field messages into the body, and leaves `fields` out when there are none', async () => {
    const withFields = await answer(conflict('This person is already a member of the manuscript', { email: ['Already a member'] }));
    expect(withFields).toEqual({
      status: 409,
      body: { error: 'This person is already a member of the manuscript', fields: { email: ['Already a member'] } },
    });
    const without = await answer(notFound('Run not found'));
    expect(without.body).toEqual({ error: 'Run not found' });
  });

  it('keeps the default messages of the API', () => {
    expect(unauthenticated().message).toBe('Sign in to continue');
    expect(forbidden().message).toBe('Your role does not allow this action');
    expect(tooLarge().message).toBe('The request body is too large');
  });

  it('isDomainError tells codes apart and refuses other errors', () => {
    expect(isDomainError(notFound())).toBe(true);
    expect(isDomainError(notFound(), 'not-found')).toBe(true);
    expect(isDomainError(notFound(), 'conflict')).toBe(false);
    expect(isDomainError(new Error('x'), 'not-found')).toBe(false);
    expect(isDomainError({ code: 'not-found', message: 'looks alike' }, 'not-found')).toBe(false);
  });
});

describe('validation and solver errors at the edge', () => {
  it('a ZodError is a 400 with dotted field keys and `_` for the whole value', async () => {
    const schema = z
      .object({ members: z.array(z.object({ role: z.enum(['owner', 'author']) })) })
      .refine(() => false, { error: 'Change at least one thing' });
    const parsed = schema.safeParse({ members: [{ role: 'owner' }, { role: 'referee' }] });
    expect(parsed.success).toBe(false);
    const { status, body } = await answer(parsed.error);
    expect(status).toBe(400);
    expect(body.error).toBe('Some fields are not valid');
    expect(Object.keys(body.fields ?? {})).toEqual(['members.1.role']);

    const whole = schema.safeParse({ members: [] });
    expect((await answer(whole.error)).body.fields).toEqual({ _: ['Change at least one thing'] });
  });

  it("a SpecError is a 400 with the solver's messages per field; a LimitError a 400 with its message", async () => {
    const spec = await answer(new SpecError([{ path: 'well.union[1].disk.radius', message: 'must be positive' }]));
    expect(spec).toEqual({
      status: 400,
      body: { error: 'The parameters are not valid', fields: { 'well.union.1.disk.radius': ['must be positive'] } },
    });
    const limit = await answer(new LimitError('The grid needs 400000 unknowns; use h >= 0.02'));
    expect(limit).toEqual({ status: 400, body: { error: 'The grid needs 400000 unknowns; use h >= 0.02' } });
  });

  it('anything else is logged and answered with a 500 that reveals nothing', async () => {
    const logged = vi.spyOn(console, 'error').mockImplementation(() => {});
    const { status, body } = await answer(new Error('connection string postgres://secret'));
    expect(status).toBe(500);
    expect(body).toEqual({ error: 'Something went wrong on the server' });
    expect(logged).toHaveBeenCalledTimes(1);
  });
});

describe('fieldMessages (the one per-field helper)', () => {
  it('keys by dotted path, indices as segments, several messages per field in order', () => {
    expect(
      fieldMessages([
        { path: ['members', 0, 'role'], message: 'Choose a role' },
        { path: ['email'], message: 'Enter an e-mail address' },
        { path: ['email'], message: 'At most 254 characters' },
        { path: [], message: 'Change something' },
      ]),
    ).toEqual({
      'members.0.role': ['Choose a role'],
      email: ['Enter an e-mail address', 'At most 254 characters'],
      _: ['Change something'],
    });
  });

  it("reads the solver's string paths and puts them under a prefix", () => {
    expect(fieldMessages([{ path: 'grid.h', message: 'must be positive' }, { path: '', message: 'unknown key' }], { prefix: 'params' })).toEqual({
      'params.grid.h': ['must be positive'],
      params: ['unknown key'],
    });
    expect(fieldKey('tubes[0].at[1]')).toBe('tubes.0.at.1');
    expect(fieldKey(['tubes', 0, 'at', 1])).toBe(fieldKey('tubes[0].at[1]'));
    expect(fieldKey('')).toBe('_');
  });
});
