// Save-time and live-preview check of a figure note: parse with the MDX syntax, run the safety gate, then compile, and report
// every problem with its line and column (refusals of the gate, syntax errors, math that KaTeX cannot typeset as warnings).
import { compile } from '@mdx-js/mdx';
import { noteCompileOptions, parseNote } from './compile-note';
import { findUnsafeNodes, MdxSafetyError } from './remark-safe';

/** One problem in a note, 1-based line and column; `message` starts with "line N: ". */
export interface NoteProblem {
  line: number;
  column: number;
  message: string;
}

export type NoteCheck = { ok: true; warnings: NoteProblem[] } | { ok: false; errors: NoteProblem[] };

interface PositionedMessage {
  reason?: string;
  cause?: unknown;
  message?: string;
  line?: number | null;
  column?: number | null;
  place?: { line?: number; column?: number; start?: { line: number; column: number } } | null;
}

function problemFrom(error: unknown): NoteProblem {
  const e = (error ?? {}) as PositionedMessage;
  const place = e.place && 'start' in e.place && e.place.start ? e.place.start : (e.place as { line?: number; column?: number } | null);
  const line = e.line ?? place?.line ?? 1;
  const column = e.column ?? place?.column ?? 1;
  const base = (e.reason ?? e.message ?? String(error)).replace(/^\d+:\d+(-\d+:\d+)?:\s*/, '');
  const cause = e.cause instanceof Error ? e.cause.message.split('\n')[0] : null;
  const reason = cause && !base.includes(cause) ? `${base}: ${cause}` : base;
  return { line, column, message: `line ${line}: ${reason}` };
}

/**
 * Check a note's source. Never throws: syntax errors and refusals come back as `errors`, each naming its line.
 *
 * @param source - the MDX source as typed by the author
 * @returns `{ ok: true, warnings }` when it compiles safely (warnings: e.g. math KaTeX could not typeset), else `{ ok: false, errors }`
 * @example
 * await checkNoteSource('intro\n\nimport fs from "node:fs"')
 * // returns { ok: false, errors: [{ line: 3, column: 1, message: 'line 3: imports are not allowed in figure notes' }] }
 */
export async function checkNoteSource(source: string): Promise<NoteCheck> {
  if (typeof source !== 'string') {
    return { ok: false, errors: [{ line: 1, column: 1, message: 'line 1: the note source must be text' }] };
  }
  let issues;
  try {
    issues = findUnsafeNodes(parseNote(source));
  } catch (error) {
    return { ok: false, errors: [problemFrom(error)] };
  }
  if (issues.length > 0) return { ok: false, errors: issues };
  let file;
  try {
    file = await compile(source, noteCompileOptions);
  } catch (error) {
    if (error instanceof MdxSafetyError) return { ok: false, errors: error.issues };
    return { ok: false, errors: [problemFrom(error)] };
  }
  const warnings = file.messages.map((m) => problemFrom(m));
  return { ok: true, warnings };
}
