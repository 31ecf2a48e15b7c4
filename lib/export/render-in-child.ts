// The chart of an export drawn in a child process with a heap limit and a wall-time limit: Vega evaluates a view's
// expressions there, so a heavy transform ends that process with a clear error instead of exhausting the server.
import childProcess from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { ChartSpec } from '@/lib/charts/common';
import { invalid } from '@/lib/domain-error';
import { assertInlineData, finishSvg, type RenderedSvg, type RenderSvgOptions } from './render-svg';

/**
 * Limits of one export's child process (a chart of the app needs about a second and well under 100 MB). A child process
 * rather than a worker thread: a worker that hits its heap limit on one large allocation aborts the whole server process.
 */
export const EXPORT_LIMITS = {
  /** Wall time from start to answer, in ms; the child is killed after it. */
  timeMs: 20_000,
  /** V8 old-generation heap of the child, in MB. */
  maxOldGenerationSizeMb: 256,
  /** V8 semi-space of the child's young generation, in MB. */
  maxSemiSpaceSizeMb: 16,
};

export type ExportLimits = typeof EXPORT_LIMITS;

const CHILD_FILE = 'render-child.mjs';

let childPath: string | null = null;

/**
 * The child's entry (lib/export/render-child.mjs) with its imports beside it: under the project directory (the built
 * server runs there; the bundler copies a lone asset without its imports, so none is taken from the bundle), else
 * beside this module (tests, scripts).
 */
export function renderChildPath(): string {
  if (childPath) return childPath;
  const candidates = [path.join(process.cwd(), 'lib', 'export', CHILD_FILE)];
  try {
    candidates.push(path.join(path.dirname(fileURLToPath(import.meta.url)), CHILD_FILE));
  } catch {
    // inside a bundle import.meta.url may not be a file URL
  }
  const found = candidates.find((file) => fs.existsSync(file));
  if (!found) throw new Error(`export renderer ${CHILD_FILE} not found (looked in ${candidates.join(', ')})`);
  childPath = found;
  return found;
}

/**
 * child_process.fork, looked up at run time: the bundler traces literal fork() calls and fails on a path it cannot know
 * at build time; the child's file is found by renderChildPath and loaded by Node, not bundled.
 */
const forkChild = Reflect.get(childProcess, 'fork') as typeof childProcess.fork;

function tooHeavy(reason: string) {
  return invalid(`The chart is too heavy to export: ${reason}. Simplify the view spec (transforms, expressions) and try again.`);
}

/**
 * Render a Vega-Lite spec to SVG in a fresh child process (one per export), with the same bytes as renderSvg.
 *
 * @throws DomainError `invalid` when the child runs out of memory or time ("The chart is too heavy to export: …") or
 *   Vega refuses the spec ("The chart could not be drawn: …"); Error when the spec asks to load data
 * @example const { svg } = await renderSvgInChild(spec, { width: 'one-column' })
 */
export async function renderSvgInChild(spec: ChartSpec, options: RenderSvgOptions = {}, limits: ExportLimits = EXPORT_LIMITS): Promise<RenderedSvg> {
  assertInlineData(spec);
  const child = forkChild(renderChildPath(), [], {
    execArgv: [`--max-old-space-size=${limits.maxOldGenerationSizeMb}`, `--max-semi-space-size=${limits.maxSemiSpaceSizeMb}`],
    stdio: ['ignore', 'ignore', 'pipe', 'ipc'],
    serialization: 'advanced',
  });
  try {
    const raw = await new Promise<string>((resolve, reject) => {
      const timer = setTimeout(() => reject(tooHeavy(`it took longer than ${limits.timeMs / 1000} s`)), limits.timeMs);
      const settle = (fn: () => void) => {
        clearTimeout(timer);
        fn();
      };
      child.once('message', (answer: { svg?: string; error?: string }) => {
        if (typeof answer.svg === 'string') settle(() => resolve(answer.svg as string));
        else settle(() => reject(invalid(`The chart could not be drawn: ${answer.error ?? 'unknown error'}`)));
      });
      child.once('error', (error) => settle(() => reject(error)));
      let stderr = '';
      child.stderr?.on('data', (chunk: Buffer) => {
        stderr = (stderr + chunk.toString()).slice(-2_000);
      });
      child.once('exit', (code, signal) => {
        if (signal === 'SIGABRT' || code === 134) {
          settle(() => reject(tooHeavy(`it needed more than ${limits.maxOldGenerationSizeMb} MB of memory`)));
          return;
        }
        // Not a limit: the renderer itself failed (a server fault, logged with the child's last words).
        settle(() => reject(new Error(`export renderer stopped (${signal ?? `exit code ${code}`}): ${stderr.trim()}`)));
      });
      child.send(spec);
    });
    return finishSvg(raw, options);
  } finally {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
  }
}
