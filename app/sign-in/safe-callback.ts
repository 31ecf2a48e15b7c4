// Keep post-sign-in redirects on this site: whatever arrives in ?callbackUrl=, only its path is followed.
// Used by the sign-in page for ?callbackUrl=.
/**
 * @example
 * safeCallbackPath('/m/rings'); // '/m/rings'
 * safeCallbackPath('http://127.0.0.1:3100/m/rings?tab=1'); // '/m/rings?tab=1' (origin dropped: never leaves the site)
 * safeCallbackPath('//evil.example/x'); // '/dashboard'
 */
export function safeCallbackPath(value: string | string[] | undefined): string {
  const raw = Array.isArray(value) ? value[0] : value;
  if (!raw || raw.startsWith('//') || raw.includes('\\')) return '/dashboard';
  try {
    const url = new URL(raw, 'http://local.invalid');
    if (url.protocol !== 'http:' && url.protocol !== 'https:') return '/dashboard';
    const path = `${url.pathname}${url.search}`;
    if (!path.startsWith('/') || path.startsWith('//') || path.startsWith('/sign-in') || path.startsWith('/api/')) {
      return '/dashboard';
    }
    return path;
  } catch {
    return '/dashboard';
  }
}
