// One chunk of a tube-position scan: rows of plaquette centres solved in serpentine order with warm starts mapped
// through the gauge map, plus the gauge-mapped edge overlaps the degeneracy bookkeeping needs. Pure; runs in any thread.
import { lowestEigenpairs } from '../eigen';
import { AbortError } from '../errors';
import { applyGaugeMap, gaugeMapForStep, gaugedOverlapDeterminant } from '../gauge-map';
import { buildHamiltonian } from '../hamiltonian';
import { plaquetteCentre } from '../lattice';
import type { EigenOptions, Lattice, SnappedTube, StateBlock } from '../types';

/**
 * A scan of the moving tube over the plaquettes (a0 + p, b0 + q), 0 <= p < na, 0 <= q < nb, with the fixed tubes in place.
 * Structured-cloneable, so it can be posted to a worker thread as is.
 */
export interface ScanJob {
  lattice: Lattice;
  fixed: SnappedTube[];
  /** Flux of the moving tube (units of h/e). */
  alpha: number;
  a0: number;
  b0: number;
  na: number;
  nb: number;
  /** Eigenpairs per position. */
  k: number;
  /** Dimension of the subspace (levels 0 .. m-1) whose overlap determinant is recorded on each edge; 0 for none. */
  m: number;
  tol: number;
  seed: number;
  /** Start each solve from the neighbour's states mapped through the gauge map (default true). */
  warmStart: boolean;
  method?: EigenOptions['method'];
}

/** Rows [rowStart, rowEnd) of the scan. */
export interface ScanChunk {
  index: number;
  rowStart: number;
  rowEnd: number;
}

/** What a chunk sends back: scalars only. */
export interface ChunkResult {
  index: number;
  rowStart: number;
  rowEnd: number;
  /** energies[((q - rowStart) * na + p) * k + l]. */
  energies: Float64Array;
  /** Horizontal edge overlaps of rows rowStart..rowEnd-1: index p + (na - 1) (q - rowStart). */
  hRe: Float64Array;
  hIm: Float64Array;
  /** Vertical edge overlaps from row q to q + 1 for q in [rowStart, rowEnd): index p + na (q - rowStart). */
  vRe: Float64Array;
  vIm: Float64Array;
  iterations: number;
  solves: number;
  maxResidual: number;
  unconverged: number;
}

/** Rows per chunk: fixed so that results do not depend on the number of workers (bit-for-bit). */
export const SCAN_CHUNK_ROWS = 8;

/**
 * Splits nb rows into fixed chunks of SCAN_CHUNK_ROWS rows (the last may be shorter).
 * @example
 * scanChunks(20).map((c) => [c.rowStart, c.rowEnd]); // [[0, 8], [8, 16], [16, 20]]
 */
export function scanChunks(nb: number, rows = SCAN_CHUNK_ROWS): ScanChunk[] {
  const out: ScanChunk[] = [];
  for (let r = 0, index = 0; r < nb; r += rows, index++) out.push({ index, rowStart: r, rowEnd: Math.min(nb, r + rows) });
  return out;
}

/** The tubes for the moving tube at global plaquette (a, b): the fixed ones first, the moving one last. */
export function tubesWithMoving(job: Pick<ScanJob, 'lattice' | 'fixed' | 'alpha'>, a: number, b: number): SnappedTube[] {
  const at = plaquetteCentre(job.lattice, a, b);
  return [...job.fixed, { at, alpha: job.alpha, plaquette: [a, b], requested: at }];
}

/**
 * Solves one chunk. The first row of a chunk runs left to right from a cold (seeded) start; later rows alternate
 * direction and start from the state below, mapped through G. When overlaps are wanted and another row follows the
 * chunk, that row is solved too, exactly as the next chunk solves its first row (cold, left to right), so the states on
 * the shared row are identical bit for bit and every elementary loop is closed with one state per position.
 *
 * @param job - the scan
 * @param chunk - rows to own
 * @param hooks - cancellation and per-position progress (positions done in this chunk)
 * @returns energies and edge overlaps of the chunk
 * @throws AbortError when the signal fires
 */
export function runScanChunk(
  job: ScanJob,
  chunk: ScanChunk,
  hooks: { signal?: AbortSignal; onPosition?: (done: number) => void } = {},
): ChunkResult {
  const { na, nb, k, m, a0, b0 } = job;
  const rows = chunk.rowEnd - chunk.rowStart;
  const energies = new Float64Array(rows * na * k);
  const withOverlaps = m > 0;
  const hRe = new Float64Array(withOverlaps ? rows * Math.max(0, na - 1) : 0);
  const hIm = new Float64Array(hRe.length);
  const vRe = new Float64Array(withOverlaps ? rows * na : 0);
  const vIm = new Float64Array(vRe.length);
  const lastRow = withOverlaps && chunk.rowEnd < nb ? chunk.rowEnd : chunk.rowEnd - 1;
  const identity = { sites: new Int32Array(0), factor: { re: 1, im: 0 } };
  let iterations = 0;
  let solves = 0;
  let maxResidual = 0;
  let unconverged = 0;
  let done = 0;
  let prevRow: (StateBlock | null)[] | null = null;
  let lastState: StateBlock | null = null;
  let lastPos: [number, number] | null = null;

  for (let q = chunk.rowStart; q <= lastRow; q++) {
    const extra = q === chunk.rowEnd;
    const fresh = q === chunk.rowStart || extra;
    const leftToRight = fresh || (q - chunk.rowStart) % 2 === 0;
    const row: (StateBlock | null)[] = new Array<StateBlock | null>(na).fill(null);
    for (let t = 0; t < na; t++) {
      if (hooks.signal?.aborted) throw new AbortError();
      const p = leftToRight ? t : na - 1 - t;
      const a = a0 + p;
      const b = b0 + q;
      let initial: StateBlock | null = null;
      if (job.warmStart && lastState && lastPos && !(fresh && t === 0)) {
        const map = gaugeMapForStep(job.lattice, { from: lastPos, to: [a, b] }, job.alpha);
        initial = applyGaugeMap(map, lastState);
      }
      const matrix = buildHamiltonian(job.lattice, tubesWithMoving(job, a, b));
      const res = lowestEigenpairs(matrix, k, { tol: job.tol, seed: job.seed, initial, method: job.method, signal: hooks.signal });
      iterations += res.iterations;
      solves++;
      if (!res.converged) unconverged++;
      for (let l = 0; l < k; l++) {
        maxResidual = Math.max(maxResidual, res.residualNorms[l] / Math.max(1, Math.abs(res.values[l])));
        if (!extra) energies[((q - chunk.rowStart) * na + p) * k + l] = res.values[l];
      }
      lastState = res.vectors;
      lastPos = [a, b];
      if (withOverlaps) row[p] = res.vectors;
      if (!extra) hooks.onPosition?.(++done);
    }
    if (withOverlaps) {
      if (!extra) {
        for (let p = 0; p + 1 < na; p++) {
          const z = gaugedOverlapDeterminant(identity, row[p]!, row[p + 1]!, m);
          hRe[p + (na - 1) * (q - chunk.rowStart)] = z.re;
          hIm[p + (na - 1) * (q - chunk.rowStart)] = z.im;
        }
      }
      if (prevRow) {
        for (let p = 0; p < na; p++) {
          const map = gaugeMapForStep(job.lattice, { from: [a0 + p, b0 + q - 1], to: [a0 + p, b0 + q] }, job.alpha);
          const z = gaugedOverlapDeterminant(map, prevRow[p]!, row[p]!, m);
          vRe[p + na * (q - 1 - chunk.rowStart)] = z.re;
          vIm[p + na * (q - 1 - chunk.rowStart)] = z.im;
        }
      }
      prevRow = row;
    }
  }
  return { index: chunk.index, rowStart: chunk.rowStart, rowEnd: chunk.rowEnd, energies, hRe, hIm, vRe, vIm, iterations, solves, maxResidual, unconverged };
}
