// The one helper that turns validation issues (zod issues, or the solver's SpecError issues) into per-field messages
// `{ 'params.grid.h': ['…'] }`: dotted paths, array indices as plain segments, `_` for the whole value. Client-safe.
import type { FieldMessages } from './domain-error';

/**
 * One validation problem: its path, either as segments (zod: `['members', 0, 'role']`) or as the solver's string
 * (`'well.union[1].disk.radius'`), and the message.
 */
export interface ValidationIssue {
  readonly path: readonly PropertyKey[] | string;
  readonly message: string;
}

/** The path's segments: strings split at `.`, `[` and `]` (so `a.b[1].c` and `['a', 'b', 1, 'c']` agree). */
function segments(path: ValidationIssue['path']): string[] {
  if (typeof path === 'string') return path.split(/[.[\]]+/).filter((part) => part !== '');
  return path.map((part) => (typeof part === 'symbol' ? (part.description ?? '') : String(part)));
}

/**
 * The field key of a path: dotted segments under `prefix`; `_` for the whole value (or `prefix` itself, when given).
 *
 * @example
 * fieldKey(['members', 0, 'role']); // 'members.0.role'
 * fieldKey('well.union[1].disk.radius', 'params'); // 'params.well.union.1.disk.radius'
 * fieldKey([]); // '_'
 */
export function fieldKey(path: ValidationIssue['path'], prefix?: string): string {
  const parts = [...(prefix ? [prefix] : []), ...segments(path)];
  return parts.length ? parts.join('.') : '_';
}

/**
 * Per-field messages of a list of issues, in their order (several messages for one field are kept).
 *
 * @param prefix - put every key under this field (the solver's issues of a figure's `params` → `'params'`)
 * @example
 * fieldMessages(result.error.issues); // { email: ['Enter an e-mail address'], _: ['…'] }
 * fieldMessages(specError.issues, { prefix: 'params' }); // { 'params.grid.h': ['must be positive'] }
 */
export function fieldMessages(issues: readonly ValidationIssue[], { prefix }: { prefix?: string } = {}): FieldMessages {
  const fields: FieldMessages = {};
  for (const issue of issues) (fields[fieldKey(issue.path, prefix)] ??= []).push(issue.message);
  return fields;
}
