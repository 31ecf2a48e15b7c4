// The scan pool: fixed chunks give identical bytes inline, with 1 worker thread and with 2 (the worker runs through the
// tsx loader), the shared row between chunks closes every elementary loop, and cancellation terminates the workers.
import { describe, expect, it } from 'vitest';
import { AbortError } from '@/lib/physics/errors';
import { buildLattice, snapTube } from '@/lib/physics/lattice';
import { runChunks } from '@/lib/physics/parallel/pool';
import { type ChunkResult, type ScanJob, scanChunks } from '@/lib/physics/parallel/scan-chunk';
import { compileWell } from '@/lib/physics/wells';
import { resultHash } from '@/lib/physics/canonical';
import { parseTaskSpec } from '@/lib/physics/schemas';
import type { DegeneracySpec } from '@/lib/physics/schemas/degeneracy';
import type { PositionSweepSpec } from '@/lib/physics/schemas/position-sweep';
import { runDegeneracy } from '@/lib/physics/tasks/degeneracy';
import { runPositionSweep } from '@/lib/physics/tasks/position-sweep';

function job(): ScanJob {
  const h = 1 / 10;
  // A non-symmetric pentagon (invented test geometry) with a fixed half tube.
  const well = compileWell({ polygon: { points: [[0, 0], [1, 0.1], [1.1, 0.8], [0.5, 1.1], [-0.1, 0.7]] } });
  const lattice = buildLattice({ well, h });
  return {
    lattice,
    fixed: [snapTube(lattice, [0.7, 0.3], 0.5)],
    alpha: 0.5,
    a0: 0,
    b0: 0,
    na: 8,
    nb: 11,
    k: 2,
    m: 1,
    tol: 1e-8,
    seed: 1,
    warmStart: true,
    method: 'shift-invert',
  };
}

function bytes(results: ChunkResult[]): string {
  return results
    .map((r) => [r.energies, r.hRe, r.hIm, r.vRe, r.vIm].map((a) => Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('hex')).join(':'))
    .join('|');
}

describe('parallel scan pool', () => {
  it('splits rows into fixed chunks independent of the worker count', () => {
    expect(scanChunks(20).map((c) => [c.rowStart, c.rowEnd])).toEqual([
      [0, 8],
      [8, 16],
      [16, 20],
    ]);
  });

  it('gives identical bytes inline, with 1 worker and with 2 workers', async () => {
    const j = job();
    const chunks = scanChunks(j.nb);
    expect(chunks.length).toBeGreaterThan(1);
    const used: number[] = [];
    const onWorkers = (count: number) => used.push(count);
    const inline = await runChunks(j, chunks, { workers: 0, onWorkers });
    const one = await runChunks(j, chunks, { workers: 1, onWorkers });
    const two = await runChunks(j, chunks, { workers: 2, onWorkers });
    // Worker threads really ran (the TypeScript entry loads through tsx inside the worker).
    expect(used).toEqual([0, 1, 2]);
    expect(bytes(one)).toBe(bytes(inline));
    expect(bytes(two)).toBe(bytes(inline));
    // Every edge overlap is defined and of modulus at most 1 (states are normalised).
    expect(inline.reduce((total, r) => total + r.hRe.length, 0)).toBeGreaterThan(0);
    for (const r of inline) for (const v of r.hRe) expect(Math.abs(v)).toBeLessThanOrEqual(1 + 1e-9);
  });

  it('cancels through the signal and terminates the workers', async () => {
    const j = job();
    const controller = new AbortController();
    const pending = runChunks(j, scanChunks(j.nb), { workers: 2, signal: controller.signal, onPositions: () => controller.abort() });
    await expect(pending).rejects.toBeInstanceOf(AbortError);
  });

  it('degeneracy scans and energy landscapes hash identically for 1 and 2 workers', async () => {
    const well = { polygon: { points: [[0, 0], [1, 0.12], [1.05, 0.75], [0.45, 1.05], [-0.08, 0.62]] } };
    const deg = parseTaskSpec({ task: 'degeneracy', well, grid: { h: 1 / 12 }, moving: { alpha: 0.5 } }) as DegeneracySpec;
    const one = await runDegeneracy(deg, { workers: 1 });
    const two = await runDegeneracy(deg, { workers: 2 });
    expect(resultHash(two)).toBe(resultHash(one));
    expect([one.diagnostics.workers, two.diagnostics.workers]).toEqual([1, 2]);
    expect(one.count % 2).toBe(1);
    const land = parseTaskSpec({ task: 'position-sweep', well, grid: { h: 1 / 12 }, moving: { alpha: 0.3 }, region: { min: [0.2, 0.2], max: [0.8, 0.9] }, levels: 2 }) as PositionSweepSpec;
    expect(resultHash(await runPositionSweep(land, { workers: 2 }))).toBe(resultHash(await runPositionSweep(land, { workers: 0 })));
  });
});
