// Tests of the build's git commit (lib/build-info.ts): read from a .git directory, from a linked worktree's
// "gitdir:" file through its common directory and packed-refs, and null where there is no repository.
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { readGitCommit } from '@/lib/build-info';

const A = 'a'.repeat(40);
const B = '0123456789abcdef0123456789abcdef01234567';
const root = mkdtempSync(path.join(tmpdir(), 'fluxfolio-build-info-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));

function write(file: string, text: string): void {
  mkdirSync(path.dirname(file), { recursive: true });
  writeFileSync(file, text);
}

describe('readGitCommit', () => {
  it('follows HEAD to a loose ref in a .git directory, from a subfolder', () => {
    const repo = path.join(root, 'plain');
    write(path.join(repo, '.git', 'HEAD'), 'ref: refs/heads/main\n');
    write(path.join(repo, '.git', 'refs', 'heads', 'main'), `${A}\n`);
    mkdirSync(path.join(repo, 'lib', 'deep'), { recursive: true });
    expect(readGitCommit(path.join(repo, 'lib', 'deep'))).toBe(A);
  });

  it('reads a linked worktree: HEAD in its gitdir, the branch in packed-refs of the common directory', () => {
    const main = path.join(root, 'main-repo', '.git');
    write(path.join(main, 'packed-refs'), `# pack-refs with: peeled fully-peeled sorted\n${A} refs/heads/other\n${B} refs/heads/wt\n`);
    const gitdir = path.join(main, 'worktrees', 'wt');
    write(path.join(gitdir, 'HEAD'), 'ref: refs/heads/wt\n');
    write(path.join(gitdir, 'commondir'), '../..\n');
    const worktree = path.join(root, 'wt');
    write(path.join(worktree, '.git'), `gitdir: ${gitdir}\n`);
    expect(readGitCommit(worktree)).toBe(B);
  });

  it('takes a detached HEAD as it is', () => {
    const repo = path.join(root, 'detached');
    write(path.join(repo, '.git', 'HEAD'), `${B}\n`);
    expect(readGitCommit(repo)).toBe(B);
  });

  it('is null for a ref that does not resolve', () => {
    const repo = path.join(root, 'dangling');
    write(path.join(repo, '.git', 'HEAD'), 'ref: refs/heads/missing\n');
    expect(readGitCommit(repo)).toBeNull();
  });
});
