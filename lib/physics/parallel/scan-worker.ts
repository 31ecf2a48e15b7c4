// Worker-thread entry of the scan pool: receives {job, chunk} messages, solves the chunk, posts progress and results.
// Started by lib/physics/parallel/pool.ts with the tsx loader; holds no state between chunks except the job.
import { parentPort } from 'node:worker_threads';
import { runScanChunk, type ScanChunk, type ScanJob } from './scan-chunk';

/** Messages from the pool. */
export type ToWorker = { type: 'job'; job: ScanJob } | { type: 'chunk'; chunk: ScanChunk };

if (parentPort) {
  const port = parentPort;
  let job: ScanJob | null = null;
  port.on('message', (message: ToWorker) => {
    if (message.type === 'job') {
      job = message.job;
      return;
    }
    try {
      if (!job) throw new Error('scan worker received a chunk before its job');
      const { chunk } = message;
      const result = runScanChunk(job, chunk, {
        onPosition: (done) => port.postMessage({ type: 'progress', index: chunk.index, done }),
      });
      const transfer = [result.energies.buffer, result.hRe.buffer, result.hIm.buffer, result.vRe.buffer, result.vIm.buffer] as ArrayBuffer[];
      port.postMessage({ type: 'result', result }, transfer);
    } catch (error) {
      const err = error as Error;
      port.postMessage({ type: 'error', message: err.message, name: err.name, stack: err.stack });
    }
  });
}
