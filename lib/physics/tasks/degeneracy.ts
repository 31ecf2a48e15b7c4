// Task 'degeneracy': scan a moving half tube over plaquette centres, find the positions where a pair of levels is forced
// to be degenerate by the loop signs of elementary loops, refine them with a gap^2 fit, and check the parity (PHYSICS.md section 4).
import { lowestEigenpairs } from '../eigen';
import { AbortError, SpecError } from '../errors';
import { buildHamiltonian, isRealFlux } from '../hamiltonian';
import { plaquetteCentre } from '../lattice';
import { boundaryOfSites } from '../loop-path';
import {
  edgeOverlap,
  fitGapSquaredVertex,
  type GapSample,
  loopProductOf,
  type LoopBlock,
  parityReport,
  resolveLoops,
  type ScanOverlaps,
} from '../degeneracy-refine';
import { runChunks } from '../parallel/pool';
import { type ChunkResult, type ScanJob, scanChunks, tubesWithMoving } from '../parallel/scan-chunk';
import { DEGENERACY_NEEDS_REAL, type DegeneracySpec } from '../schemas/degeneracy';
import type { Lattice, Vec2 } from '../types';
import {
  elapsedMs,
  gridReport,
  prepareTask,
  taskMethod,
  progressReporter,
  runtimeFacts,
  type TaskRunContext,
  tubeReport,
} from './task-support';

/** Default residual tolerance of the scan (relative): loose but safe for signs and gaps (common practice). */
export const SCAN_DEFAULT_TOL = 1e-7;
/** Residual tolerance of the recomputation around candidate points. */
export const REFINE_TOL = 1e-10;
/** A gap below this times max(1, |E|) at a scanned position counts as landing exactly on a degeneracy. */
export const LANDING_REL_FLOOR = 1e-6;
/** |overlap| below this makes an edge undefined (opposite mirror parities give exactly 0; common practice). */
export const OVERLAP_FLOOR = 1e-3;

/** One degeneracy point. */
export interface DegeneracyPoint {
  /** Refined position (units of L): the gap^2 vertex, or the scanned position itself on an exact landing. */
  at: Vec2;
  /** Smallest gap E_upper - E_lower measured near the point (tight tolerance). */
  gap: number;
  /** The scanned plaquette centre with the smallest gap next to the point. */
  scanned: Vec2;
  /**
   * How the point was located: 'landing' (the scan hit it), 'edge' (on an edge with undefined overlap, by linear
   * interpolation of the gap), 'fit' (gap^2 vertex) or 'scan' (best scanned position, when the fit is unusable).
   */
  method: 'landing' | 'edge' | 'fit' | 'scan';
  /** Number of elementary loops merged into the loop that found it (1 = one elementary loop). */
  loopSites: number;
}

/** Result of the degeneracy task. */
export interface DegeneracyResult {
  task: 'degeneracy';
  pair: [number, number];
  alpha: number;
  points: DegeneracyPoint[];
  count: number;
  parity: 'odd' | 'even';
  /** Product of all elementary (and merged) loop signs over the scanned region. */
  loopProduct: 1 | -1;
  /** Sign of the loop around the whole scanned region evaluated directly (null when it cannot be closed). */
  regionSign: 1 | -1 | null;
  parityConsistent: boolean;
  region: { min: Vec2; max: Vec2 };
  /** Gap E_upper - E_lower at every scanned plaquette centre, x fastest. */
  gapMap: { xs: number[]; ys: number[]; gap: number[] };
  /** Sign of each elementary loop (site centres xs, ys; x fastest); 0 where the site belongs to a merged block. */
  loopSigns: { xs: number[]; ys: number[]; sign: number[] };
  /** Merged blocks: their site centres, sign and why they were merged. */
  blocks: { sites: Vec2[]; sign: number; reasons: string[]; residual: number | null }[];
  tubes: ReturnType<typeof tubeReport>;
  grid: ReturnType<typeof gridReport>;
  diagnostics: {
    unknowns: number;
    positions: number;
    solves: number;
    iterations: number;
    maxResidual: number;
    unconverged: number;
    /** Largest |Im W| / |W| of a loop (rounding only for a real problem). */
    maxLoopResidual: number;
    unresolvedBlocks: number;
    scanTol: number;
    /** Worker threads used (0 = inline). */
    workers: number;
    warmStart: boolean;
    wallMs: number;
    node: string;
    platform: string;
  };
}

/**
 * Plaquette index range for [lo, hi] (centres at (a + 1 + f) h): the centres inside it (inclusive), or, outward, the
 * smallest range whose centres reach lo and hi.
 */
function plaquetteRange(lo: number, hi: number, h: number, f: number, outward: boolean): [number, number] {
  const slack = 1e-9;
  if (outward) return [Math.floor(lo / h - 1 - f + slack), Math.ceil(hi / h - 1 - f - slack)];
  return [Math.ceil(lo / h - 1 - f - slack), Math.floor(hi / h - 1 - f + slack)];
}

/**
 * Scans a moving tube (integer or half-integer flux) over every plaquette centre of `region` (default: the well's
 * bounding box, rounded outward to the next centres) and finds the positions where levels pair[0] and pair[1] are degenerate.
 *
 * Each elementary loop (four plaquette centres around one site) is evaluated with the determinant of the overlaps of
 * levels 0..pair[0] (for pair [0, 1] the ground state's overlap), so its sign counts exactly the pair's degeneracies
 * inside. Exact landings (gap below 1e-6 relative) and undefined overlaps (|overlap| < 1e-3) merge the loops around them
 * into one block loop. Points are refined by a gap^2 quadratic fit at tight tolerance; the count's parity is checked
 * against the loop product and the loop around the region, and a disagreement is flagged.
 *
 * @param spec - validated degeneracy spec
 * @param ctx - progress, cancellation, file resolver; `workers` and `warmStart` tune the scan (bench)
 * @returns points, count, parity, gap map, loop signs and diagnostics
 * @throws SpecError when any flux is not an integer or half-integer; AbortError when cancelled
 * @see H. C. Longuet-Higgins, Proc. R. Soc. Lond. A 344, 147 (1975); Herzberg & Longuet-Higgins, Discuss. Faraday Soc. 35, 77 (1963)
 * @example
 * const r = await runDegeneracy(spec, { workers: 2 });
 * r.points[0].at; // [0, 0] for a half tube in a disk centred at the origin
 */
export async function runDegeneracy(spec: DegeneracySpec, ctx: TaskRunContext = {}): Promise<DegeneracyResult> {
  const start = performance.now();
  const alpha = spec.moving.alpha;
  if (!isRealFlux([alpha])) throw new SpecError(DEGENERACY_NEEDS_REAL, 'moving.alpha');
  spec.tubes.forEach((t, i) => {
    if (!isRealFlux([t.alpha])) throw new SpecError(DEGENERACY_NEEDS_REAL, `tubes[${i}].alpha`);
  });
  const pair: [number, number] = spec.pair ? [spec.pair[0], spec.pair[1]] : [0, 1];
  const cover = spec.region ? [{ min: spec.region.min as Vec2, max: spec.region.max as Vec2 }] : [];
  let problem = prepareTask(spec, ctx, cover);
  const region = spec.region ? { min: spec.region.min as Vec2, max: spec.region.max as Vec2 } : { min: problem.well.bbox.min, max: problem.well.bbox.max };
  const h = spec.grid.h;
  const offset = (spec.grid.offset ?? [0, 0]) as Vec2;
  // A given region scans the plaquette centres inside it; the default (the well's bounding box) is rounded outward so
  // that the loop around the scan encloses the whole well (its sign is then -1 and the count odd).
  const outward = !spec.region;
  const [a0, a1] = plaquetteRange(region.min[0], region.max[0], h, offset[0], outward);
  const [b0, b1] = plaquetteRange(region.min[1], region.max[1], h, offset[1], outward);
  const na = a1 - a0 + 1;
  const nb = b1 - b0 + 1;
  if (na < 2 || nb < 2) throw new SpecError('the region must span at least two plaquette centres on each axis at this grid', 'region');
  const lo = plaquetteCentre({ h, offset }, a0, b0);
  const hi = plaquetteCentre({ h, offset }, a1, b1);
  // Grow the box to every scanned position (outward rounding may pass the bounding box by up to h).
  problem = prepareTask(spec, ctx, [...cover, { min: lo, max: hi }], na * nb);
  const { lattice } = problem;
  const fixed = problem.tubes;
  const k = pair[1] + 1;
  if (k > lattice.n) throw new SpecError(`pair ${JSON.stringify(pair)} asks for more levels than the ${lattice.n} unknowns of this grid`, 'pair');
  const scanTol = spec.tol ?? SCAN_DEFAULT_TOL;
  const warmStart = ctx.warmStart ?? true;
  const job: ScanJob = { lattice, fixed, alpha, a0, b0, na, nb, k, m: pair[0] + 1, tol: scanTol, seed: 1, warmStart, method: taskMethod(ctx, lattice.n) };
  const chunks = scanChunks(nb);
  const total = na * nb;
  const report = progressReporter(ctx, 'scanning tube positions');
  report(0);
  let threads = 0;
  const results = await runChunks(job, chunks, {
    workers: ctx.workers,
    signal: ctx.signal,
    onPositions: (done) => report((0.9 * done) / total),
    onWorkers: (count) => {
      threads = count;
    },
  });
  const scan = assemble(job, results);

  const landingRel = Math.max(LANDING_REL_FLOOR, 10 * scanTol);
  const relGap = new Float64Array(total);
  for (let i = 0; i < total; i++) relGap[i] = scan.gap[i] / Math.max(1, Math.abs(scan.energies[i * k + pair[0]]));
  const overlaps: ScanOverlaps = { na, nb, gap: relGap, hRe: scan.hRe, hIm: scan.hIm, vRe: scan.vRe, vIm: scan.vIm };
  const blocks = resolveLoops(overlaps, { overlapFloor: OVERLAP_FLOOR, landingGap: landingRel });

  // The loop around the whole region, directly (null when a landing or an undefined edge sits on it).
  let regionSign: 1 | -1 | null = null;
  const allSites: [number, number][] = [];
  for (let t = 1; t < nb; t++) for (let s = 1; s < na; s++) allSites.push([s, t]);
  const border = boundaryOfSites(allSites);
  const borderOk = border.every(([p, q]) => relGap[p + na * q] >= landingRel);
  if (borderOk) {
    const w = loopProductOf(overlaps, border);
    const edgesOk = border.every((pq, i) => {
      const next = border[(i + 1) % border.length];
      const z = edgeOverlap(overlaps, pq, next);
      return Math.hypot(z.re, z.im) >= OVERLAP_FLOOR;
    });
    if (edgesOk && Math.hypot(w.re, w.im) > 0) regionSign = w.re < 0 ? -1 : 1;
  }

  const grid = { h, offset };
  const centre = (p: number, q: number) => plaquetteCentre(grid, a0 + p, b0 + q);
  const points: DegeneracyPoint[] = [];
  const minusBlocks = blocks.filter((b) => b.sign === -1);
  let refineDone = 0;
  for (const block of minusBlocks) {
    if (ctx.signal?.aborted) break;
    points.push(locatePoint(block, { job, lattice, scan, na, nb, centre, pair, relGap, landingRel, signal: ctx.signal }));
    refineDone++;
    report(0.9 + (0.1 * refineDone) / Math.max(1, minusBlocks.length));
  }
  if (ctx.signal?.aborted) throw new AbortError();
  const parity = parityReport(blocks, points.length, regionSign);
  report(1);

  const xs = Array.from({ length: na }, (_, p) => centre(p, 0)[0]);
  const ys = Array.from({ length: nb }, (_, q) => centre(0, q)[1]);
  const siteXs = xs.slice(1).map((x) => x - h / 2);
  const siteYs = ys.slice(1).map((y) => y - h / 2);
  const sign = new Array<number>((na - 1) * (nb - 1)).fill(0);
  let maxLoopResidual = 0;
  for (const b of blocks) {
    if (b.residual !== null) maxLoopResidual = Math.max(maxLoopResidual, b.residual);
    if (b.sites.length === 1) sign[b.sites[0][0] - 1 + (na - 1) * (b.sites[0][1] - 1)] = b.sign;
  }
  let solves = 0;
  let iterations = 0;
  let maxResidual = 0;
  let unconverged = 0;
  for (const r of results) {
    solves += r.solves;
    iterations += r.iterations;
    maxResidual = Math.max(maxResidual, r.maxResidual);
    unconverged += r.unconverged;
  }
  return {
    task: 'degeneracy',
    pair,
    alpha,
    points,
    count: parity.count,
    parity: parity.parity,
    loopProduct: parity.loopProduct,
    regionSign,
    parityConsistent: parity.parityConsistent,
    region: { min: lo, max: hi },
    gapMap: { xs, ys, gap: Array.from(scan.gap) },
    loopSigns: { xs: siteXs, ys: siteYs, sign },
    blocks: blocks
      .filter((b) => b.sites.length > 1 || b.sign === 0)
      .map((b) => ({
        sites: b.sites.map(([s, t]) => [siteXs[s - 1], siteYs[t - 1]] as Vec2),
        sign: b.sign,
        reasons: b.reasons,
        residual: b.residual,
      })),
    tubes: tubeReport(fixed),
    grid: gridReport(lattice),
    diagnostics: {
      unknowns: lattice.n,
      positions: total,
      solves,
      iterations,
      maxResidual,
      unconverged,
      maxLoopResidual,
      unresolvedBlocks: parity.unresolved,
      scanTol,
      workers: threads,
      warmStart,
      wallMs: elapsedMs(start),
      ...runtimeFacts(),
    },
  };
}

/** The whole scan's arrays, from its chunks. */
interface AssembledScan {
  energies: Float64Array;
  gap: Float64Array;
  hRe: Float64Array;
  hIm: Float64Array;
  vRe: Float64Array;
  vIm: Float64Array;
}

function assemble(job: ScanJob, results: ChunkResult[]): AssembledScan {
  const { na, nb, k } = job;
  const energies = new Float64Array(na * nb * k);
  const hRe = new Float64Array((na - 1) * nb);
  const hIm = new Float64Array((na - 1) * nb);
  const vRe = new Float64Array(na * nb);
  const vIm = new Float64Array(na * nb);
  for (const r of results) {
    energies.set(r.energies, r.rowStart * na * k);
    hRe.set(r.hRe, r.rowStart * (na - 1));
    hIm.set(r.hIm, r.rowStart * (na - 1));
    vRe.set(r.vRe, r.rowStart * na);
    vIm.set(r.vIm, r.rowStart * na);
  }
  const gap = new Float64Array(na * nb);
  const upper = k - 1;
  for (let i = 0; i < na * nb; i++) gap[i] = energies[i * k + upper] - energies[i * k + upper - 1];
  return { energies, gap, hRe, hIm, vRe, vIm };
}

/** Locates the point of a -1 block: the landing itself, or the gap^2 vertex from a tight recomputation nearby. */
function locatePoint(
  block: LoopBlock,
  env: {
    job: ScanJob;
    lattice: Lattice;
    scan: AssembledScan;
    na: number;
    nb: number;
    centre: (p: number, q: number) => Vec2;
    pair: [number, number];
    relGap: Float64Array;
    landingRel: number;
    signal?: AbortSignal;
  },
): DegeneracyPoint {
  const { na, nb, centre, scan } = env;
  if (block.landings.length > 0) {
    let best = block.landings[0];
    for (const pos of block.landings) if (scan.gap[pos] < scan.gap[best]) best = pos;
    const p = best % na;
    const q = (best - p) / na;
    const at = centre(p, q);
    return { at, gap: scan.gap[best], scanned: at, method: 'landing', loopSites: block.sites.length };
  }
  if (block.sites.length === 2 && block.reasons.length === 1 && block.reasons[0] === 'overlap') {
    // Two sites merged across one undefined edge (e.g. opposite parities on a mirror line): the levels cross on that
    // edge; the gap is |linear| along it, so the zero sits at gA / (gA + gB) of the way from A to B.
    const [[s1, t1], [s2, t2]] = block.sites;
    const edge: [[number, number], [number, number]] =
      s1 === s2 ? [[s1 - 1, Math.max(t1, t2) - 1], [s1, Math.max(t1, t2) - 1]] : [[Math.max(s1, s2) - 1, t1 - 1], [Math.max(s1, s2) - 1, t1]];
    const [[pA, qA], [pB, qB]] = edge;
    const gA = tightGap(env.job, pA, qA, env.pair, env.signal);
    const gB = tightGap(env.job, pB, qB, env.pair, env.signal);
    const A = centre(pA, qA);
    const B = centre(pB, qB);
    const t = gA + gB > 0 ? gA / (gA + gB) : 0.5;
    return {
      at: [A[0] + t * (B[0] - A[0]), A[1] + t * (B[1] - A[1])],
      gap: Math.min(gA, gB),
      scanned: gA <= gB ? A : B,
      method: 'edge',
      loopSites: 2,
    };
  }
  // Corners of the block's sites, and one ring around them, inside the scan.
  let pMin = Infinity;
  let pMax = -Infinity;
  let qMin = Infinity;
  let qMax = -Infinity;
  for (const [s, t] of block.sites) {
    pMin = Math.min(pMin, s - 1);
    pMax = Math.max(pMax, s);
    qMin = Math.min(qMin, t - 1);
    qMax = Math.max(qMax, t);
  }
  const samples: GapSample[] = [];
  let bestCorner: { at: Vec2; gap: number } | null = null;
  for (let q = Math.max(0, qMin - 1); q <= Math.min(nb - 1, qMax + 1); q++) {
    for (let p = Math.max(0, pMin - 1); p <= Math.min(na - 1, pMax + 1); p++) {
      const gap = tightGap(env.job, p, q, env.pair, env.signal);
      const at = centre(p, q);
      samples.push({ at, gap });
      const corner = p >= pMin && p <= pMax && q >= qMin && q <= qMax;
      if (corner && (bestCorner === null || gap < bestCorner.gap)) bestCorner = { at, gap };
    }
  }
  let minGap = Infinity;
  for (const s of samples) minGap = Math.min(minGap, s.gap);
  const fit = fitGapSquaredVertex(samples, { min: centre(pMin, qMin), max: centre(pMax, qMax) });
  const scanned = bestCorner!.at;
  return {
    at: fit.ok ? fit.at : scanned,
    gap: minGap,
    scanned,
    method: fit.ok ? 'fit' : 'scan',
    loopSites: block.sites.length,
  };
}

/** Gap of the pair at scan position (p, q), recomputed cold at REFINE_TOL. */
function tightGap(job: ScanJob, p: number, q: number, pair: [number, number], signal?: AbortSignal): number {
  const matrix = buildHamiltonian(job.lattice, tubesWithMoving(job, job.a0 + p, job.b0 + q));
  const res = lowestEigenpairs(matrix, job.k, { tol: Math.min(REFINE_TOL, job.tol), seed: 1, signal, method: job.method });
  return res.values[pair[1]] - res.values[pair[0]];
}
