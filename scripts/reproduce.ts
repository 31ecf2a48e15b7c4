// `npm run -s reproduce -- bundle.json`: recompute a snapshot bundle with this solver and verify its hash.
// Exit 0 identical, 1 different (with a summary of the differences), 2 unreadable or invalid bundle; progress on stderr.
import { readFileSync } from 'node:fs';
import { AbortError, LimitError } from '@/lib/physics/errors';
import { BundleError, parseBundle, verifyBundle } from '@/lib/snapshots/verify-bundle';

const USAGE = 'usage: npm run -s reproduce -- <bundle.json | ->   (a snapshot bundle downloaded from Fluxfolio; - reads stdin)';

function fail(code: number, message: string): never {
  process.stderr.write(`reproduce: ${message}\n`);
  process.exit(code);
}

function readInput(path: string): string {
  try {
    return readFileSync(path === '-' ? 0 : path, 'utf8');
  } catch (error) {
    fail(2, `cannot read ${path === '-' ? 'standard input' : path}: ${(error as Error).message}`);
  }
}

async function main(): Promise<void> {
  const args = process.argv.slice(2).filter((arg) => arg !== '--');
  if (args.includes('-h') || args.includes('--help')) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  if (args.length !== 1) fail(2, USAGE);
  const [path] = args;
  const name = path === '-' ? 'standard input' : path;

  let json: unknown;
  try {
    json = JSON.parse(readInput(path));
  } catch (error) {
    fail(2, `${name} is not valid JSON: ${(error as Error).message}`);
  }
  let bundle;
  try {
    bundle = parseBundle(json);
  } catch (error) {
    if (error instanceof BundleError) fail(2, `${name} is not a valid snapshot bundle:\n  ${error.issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)).join('\n  ')}`);
    throw error;
  }

  const controller = new AbortController();
  process.on('SIGINT', () => controller.abort());
  process.stderr.write(`reproduce: ${bundle.figure.label} v${bundle.version} (${bundle.figure.kind}) of "${bundle.manuscript.title}"\n`);
  let lastShown = -1;
  const onProgress = (fraction: number, message?: string) => {
    const percent = Math.floor(Math.min(1, Math.max(0, fraction)) * 100);
    if (percent >= lastShown + 10 || (percent === 100 && lastShown < 100)) {
      lastShown = percent;
      process.stderr.write(`reproduce: ${percent}%${message ? ` ${message}` : ''}\n`);
    }
  };

  try {
    const check = await verifyBundle(bundle, { signal: controller.signal, onProgress });
    process.stdout.write(`${check.summary}\n`);
    process.exit(check.identical ? 0 : 1);
  } catch (error) {
    if (error instanceof AbortError || controller.signal.aborted) fail(130, 'cancelled');
    if (error instanceof LimitError) fail(2, `this machine's solver budget refuses the bundle: ${error.message}`);
    fail(1, `could not recompute the bundle: ${(error as Error).message}`);
  }
}

main().catch((error: unknown) => fail(1, (error as Error).message ?? String(error)));
