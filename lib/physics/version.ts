// Solver version (package version plus a solver revision) and the git commit of the checkout, for reproducibility.
// Results record both; bump SOLVER_REVISION whenever numbers the solver produces may change.
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import pkg from '../../package.json';

/** Revision of the numerical core; part of SOLVER_VERSION. */
export const SOLVER_REVISION = 'solver.1';

/** e.g. "0.1.0+solver.1". */
export const SOLVER_VERSION = `${pkg.version}+${SOLVER_REVISION}`;

let cached: string | null | undefined;

/** Finds the .git directory from the working directory upwards. */
function findGitDir(): string | null {
  let dir = process.cwd();
  for (;;) {
    const candidate = path.join(dir, '.git');
    if (existsSync(candidate)) return candidate;
    const parent = path.dirname(dir);
    if (parent === dir) return null;
    dir = parent;
  }
}

/**
 * The commit hash of the checkout, read from .git without spawning git; null when unknown (no .git, detached
 * worktree file, unreadable refs). Cached after the first call.
 * @example
 * gitCommit(); // "7908b50..." or null
 */
export function gitCommit(): string | null {
  if (cached !== undefined) return cached;
  cached = null;
  try {
    const gitDir = findGitDir();
    if (!gitDir) return cached;
    const head = readFileSync(path.join(gitDir, 'HEAD'), 'utf8').trim();
    if (/^[0-9a-f]{40}$/.test(head)) return (cached = head);
    const match = /^ref: (.+)$/.exec(head);
    if (!match) return cached;
    const refFile = path.join(gitDir, match[1]);
    if (existsSync(refFile)) {
      const sha = readFileSync(refFile, 'utf8').trim();
      if (/^[0-9a-f]{40}$/.test(sha)) return (cached = sha);
    }
    const packed = path.join(gitDir, 'packed-refs');
    if (existsSync(packed)) {
      for (const line of readFileSync(packed, 'utf8').split('\n')) {
        const [sha, ref] = line.trim().split(' ');
        if (ref === match[1] && /^[0-9a-f]{40}$/.test(sha)) return (cached = sha);
      }
    }
  } catch {
    cached = null;
  }
  return cached;
}
