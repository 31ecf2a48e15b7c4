// Security headers on every kind of response of the running test app (a page, an API answer, a 404, a static file), and
// the header builder's https-only parts. The CSP is per request (a fresh nonce) and never admits eval.
import { describe, expect, it } from 'vitest';
import { securityHeaders, servedOverHttps } from '@/lib/http/security-headers';
import { APP_URL } from '../helpers/http-client';

function expectSecurityHeaders(response: Response, what: string): void {
  const csp = response.headers.get('content-security-policy');
  expect(csp, `${what}: content-security-policy`).toBeTruthy();
  expect(csp).not.toMatch(/unsafe-eval/);
  expect(csp).toMatch(/frame-ancestors 'none'/);
  expect(csp).toMatch(/script-src [^;]*'nonce-[A-Za-z0-9+/=]+'/);
  expect(csp).not.toMatch(/script-src [^;]*'unsafe-inline'/);
  expect(response.headers.get('x-content-type-options'), what).toBe('nosniff');
  expect(response.headers.get('referrer-policy'), what).toBe('strict-origin-when-cross-origin');
  // Served over plain http here: no HSTS (browsers ignore it on http, and it would pin a local dev host to https).
  expect(response.headers.get('strict-transport-security'), what).toBeNull();
}

describe('security headers', () => {
  it('are on a page, and the page scripts carry the response nonce', async () => {
    const response = await fetch(`${APP_URL}/sign-in`);
    expect(response.status).toBe(200);
    expectSecurityHeaders(response, 'page');
    const nonce = /'nonce-([^']+)'/.exec(response.headers.get('content-security-policy')!)![1];
    const html = await response.text();
    const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
    expect(scripts.length).toBeGreaterThan(0);
    for (const tag of scripts) expect(tag, tag).toContain(`nonce="${nonce}"`);
    const again = await fetch(`${APP_URL}/sign-in`);
    expect(again.headers.get('content-security-policy')).not.toBe(response.headers.get('content-security-policy'));
  });

  it('are on an API response', async () => {
    const response = await fetch(`${APP_URL}/api/health`);
    expect(response.status).toBe(200);
    expectSecurityHeaders(response, 'api');
  });

  it('are on a 404', async () => {
    const response = await fetch(`${APP_URL}/no-such-page-${Date.now()}`);
    expect(response.status).toBe(404);
    expectSecurityHeaders(response, '404');
  });

  it('are on a static asset', async () => {
    const html = await (await fetch(`${APP_URL}/sign-in`)).text();
    const asset = /(\/_next\/static\/[^"'\s]+\.(?:js|css))/.exec(html)?.[1];
    expect(asset, 'a /_next/static file referenced by the page').toBeTruthy();
    const response = await fetch(`${APP_URL}${asset}`);
    expect(response.status).toBe(200);
    expectSecurityHeaders(response, 'static');
  });

  it('add HSTS and upgrade-insecure-requests only over https', () => {
    const https = securityHeaders({ nonce: 'n0nce', https: true });
    expect(https['strict-transport-security']).toMatch(/^max-age=31536000/);
    expect(https['content-security-policy']).toMatch(/upgrade-insecure-requests/);
    const http = securityHeaders({ nonce: 'n0nce', https: false });
    expect(http['strict-transport-security']).toBeUndefined();
    expect(http['content-security-policy']).not.toMatch(/upgrade-insecure-requests/);
    expect(servedOverHttps(new Request('https://fluxfolio.example.org/'), {})).toBe(true);
    const proxied = new Request('http://10.0.0.2/', { headers: { 'x-forwarded-proto': 'https' } });
    expect(servedOverHttps(proxied, {})).toBe(false);
    expect(servedOverHttps(proxied, { FLUXFOLIO_TRUST_PROXY: '1' })).toBe(true);
  });
});
