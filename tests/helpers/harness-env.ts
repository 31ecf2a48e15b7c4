// The settings scripts/test.sh hands to the tests (APP_URL, MAIL_DIR, …): read them or fail loudly, so a test that needs
// a service never passes or skips quietly when it was run without the harness.

/**
 * The value of an environment variable the harness sets, or an error naming it and how to get it.
 *
 * @example
 * const appUrl = harnessEnv('APP_URL');
 */
export function harnessEnv(name: 'APP_URL' | 'MAIL_DIR' | 'CHROMIUM_PATH' | 'DATABASE_URL' | 'SMTP_URL'): string {
  const value = process.env[name];
  if (!value) {
    throw new Error(
      `${name} is not set: this test needs the services that \`npm test\` (scripts/test.sh) starts — run it as ` +
        '`npm test -- <test file>`, not with a bare `npx vitest`.',
    );
  }
  return value;
}
