// Tests of the compute CLI: JSON result on stdout, exit 2 with per-field messages for bad JSON/spec/limits,
// stdin input, and clean cancellation with SIGINT (exit 130).
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';

const root = path.resolve(__dirname, '../..');
const args = ['--import', 'tsx', path.join(root, 'scripts/compute.ts')];
const dir = mkdtempSync(path.join(tmpdir(), 'fluxfolio-cli-'));

function run(cliArgs: string[], input?: string, env: Record<string, string> = {}) {
  return spawnSync(process.execPath, [...args, ...cliArgs], { cwd: root, input, encoding: 'utf8', env: { ...process.env, ...env }, timeout: 120_000 });
}

function specFile(name: string, spec: unknown): string {
  const file = path.join(dir, name);
  writeFileSync(file, typeof spec === 'string' ? spec : JSON.stringify(spec));
  return file;
}

const small = { task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.125 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 2 };

describe('scripts/compute.ts', () => {
  it('prints the result as canonical JSON and progress on stderr', () => {
    const r = run([specFile('ok.json', small)]);
    expect(r.status).toBe(0);
    const result = JSON.parse(r.stdout);
    expect(result.task).toBe('spectrum');
    expect(result.levels).toHaveLength(2);
    expect(Object.keys(result)).toEqual([...Object.keys(result)].sort());
    expect(r.stderr).toMatch(/progress 100%/);
  });

  it('reads the spec from stdin with -, and pretty-prints on request', () => {
    const r = run(['-', '--pretty'], JSON.stringify(small));
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^\{\n {2}"degenerate"/);
  });

  it('exit 2 with one line per invalid field', () => {
    const bad = { task: 'spectrum', well: { disk: { center: [0, 0], radius: -1 } }, grid: { h: 0 }, levels: 0 };
    const r = run([specFile('bad.json', bad)]);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain('well.disk.radius: radius must be positive');
    expect(r.stderr).toContain('grid.h: grid spacing h must be positive');
    expect(r.stderr).toContain('levels: levels must be at least 1');
    expect(r.stdout).toBe('');
  });

  it('exit 2 for invalid JSON, a missing file and unknown options', () => {
    expect(run([specFile('broken.json', '{"task":')]).status).toBe(2);
    const missing = run([path.join(dir, 'nope.json')]);
    expect(missing.status).toBe(2);
    expect(missing.stderr).toMatch(/cannot read/);
    expect(run(['--fast', specFile('ok2.json', small)]).status).toBe(2);
  });

  it('exit 2 with advice when the budget is exceeded', () => {
    const r = run([specFile('big.json', { ...small, grid: { h: 0.001 } })]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/grid h = 0\.001 gives about 3,1\d\d,\d{3} unknowns; the limit is 250,000: use h >= 0\.0036 or a smaller well/);
    const capped = run([specFile('capped.json', { ...small, grid: { h: 0.05 } })], undefined, { FLUXFOLIO_MAX_UNKNOWNS: '1000' });
    expect(capped.status).toBe(2);
    expect(capped.stderr).toMatch(/the limit is 1,000/);
  });

  it('SIGINT cancels a running solve cleanly with exit 130', async () => {
    const file = specFile('slow.json', { ...small, grid: { h: 1 / 150 }, tubes: [{ at: [0.1, 0], alpha: 0.3 }], levels: 12 });
    const child = spawn(process.execPath, [...args, file], { cwd: root, stdio: ['ignore', 'pipe', 'pipe'] });
    let stderr = '';
    let stdout = '';
    child.stdout.on('data', (d) => (stdout += d));
    const code = await new Promise<number | null>((resolve) => {
      child.stderr.on('data', (d) => {
        stderr += d;
        if (/solving/.test(stderr) && !child.killed) child.kill('SIGINT');
      });
      child.on('exit', (c) => resolve(c));
    });
    expect(code).toBe(130);
    expect(stderr).toMatch(/cancelled/);
    expect(stdout).toBe('');
  });
});
