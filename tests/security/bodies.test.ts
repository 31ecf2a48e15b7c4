// Request bodies against the running app: bytes are counted while reading (a chunked body without Content-Length is
// refused past 1 MB), the session is checked before any body is read, and an invitation token before any password hash.
import { count, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sqlClient } from '@/db';
import { manuscripts } from '@/db/schema';
import { hashPassword } from '@/lib/auth/password';
import { MAX_JSON_BODY_BYTES } from '@/lib/http/handler';
import { testDb, uniqueTag } from '../helpers/db';
import { APP_URL, signedInClient, type HttpClient } from '../helpers/http-client';
import { createTestUser, type TestUser } from '../helpers/test-users';

let user: TestUser;
let client: HttpClient;

beforeAll(async () => {
  user = await createTestUser({ label: 'bodies' });
  client = await signedInClient(user);
});

afterAll(async () => {
  await sqlClient.end({ timeout: 5 });
});

/** A JSON body streamed in 64 kB chunks, with no Content-Length (fetch sends it chunked). */
function chunkedJson(title: string, totalBytes: number): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  const head = encoder.encode(`{"title":${JSON.stringify(title)},"abstract":"`);
  const tail = encoder.encode('"}');
  const filler = encoder.encode('x'.repeat(Math.min(65_536, totalBytes)));
  let sent = 0;
  let stage = 0;
  return new ReadableStream({
    pull(controller) {
      if (stage === 0) {
        controller.enqueue(head);
        sent += head.byteLength;
        stage = 1;
      } else if (stage === 1 && sent < totalBytes) {
        controller.enqueue(filler);
        sent += filler.byteLength;
      } else {
        controller.enqueue(tail);
        controller.close();
      }
    },
  });
}

async function manuscriptsTitled(title: string): Promise<number> {
  const [{ n }] = await testDb.select({ n: count() }).from(manuscripts).where(eq(manuscripts.title, title));
  return n;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

describe('request bodies', () => {
  it('refuses a chunked body above the limit with 413 and stores nothing', async () => {
    const title = `Chunked ${uniqueTag()}`;
    const response = await fetch(`${APP_URL}/api/manuscripts`, {
      method: 'POST',
      headers: { cookie: client.cookieHeader(), origin: new URL(APP_URL).origin, 'content-type': 'application/json' },
      body: chunkedJson(title, 2 * MAX_JSON_BODY_BYTES),
      duplex: 'half',
    } as RequestInit);
    expect(response.headers.get('content-length')).not.toBe(String(2 * MAX_JSON_BODY_BYTES));
    expect(response.status).toBe(413);
    expect(await manuscriptsTitled(title)).toBe(0);
  });

  it('accepts a small chunked body (the control case)', async () => {
    const title = `Small chunked ${uniqueTag()}`;
    const response = await fetch(`${APP_URL}/api/manuscripts`, {
      method: 'POST',
      headers: { cookie: client.cookieHeader(), origin: new URL(APP_URL).origin, 'content-type': 'application/json' },
      body: chunkedJson(title, 1_000),
      duplex: 'half',
    } as RequestInit);
    expect(response.status).toBe(201);
    expect(await manuscriptsTitled(title)).toBe(1);
  });

  it('answers an unauthenticated oversize body with 401, not 413 (the body is not read before the session check)', async () => {
    const response = await fetch(`${APP_URL}/api/manuscripts`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ title: 'big', abstract: 'x'.repeat(2 * MAX_JSON_BODY_BYTES) }),
    });
    expect(response.status).toBe(401);
  });

  it('checks an invitation token before hashing a password (an unknown token answers well within one bcrypt hash)', async () => {
    const unknown = 'u'.repeat(43);
    const signUp = { name: 'Someone New', password: 'a long enough password' };
    const times: number[] = [];
    for (let i = 0; i < 7; i += 1) {
      const started = performance.now();
      const response = await fetch(`${APP_URL}/api/invitations/${unknown}`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify(signUp),
      });
      times.push(performance.now() - started);
      expect(response.status).toBe(404);
    }
    const hashing: number[] = [];
    for (let i = 0; i < 7; i += 1) {
      const started = performance.now();
      await hashPassword(signUp.password);
      hashing.push(performance.now() - started);
    }
    // Loose on purpose: the request (HTTP, a lookup, no hash) against one bcrypt hash at cost 10 in this process.
    expect(median(times)).toBeLessThan(median(hashing));
  });
});
