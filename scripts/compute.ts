// CLI: `npm run -s compute -- spec.json [--pretty]` (or `-` for stdin) runs one solver task and prints the JSON result.
// Progress goes to stderr; exit 2 for bad JSON/spec/limits, 1 for a solver failure, 130 when cancelled with Ctrl-C.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { isMainThread, parentPort, Worker, workerData } from 'node:worker_threads';
import { canonicalJson } from '../lib/physics/canonical';
import { AbortError, LimitError, SpecError } from '../lib/physics/errors';
import { runTask } from '../lib/physics/run-task';
import { parseTaskSpec, type TaskSpec } from '../lib/physics/schemas';

const USAGE = 'usage: npm run -s compute -- <spec.json | -> [--pretty]';
/** Progress lines are written at most every this many percent. */
const PROGRESS_STEP = 5;

type FromWorker =
  | { type: 'progress'; fraction: number; message?: string }
  | { type: 'result'; json: string }
  | { type: 'error'; name: string; message: string; issues?: { path: string; message: string }[] };

interface WorkerInput {
  fluxfolioCompute: true;
  spec: TaskSpec;
  baseDir: string;
}

/** Reads mask images (and any other file the spec names) relative to the spec's folder. */
function fileResolver(baseDir: string): (key: string) => Uint8Array {
  return (key) => new Uint8Array(readFileSync(path.resolve(baseDir, key)));
}

/** Worker side: run the task, stream progress, post the canonical JSON or the error. */
async function workerMain(input: WorkerInput): Promise<void> {
  const port = parentPort;
  if (!port) return;
  try {
    const result = await runTask(input.spec, {
      resolveFile: fileResolver(input.baseDir),
      onProgress: (fraction, message) => port.postMessage({ type: 'progress', fraction, message } satisfies FromWorker),
    });
    port.postMessage({ type: 'result', json: canonicalJson(result) } satisfies FromWorker);
  } catch (error) {
    const err = error as Error;
    port.postMessage({
      type: 'error',
      name: err instanceof SpecError ? 'SpecError' : err instanceof LimitError ? 'LimitError' : err instanceof AbortError ? 'AbortError' : 'Error',
      message: err.message,
      issues: err instanceof SpecError ? err.issues : undefined,
    } satisfies FromWorker);
  }
}

/** Source run by the worker thread: registers the tsx loader there, then imports this file. */
function workerBootstrap(): string {
  const self = pathToFileURL(fileURLToPath(import.meta.url)).href;
  const require = createRequire(import.meta.url);
  const tsxDir = path.dirname(require.resolve('tsx/package.json'));
  const api = pathToFileURL(path.join(tsxDir, 'dist', 'esm', 'api', 'index.mjs')).href;
  return `import(${JSON.stringify(api)}).then((m) => { m.register(); return import(${JSON.stringify(self)}); })`;
}

function fail(code: number, lines: string[]): never {
  for (const line of lines) process.stderr.write(`${line}\n`);
  process.exit(code);
}

async function readInput(arg: string): Promise<string> {
  if (arg !== '-') return readFileSync(arg, 'utf8');
  const chunks: Buffer[] = [];
  for await (const chunk of process.stdin) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks).toString('utf8');
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const pretty = args.includes('--pretty');
  if (args.includes('--help') || args.includes('-h')) {
    process.stdout.write(`${USAGE}\n`);
    return;
  }
  const unknown = args.filter((a) => a.startsWith('--') && a !== '--pretty');
  if (unknown.length > 0) fail(2, [`unknown option ${unknown[0]}`, USAGE]);
  const inputs = args.filter((a) => a === '-' || !a.startsWith('-'));
  if (inputs.length !== 1) fail(2, ['give exactly one spec file (or - for stdin)', USAGE]);
  const source = inputs[0];

  let text: string;
  try {
    text = await readInput(source);
  } catch (error) {
    fail(2, [`cannot read ${source}: ${(error as Error).message}`]);
  }
  let json: unknown;
  try {
    json = JSON.parse(text);
  } catch (error) {
    fail(2, [`invalid JSON in ${source === '-' ? 'stdin' : source}: ${(error as Error).message}`]);
  }
  let spec: TaskSpec;
  try {
    spec = parseTaskSpec(json);
  } catch (error) {
    if (error instanceof SpecError) fail(2, ['invalid spec:', ...error.issues.map((i) => `  ${i.path || '(spec)'}: ${i.message}`)]);
    throw error;
  }

  const baseDir = source === '-' ? process.cwd() : path.dirname(path.resolve(source));
  const worker = new Worker(workerBootstrap(), {
    eval: true,
    workerData: { fluxfolioCompute: true, spec, baseDir } satisfies WorkerInput,
  });
  const controller = new AbortController();
  process.on('SIGINT', () => {
    controller.abort();
    void worker.terminate().finally(() => fail(130, ['cancelled']));
  });

  let lastPercent = -PROGRESS_STEP;
  await new Promise<void>((resolve) => {
    worker.on('message', (message: FromWorker) => {
      if (message.type === 'progress') {
        const percent = Math.floor(message.fraction * 100);
        if (percent >= lastPercent + PROGRESS_STEP || percent === 100) {
          lastPercent = percent;
          process.stderr.write(`progress ${percent}%${message.message ? ` ${message.message}` : ''}\n`);
        }
        return;
      }
      if (message.type === 'result') {
        const out = pretty ? JSON.stringify(JSON.parse(message.json), null, 2) : message.json;
        process.stdout.write(`${out}\n`, () => {
          void worker.terminate().finally(resolve);
        });
        return;
      }
      if (message.name === 'SpecError') {
        fail(2, ['invalid spec:', ...(message.issues ?? []).map((i) => `  ${i.path || '(spec)'}: ${i.message}`)]);
      }
      if (message.name === 'LimitError') fail(2, [`over the limit: ${message.message}`]);
      if (message.name === 'AbortError') fail(130, ['cancelled']);
      fail(1, [`solver failure: ${message.message}`]);
    });
    worker.on('error', (error) => fail(1, [`solver failure: ${error.message}`]));
    worker.on('exit', (code) => {
      if (controller.signal.aborted) return;
      if (code !== 0 && code !== 1) fail(1, [`solver stopped unexpectedly (worker exit ${code})`]);
    });
  });
}

if (!isMainThread && (workerData as WorkerInput | undefined)?.fluxfolioCompute) {
  void workerMain(workerData as WorkerInput);
} else if (isMainThread) {
  main().catch((error: Error) => fail(1, [`solver failure: ${error.message}`]));
}
