// Server start hook (Next calls register() once when `next start` or `next dev` boots, never during `next build`):
// refuses to serve when a required setting is missing, with a clear message and exit code 1.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return;
  const { serverStartProblems } = await import('./lib/env');
  const problems = serverStartProblems();
  if (problems.length === 0) return;
  for (const problem of problems) console.error(`[fluxfolio] ${problem}`);
  process.exit(1);
}
