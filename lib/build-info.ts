// The git commit of the running checkout, for what records it (snapshots): FLUXFOLIO_GIT_COMMIT when set (a deployment
// without .git), else read once from .git without spawning git (plain clones and linked worktrees); null when unknown.
import { existsSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';

const COMMIT = /^[0-9a-f]{40}$/;

let cached: string | null | undefined;

/** Finds the .git entry (a directory, or a worktree's "gitdir:" file) from `start` upwards. */
function findGitEntry(start: string): string | null {
  let dir = start;
  for (;;) {
    const candidate = path.join(dir, '.git');
    if (existsSync(candidate)) return candidate;
    const parent = path.dirname(dir);
    if (parent === dir) return null;
    dir = parent;
  }
}

/** The directory holding HEAD, and the one holding refs (the main repository's for a linked worktree). */
function gitDirs(entry: string): { headDir: string; commonDir: string } | null {
  if (statSync(entry).isDirectory()) return { headDir: entry, commonDir: entry };
  const match = /^gitdir: (.+)$/m.exec(readFileSync(entry, 'utf8'));
  if (!match) return null;
  const headDir = path.resolve(path.dirname(entry), match[1].trim());
  const commonFile = path.join(headDir, 'commondir');
  const commonDir = existsSync(commonFile) ? path.resolve(headDir, readFileSync(commonFile, 'utf8').trim()) : headDir;
  return { headDir, commonDir };
}

/** Resolves a ref name through the loose ref files and packed-refs. */
function resolveRef(dirs: { headDir: string; commonDir: string }, ref: string): string | null {
  for (const dir of [dirs.headDir, dirs.commonDir]) {
    const file = path.join(dir, ref);
    if (existsSync(file)) {
      const sha = readFileSync(file, 'utf8').trim();
      if (COMMIT.test(sha)) return sha;
    }
  }
  const packed = path.join(dirs.commonDir, 'packed-refs');
  if (!existsSync(packed)) return null;
  for (const line of readFileSync(packed, 'utf8').split('\n')) {
    const [sha, name] = line.trim().split(' ');
    if (name === ref && COMMIT.test(sha)) return sha;
  }
  return null;
}

/** The commit checked out below `start`, read from .git; null when there is none or it cannot be read. */
export function readGitCommit(start: string): string | null {
  try {
    const entry = findGitEntry(start);
    const dirs = entry ? gitDirs(entry) : null;
    if (!dirs) return null;
    const head = readFileSync(path.join(dirs.headDir, 'HEAD'), 'utf8').trim();
    if (COMMIT.test(head)) return head;
    const match = /^ref: (.+)$/.exec(head);
    return match ? resolveRef(dirs, match[1]) : null;
  } catch {
    return null;
  }
}

/**
 * The commit of this build: FLUXFOLIO_GIT_COMMIT (40 lowercase hex digits) when set, else the checkout's commit
 * from the working directory upwards. Read once.
 * @example
 * buildCommit(); // "7908b50..." or null
 */
export function buildCommit(): string | null {
  if (cached !== undefined) return cached;
  const fromEnv = process.env.FLUXFOLIO_GIT_COMMIT?.trim().toLowerCase();
  cached = fromEnv && COMMIT.test(fromEnv) ? fromEnv : readGitCommit(process.cwd());
  return cached;
}
