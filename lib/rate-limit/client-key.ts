// Which client a request comes from, for per-client rate limits. Route handlers do not see the socket address, so the
// first X-Forwarded-For entry is used only behind a trusted proxy (FLUXFOLIO_TRUST_PROXY=1); otherwise all clients share 'direct'.

/** The key every client shares when no trusted proxy names the address. */
export const DIRECT_CLIENT_KEY = 'direct';

/**
 * The rate-limit key of the request's client.
 *
 * @example
 * clientKey(request) // '203.0.113.7' behind a trusted proxy, else 'direct'
 */
export function clientKey(request: Request, env: Record<string, string | undefined> = process.env): string {
  if (env.FLUXFOLIO_TRUST_PROXY !== '1') return DIRECT_CLIENT_KEY;
  const first = request.headers.get('x-forwarded-for')?.split(',')[0]?.trim() ?? '';
  return /^[0-9a-fA-F.:]{2,45}$/.test(first) ? first.toLowerCase() : DIRECT_CLIENT_KEY;
}
