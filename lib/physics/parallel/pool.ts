// Runs the chunks of a scan inline or over a pool of worker_threads; chunks are fixed in advance, so the results are
// identical bit for bit for any number of workers. Cancellation through the signal terminates the workers.
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Worker } from 'node:worker_threads';
import { AbortError } from '../errors';
import { type ChunkResult, runScanChunk, type ScanChunk, type ScanJob } from './scan-chunk';

/** Options of a pooled scan. */
export interface PoolOptions {
  /**
   * 0 runs inline on this thread; n >= 1 uses n worker threads (inline when the TypeScript worker entry or the tsx
   * loader cannot be found, e.g. inside a bundle). Default: see defaultWorkerCount.
   */
  workers?: number;
  signal?: AbortSignal;
  /** Called with the number of positions solved so far (owned positions only). */
  onPositions?: (done: number) => void;
  /** Called once with the number of worker threads actually used (0 = inline). */
  onWorkers?: (count: number) => void;
}

/** Scans with fewer positions than this run inline by default (starting threads costs more). Bench: npm run bench. */
export const INLINE_MAX_POSITIONS = 400;

/** Upper bound on default worker threads (env FLUXFOLIO_SCAN_WORKERS overrides). */
export const MAX_DEFAULT_WORKERS = 4;

/**
 * The default number of workers for a scan of `positions` positions: inline below INLINE_MAX_POSITIONS, otherwise
 * FLUXFOLIO_SCAN_WORKERS or min(available cores, MAX_DEFAULT_WORKERS).
 * @example
 * defaultWorkerCount(100); // 0 (inline)
 */
export function defaultWorkerCount(positions: number): number {
  if (positions < INLINE_MAX_POSITIONS) return 0;
  const env = Number(process.env.FLUXFOLIO_SCAN_WORKERS);
  if (Number.isInteger(env) && env >= 0) return env;
  return Math.max(1, Math.min(os.availableParallelism?.() ?? os.cpus().length, MAX_DEFAULT_WORKERS));
}

/** The TypeScript worker entry: next to this module, or (inside a bundle, where this module has moved) under the cwd. */
function workerEntry(): string | null {
  const candidates: string[] = [];
  try {
    candidates.push(path.join(path.dirname(fileURLToPath(import.meta.url)), 'scan-worker.ts'));
  } catch {
    // import.meta.url is not a file URL inside some bundles.
  }
  candidates.push(path.join(process.cwd(), 'lib', 'physics', 'parallel', 'scan-worker.ts'));
  return candidates.find((file) => existsSync(file)) ?? null;
}

/** The tsx ESM API module (its `register()` installs the TypeScript loader in the calling thread), or null. */
function tsxApiPath(): string | null {
  const bases: string[] = [];
  try {
    bases.push(fileURLToPath(import.meta.url));
  } catch {
    // Not a file URL inside some bundles.
  }
  bases.push(path.join(process.cwd(), 'package.json'));
  for (const base of bases) {
    try {
      const require = createRequire(base);
      const api = path.join(path.dirname(require.resolve('tsx/package.json')), 'dist', 'esm', 'api', 'index.mjs');
      if (existsSync(api)) return api;
    } catch {
      // Try the next base.
    }
  }
  return null;
}

/**
 * Bootstrap source of a worker: registers the tsx loader in the worker thread, then imports the TypeScript entry, or
 * null when either cannot be found (then the scan runs inline). On Node 20 `execArgv: ['--import', 'tsx']` does not
 * reach a worker's own entry module, so the loader is registered from a small eval'd script instead; paths are
 * resolved at call time, so bundlers leave them alone.
 */
function workerBootstrap(): string | null {
  const entry = workerEntry();
  if (!entry) return null;
  const api = tsxApiPath();
  if (!api) return null;
  return `import(${JSON.stringify(pathToFileURL(api).href)}).then((m) => { m.register(); return import(${JSON.stringify(pathToFileURL(entry).href)}); })`;
}

/** Why a pooled scan failed inside a worker. */
class WorkerFailure extends Error {
  constructor(message: string, name: string) {
    super(message);
    this.name = name === 'Error' ? 'WorkerFailure' : name;
  }
}

/**
 * Solves every chunk and returns the results in chunk order.
 *
 * @param job - the scan (structured-cloned to each worker once)
 * @param chunks - fixed chunks (scanChunks)
 * @param options - workers, signal, progress
 * @returns one ChunkResult per chunk, ordered by chunk index
 * @throws AbortError when cancelled (workers are terminated)
 * @example
 * const results = await runChunks(job, scanChunks(job.nb), { workers: 2 });
 */
export async function runChunks(job: ScanJob, chunks: ScanChunk[], options: PoolOptions = {}): Promise<ChunkResult[]> {
  const workers = Math.max(0, Math.min(options.workers ?? defaultWorkerCount(job.na * job.nb), chunks.length));
  if (options.signal?.aborted) throw new AbortError();
  const bootstrap = workers > 0 ? workerBootstrap() : null;
  options.onWorkers?.(bootstrap === null ? 0 : workers);
  if (workers === 0 || bootstrap === null) return runInline(job, chunks, options);
  return runPooled(job, chunks, workers, bootstrap, options);
}

async function runInline(job: ScanJob, chunks: ScanChunk[], options: PoolOptions): Promise<ChunkResult[]> {
  const out: ChunkResult[] = [];
  let before = 0;
  for (const chunk of chunks) {
    out.push(runScanChunk(job, chunk, { signal: options.signal, onPosition: (done) => options.onPositions?.(before + done) }));
    before += (chunk.rowEnd - chunk.rowStart) * job.na;
    // Let timers and abort handlers run between chunks.
    await new Promise((resolve) => setImmediate(resolve));
  }
  return out;
}

function runPooled(job: ScanJob, chunks: ScanChunk[], count: number, bootstrap: string, options: PoolOptions): Promise<ChunkResult[]> {
  return new Promise<ChunkResult[]>((resolve, reject) => {
    const results: ChunkResult[] = new Array(chunks.length);
    const doneBy = new Float64Array(chunks.length);
    const threads: Worker[] = [];
    let next = 0;
    let finished = 0;
    let settled = false;
    let positions = 0;

    const stop = (error: Error | null) => {
      if (settled) return;
      settled = true;
      options.signal?.removeEventListener('abort', onAbort);
      for (const t of threads) void t.terminate();
      if (error) reject(error);
      else resolve(results);
    };
    const onAbort = () => stop(new AbortError());
    options.signal?.addEventListener('abort', onAbort, { once: true });

    const feed = (worker: Worker) => {
      if (next >= chunks.length) return;
      worker.postMessage({ type: 'chunk', chunk: chunks[next++] });
    };

    for (let w = 0; w < count; w++) {
      const worker = new Worker(bootstrap, { eval: true });
      threads.push(worker);
      worker.on('message', (message: { type: string; index: number; done: number; result: ChunkResult; message: string; name: string }) => {
        if (settled) return;
        if (message.type === 'progress') {
          positions += message.done - doneBy[message.index];
          doneBy[message.index] = message.done;
          options.onPositions?.(positions);
        } else if (message.type === 'result') {
          results[message.result.index] = message.result;
          finished++;
          if (finished === chunks.length) stop(null);
          else feed(worker);
        } else if (message.type === 'error') {
          stop(new WorkerFailure(message.message, message.name));
        }
      });
      worker.on('error', (error) => stop(error instanceof Error ? error : new Error(String(error))));
      worker.on('exit', (code) => {
        if (!settled && code !== 0) stop(new Error(`scan worker exited with code ${code}`));
      });
      worker.postMessage({ type: 'job', job });
      feed(worker);
    }
  });
}
