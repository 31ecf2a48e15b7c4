// The server-side twin of what the API's JSON round trip does to a body (dates become ISO strings), so a page can hand
// its loaded rows to a client hook as the same shape the hook would fetch (its SWR fallback).
import type { Jsonified } from '@/lib/api-types';

/**
 * A value as the client receives it from our API (JSON.stringify, then JSON.parse).
 *
 * @example toJson({ at: new Date(0) }) // returns { at: '1970-01-01T00:00:00.000Z' }
 */
export function toJson<T>(value: T): Jsonified<T> {
  return JSON.parse(JSON.stringify(value)) as Jsonified<T>;
}
