// Test helper: start `scripts/worker.ts` as ONE node process (node --import tsx, no npx wrapper, so that kill -9 hits
// the worker itself), collect its output and wait for lines.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

const ROOT = path.resolve(__dirname, '../..');

export interface WorkerProcess {
  child: ChildProcess;
  output: () => string;
  waitForLine: (pattern: RegExp, timeoutMs?: number) => Promise<string>;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

/** Spawn a worker on `queue` against the current DATABASE_URL, with short recovery and maintenance intervals. */
export function startWorker(queue: string, env: Record<string, string> = {}): WorkerProcess {
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/worker.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      FLUXFOLIO_RUN_QUEUE: queue,
      FLUXFOLIO_RECOVER_SECONDS: '1',
      FLUXFOLIO_MAINTENANCE_SECONDS: '2',
      FLUXFOLIO_WORKER_GRACE_SECONDS: '2',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let text = '';
  const listeners = new Set<() => void>();
  const onData = (chunk: Buffer) => {
    text += chunk.toString('utf8');
    for (const listener of listeners) listener();
  };
  child.stdout?.on('data', onData);
  child.stderr?.on('data', onData);
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    child.on('exit', (code, signal) => {
      for (const listener of listeners) listener();
      resolve({ code, signal });
    }),
  );
  const waitForLine = (pattern: RegExp, timeoutMs = 60_000) =>
    new Promise<string>((resolve, reject) => {
      const check = () => {
        const line = text.split('\n').find((l) => pattern.test(l));
        if (line !== undefined) {
          listeners.delete(check);
          clearTimeout(timer);
          resolve(line);
        } else if (child.exitCode !== null || child.signalCode !== null) {
          listeners.delete(check);
          clearTimeout(timer);
          reject(new Error(`worker exited before printing ${pattern}:\n${text}`));
        }
      };
      const timer = setTimeout(() => {
        listeners.delete(check);
        reject(new Error(`timed out waiting for ${pattern} from the worker:\n${text}`));
      }, timeoutMs);
      listeners.add(check);
      check();
    });
  return { child, output: () => text, waitForLine, exited };
}
