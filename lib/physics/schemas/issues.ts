// Turns zod issues into SpecError issues: one readable "path: message" per problem.
// Unions of single-key objects (wells, loops) report the errors of the branch the input meant, not of every branch.
import type { z } from 'zod';
import type { SpecIssue } from '../errors';

type Issue = z.core.$ZodIssue;

/** Dotted path, array indices in brackets: `well.union[1].disk.radius`. */
export function formatPath(path: readonly PropertyKey[]): string {
  let out = '';
  for (const part of path) {
    if (typeof part === 'number') out += `[${part}]`;
    else out += out ? `.${String(part)}` : String(part);
  }
  return out;
}

/** How badly a union branch misses the input's shape: unknown or missing top-level keys count heavily. */
function branchMismatch(issues: Issue[], depth: number): number {
  let score = 0;
  for (const issue of issues) {
    const rel = issue.path.length - depth;
    if (issue.code === 'unrecognized_keys' && rel <= 0) score += 100;
    else if (issue.code === 'invalid_type' && rel <= 1 && issue.input === undefined) score += 100;
    else if (issue.code === 'invalid_type' && rel <= 0) score += 100;
    else score += 1;
  }
  return score;
}

function flatten(issue: Issue, out: SpecIssue[]): void {
  if (issue.code === 'invalid_union' && issue.errors.length > 0) {
    const depth = issue.path.length;
    let best: Issue[] | null = null;
    let bestScore = Infinity;
    for (const branch of issue.errors) {
      const score = branchMismatch(branch, depth);
      if (score < bestScore) {
        bestScore = score;
        best = branch;
      }
    }
    if (best && bestScore < 100) {
      for (const inner of best) flatten({ ...inner, path: fullPath(issue.path, inner.path) } as Issue, out);
      return;
    }
  }
  out.push({ path: formatPath(issue.path), message: issue.message });
}

/** Union branch issues may carry paths relative to the union; make them absolute. */
function fullPath(base: readonly PropertyKey[], inner: readonly PropertyKey[]): PropertyKey[] {
  if (inner.length >= base.length && base.every((p, i) => inner[i] === p)) return [...inner];
  return [...base, ...inner];
}

/** Converts a ZodError's issues into SpecError issues (deduplicated, in input order). */
export function zodIssuesToSpecIssues(issues: readonly Issue[]): SpecIssue[] {
  const out: SpecIssue[] = [];
  for (const issue of issues) flatten(issue, out);
  const seen = new Set<string>();
  return out.filter((i) => {
    const key = `${i.path}\u0000${i.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}
