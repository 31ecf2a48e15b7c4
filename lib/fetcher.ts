// The one typed client for our JSON API: SWR reads through `fetcher`, mutations through `sendJson`;
// both surface the server's `{ error, fields }` as an ApiError.
import type { ErrorBody } from '@/lib/http/errors';

/** An API answer that was not 2xx, with the server's message and per-field messages. */
export class ApiError extends Error {
  readonly status: number;
  readonly fields: Record<string, string[]>;

  constructor(status: number, message: string, fields: Record<string, string[]> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.fields = fields;
  }
}

async function parseResponse<T>(response: Response): Promise<T> {
  const text = await response.text();
  let data: unknown = null;
  if (text) {
    try {
      data = JSON.parse(text);
    } catch {
      data = null;
    }
  }
  if (!response.ok) {
    const body = (data ?? {}) as Partial<ErrorBody>;
    throw new ApiError(response.status, body.error || `Request failed (${response.status})`, body.fields ?? {});
  }
  return data as T;
}

function offline(error: unknown): never {
  if (error instanceof ApiError) throw error;
  throw new ApiError(0, 'Cannot reach the server; check your connection');
}

/**
 * GET a JSON resource (the SWR fetcher).
 *
 * @example
 * const { data } = useSWR<{ manuscripts: ManuscriptListItem[] }>('/api/manuscripts', fetcher);
 */
export async function fetcher<T>(url: string): Promise<T> {
  try {
    return await parseResponse<T>(await fetch(url, { headers: { accept: 'application/json' }, credentials: 'same-origin' }));
  } catch (error) {
    return offline(error);
  }
}

/**
 * Send a JSON mutation (POST, PUT, PATCH, DELETE).
 *
 * @example
 * await sendJson('/api/manuscripts', { method: 'POST', body: { title } });
 */
export async function sendJson<T>(url: string, { method, body }: { method: 'POST' | 'PUT' | 'PATCH' | 'DELETE'; body?: unknown }): Promise<T> {
  try {
    const response = await fetch(url, {
      method,
      credentials: 'same-origin',
      headers: { accept: 'application/json', ...(body !== undefined && { 'content-type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    return await parseResponse<T>(response);
  } catch (error) {
    return offline(error);
  }
}
