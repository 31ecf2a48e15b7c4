// The production server refuses to start without NEXTAUTH_SECRET (instrumentation.ts -> lib/env.ts), with a clear
// message and a non-zero exit, and starts with one. Needs the build that `npm test` makes.
import { spawn } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createServer } from 'node:net';
import { describe, expect, it } from 'vitest';
import { readEnv, serverStartProblems } from '@/lib/env';

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number };
      probe.close(() => resolve(port));
    });
  });
}

/** Start `next start` with the given NEXTAUTH_SECRET (undefined: none); stop it once it listens or exits. */
async function startServer(secret: string | undefined): Promise<{ code: number | null; output: string; listened: boolean }> {
  const port = await freePort();
  const env: Record<string, string | undefined> = { ...process.env, NODE_ENV: 'production', NEXTAUTH_SECRET: secret };
  if (secret === undefined) delete env.NEXTAUTH_SECRET;
  const child = spawn('node_modules/.bin/next', ['start', '-H', '127.0.0.1', '-p', String(port)], {
    env: env as NodeJS.ProcessEnv,
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  let output = '';
  let listened = false;
  const collect = (chunk: Buffer) => {
    output += chunk.toString();
  };
  child.stdout!.on('data', collect);
  child.stderr!.on('data', collect);
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) break;
    const ok = await fetch(`http://127.0.0.1:${port}/api/health`).then((r) => r.status < 500, () => false);
    if (ok) {
      listened = true;
      process.kill(-child.pid!, 'SIGTERM');
      break;
    }
    if (Date.now() > deadline) {
      process.kill(-child.pid!, 'SIGKILL');
      throw new Error(`next start neither listened nor exited within 60 s:\n${output}`);
    }
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
  const code = await exited;
  return { code, output, listened };
}

describe('server start', () => {
  it('lists a missing NEXTAUTH_SECRET as a start problem in production only', () => {
    expect(serverStartProblems(readEnv({ NODE_ENV: 'production' }))).toEqual([expect.stringMatching(/NEXTAUTH_SECRET is not set/)]);
    expect(serverStartProblems(readEnv({ NODE_ENV: 'production', NEXTAUTH_SECRET: 'a'.repeat(32) }))).toEqual([]);
    expect(serverStartProblems(readEnv({ NODE_ENV: 'development' }))).toEqual([]);
  });

  it('refuses to start `next start` without NEXTAUTH_SECRET, and starts with one', async () => {
    expect(existsSync('.next/BUILD_ID'), 'run through `npm test`, which builds the app').toBe(true);
    const refused = await startServer(undefined);
    expect(refused.listened).toBe(false);
    expect(refused.code).not.toBe(0);
    expect(refused.output).toMatch(/NEXTAUTH_SECRET is not set: the server refuses to start/);
    const started = await startServer('a-test-secret-that-is-long-enough');
    expect(started.listened, started.output).toBe(true);
  }, 150_000);
});
