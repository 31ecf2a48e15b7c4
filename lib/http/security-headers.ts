// The security headers every response carries (set by proxy.ts): a per-request nonce Content-Security-Policy without
// unsafe-eval, frame-ancestors 'none', nosniff, a referrer policy, and HSTS when the app is served over https.

/** HSTS lifetime: one year (common practice; the value browsers' preload lists ask for). */
export const HSTS_MAX_AGE_SECONDS = 31_536_000;

export interface CspOptions {
  /** The per-request nonce Next puts on its own scripts. */
  nonce: string;
  /** next dev only: React's development build evaluates strings for its call stacks. Never in a production build. */
  development?: boolean;
  /** Add upgrade-insecure-requests (served over https). */
  https?: boolean;
}

/**
 * The Content-Security-Policy value.
 *
 * - Scripts: only those carrying this response's nonce, and what they load ('strict-dynamic'); no eval (Vega runs
 *   with its expression interpreter).
 * - Styles: 'self' and inline styles: KaTeX, Vega's SVG and React `style` props write style attributes, and Next inlines
 *   font-face rules. A nonce cannot cover style attributes, and inline CSS cannot run code.
 *
 * @example
 * contentSecurityPolicy({ nonce: 'abc' }) // "default-src 'self'; script-src 'self' 'nonce-abc' 'strict-dynamic'; …"
 */
export function contentSecurityPolicy({ nonce, development = false, https = false }: CspOptions): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${development ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
    ...(https ? ['upgrade-insecure-requests'] : []),
  ];
  return directives.join('; ');
}

/**
 * Every security header of a response, as name → value.
 *
 * @example
 * securityHeaders({ nonce, https: false })['x-content-type-options'] // 'nosniff'
 */
export function securityHeaders(options: CspOptions): Record<string, string> {
  return {
    'content-security-policy': contentSecurityPolicy(options),
    'x-content-type-options': 'nosniff',
    'referrer-policy': 'strict-origin-when-cross-origin',
    'x-frame-options': 'DENY',
    'cross-origin-opener-policy': 'same-origin',
    'permissions-policy': 'camera=(), microphone=(), geolocation=(), payment=()',
    ...(options.https ? { 'strict-transport-security': `max-age=${HSTS_MAX_AGE_SECONDS}; includeSubDomains` } : {}),
  };
}

/** A fresh nonce: 16 random bytes in base64 (the CSP nonce-source form). */
export function newNonce(): string {
  const bytes = new Uint8Array(16);
  crypto.getRandomValues(bytes);
  return btoa(String.fromCharCode(...bytes));
}

/** Whether the request reached us over https (directly, or through a trusted proxy's X-Forwarded-Proto). */
export function servedOverHttps(request: Request, env: Record<string, string | undefined> = process.env): boolean {
  if (new URL(request.url).protocol === 'https:') return true;
  return env.FLUXFOLIO_TRUST_PROXY === '1' && request.headers.get('x-forwarded-proto')?.split(',')[0]?.trim() === 'https';
}
