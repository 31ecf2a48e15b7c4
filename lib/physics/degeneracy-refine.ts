// Degeneracy bookkeeping of a scan (PHYSICS.md section 4): loop signs over elementary loops, merging of sites around
// exact landings and undefined overlaps into blocks, the parity check, and the gap^2 quadratic fit that refines a point.
import { Matrix, solve } from 'ml-matrix';
import { type Complex, complexConj, complexMul } from './gauge-map';
import { boundaryOfSites, holeSites, siteSetProblem } from './loop-path';
import type { Vec2 } from './types';

/**
 * Scalars a scan leaves behind: gaps at every position and gauge-mapped overlaps on every edge between neighbouring
 * positions. Position (p, q) (p fastest) is plaquette (a0 + p, b0 + q).
 */
export interface ScanOverlaps {
  na: number;
  nb: number;
  /** gap[p + na q] = E_upper - E_lower at position (p, q). */
  gap: Float64Array;
  /** Overlap from (p, q) to (p + 1, q), index p + (na - 1) q. */
  hRe: Float64Array;
  hIm: Float64Array;
  /** Overlap from (p, q) to (p, q + 1) (through G_up), index p + na q. */
  vRe: Float64Array;
  vIm: Float64Array;
}

/** A set of elementary sites whose common loop is evaluated as one. Site (s, t) lies between positions s-1..s, t-1..t. */
export interface LoopBlock {
  /** Local site indices (s, t), 1 <= s < na, 1 <= t < nb. */
  sites: [number, number][];
  /** Loop value W around the block (counter-clockwise), null when the block touches the scan border (unresolved). */
  w: Complex | null;
  sign: 1 | -1 | 0;
  /** |Im W| / |W|, null when unresolved. */
  residual: number | null;
  /** Positions inside the block where the gap fell below the landing threshold (local p + na q). */
  landings: number[];
  /** Why the block was merged: 'landing', 'overlap', 'hole' (none for an elementary loop). */
  reasons: string[];
}

/** Thresholds of the bookkeeping. */
export interface LoopResolveOptions {
  /** |overlap| below this makes an edge undefined (e.g. opposite mirror parities). Default 1e-3 (common practice). */
  overlapFloor?: number;
  /** A gap below this at a scanned position is an exact landing on a degeneracy. */
  landingGap: number;
}

class UnionFind {
  readonly parent: Int32Array;
  constructor(n: number) {
    this.parent = Int32Array.from({ length: n }, (_, i) => i);
  }
  find(x: number): number {
    let r = x;
    while (this.parent[r] !== r) r = this.parent[r];
    while (this.parent[x] !== r) {
      const nx = this.parent[x];
      this.parent[x] = r;
      x = nx;
    }
    return r;
  }
  union(x: number, y: number): boolean {
    const rx = this.find(x);
    const ry = this.find(y);
    if (rx === ry) return false;
    if (rx < ry) this.parent[ry] = rx;
    else this.parent[rx] = ry;
    return true;
  }
}

/** The directed overlap of one unit step between local positions. */
export function edgeOverlap(data: ScanOverlaps, from: [number, number], to: [number, number]): Complex {
  const [p, q] = from;
  const [p2, q2] = to;
  if (q === q2) {
    const idx = Math.min(p, p2) + (data.na - 1) * q;
    const z = { re: data.hRe[idx], im: data.hIm[idx] };
    return p2 > p ? z : complexConj(z);
  }
  const idx = p + data.na * Math.min(q, q2);
  const z = { re: data.vRe[idx], im: data.vIm[idx] };
  return q2 > q ? z : complexConj(z);
}

/** W around a closed walk of local positions (each consecutive pair a unit step). */
export function loopProductOf(data: ScanOverlaps, walk: readonly [number, number][]): Complex {
  let w: Complex = { re: 1, im: 0 };
  for (let k = 0; k < walk.length; k++) {
    w = complexMul(w, edgeOverlap(data, walk[k], walk[(k + 1) % walk.length]));
  }
  return w;
}

/**
 * Splits the scanned region into elementary loops and merged blocks and evaluates each loop.
 * Sites around a landing position (gap below `landingGap`) are merged into the 2 x 2 block around it; the two sites on
 * either side of an undefined edge (|overlap| below `overlapFloor`) are merged; holes are filled. A block touching the
 * scan border cannot be closed and is reported unresolved (sign 0).
 *
 * @param data - gaps and edge overlaps of the scan
 * @param options - thresholds
 * @returns the blocks (elementary loops are blocks of one site), in order of their first site (t, then s)
 */
export function resolveLoops(data: ScanOverlaps, options: LoopResolveOptions): LoopBlock[] {
  const { na, nb } = data;
  const floor = options.overlapFloor ?? 1e-3;
  const ns = na - 1;
  const nt = nb - 1;
  if (ns < 1 || nt < 1) return [];
  const siteIndex = (s: number, t: number) => s - 1 + ns * (t - 1);
  const inRange = (s: number, t: number) => s >= 1 && s <= ns && t >= 1 && t <= nt;
  const uf = new UnionFind(ns * nt);
  const open = new Uint8Array(ns * nt);
  const reason = new Map<number, Set<string>>();
  const mark = (sites: [number, number][], why: string) => {
    const present = sites.filter(([s, t]) => inRange(s, t)).map(([s, t]) => siteIndex(s, t));
    if (present.length === 0) return;
    for (const x of present.slice(1)) uf.union(present[0], x);
    if (present.length < sites.length) open[present[0]] = 1;
    for (const x of present) {
      const set = reason.get(x) ?? new Set<string>();
      set.add(why);
      reason.set(x, set);
    }
  };
  const landings: number[] = [];
  for (let q = 0; q < nb; q++) {
    for (let p = 0; p < na; p++) {
      if (data.gap[p + na * q] < options.landingGap) {
        landings.push(p + na * q);
        mark(
          [
            [p, q],
            [p + 1, q],
            [p, q + 1],
            [p + 1, q + 1],
          ],
          'landing',
        );
      }
    }
  }
  for (let q = 0; q < nb; q++) {
    for (let p = 0; p + 1 < na; p++) {
      const idx = p + (na - 1) * q;
      if (Math.hypot(data.hRe[idx], data.hIm[idx]) < floor) {
        mark(
          [
            [p + 1, q],
            [p + 1, q + 1],
          ],
          'overlap',
        );
      }
    }
  }
  for (let q = 0; q + 1 < nb; q++) {
    for (let p = 0; p < na; p++) {
      const idx = p + na * q;
      if (Math.hypot(data.vRe[idx], data.vIm[idx]) < floor) {
        mark(
          [
            [p, q + 1],
            [p + 1, q + 1],
          ],
          'overlap',
        );
      }
    }
  }
  // Fill holes until every merged block is simply connected.
  for (let pass = 0; pass < 64; pass++) {
    const groups = groupSites(uf, ns, nt);
    let changed = false;
    for (const sites of groups.values()) {
      if (sites.length < 3 || siteSetProblem(sites) === null) continue;
      const hole = holeSites(sites);
      for (const [s, t] of hole) {
        if (uf.union(siteIndex(sites[0][0], sites[0][1]), siteIndex(s, t))) changed = true;
        const set = reason.get(siteIndex(s, t)) ?? new Set<string>();
        set.add('hole');
        reason.set(siteIndex(s, t), set);
      }
    }
    if (!changed) break;
  }
  const groups = groupSites(uf, ns, nt);
  const blocks: LoopBlock[] = [];
  const landingBy = new Map<number, number[]>();
  for (const pos of landings) {
    const p = pos % na;
    const q = (pos - p) / na;
    const s = Math.min(Math.max(p, 1), ns);
    const t = Math.min(Math.max(q, 1), nt);
    const root = uf.find(siteIndex(s, t));
    const list = landingBy.get(root) ?? [];
    list.push(pos);
    landingBy.set(root, list);
  }
  for (const [root, sites] of groups) {
    const isOpen = sites.some(([s, t]) => open[siteIndex(s, t)] === 1);
    const why = new Set<string>();
    for (const [s, t] of sites) for (const r of reason.get(siteIndex(s, t)) ?? []) why.add(r);
    let w: Complex | null = null;
    let sign: 1 | -1 | 0 = 0;
    let residual: number | null = null;
    if (!isOpen) {
      w = loopProductOf(data, boundaryOfSites(sites));
      const mod = Math.hypot(w.re, w.im);
      sign = w.re < 0 ? -1 : 1;
      residual = mod > 0 ? Math.abs(w.im) / mod : 1;
      if (mod === 0) sign = 0;
    }
    blocks.push({ sites, w, sign, residual, landings: landingBy.get(root) ?? [], reasons: [...why].sort() });
  }
  return blocks;
}

/** Groups of sites by union-find root, each sorted (t, then s), groups in order of their first site. */
function groupSites(uf: UnionFind, ns: number, nt: number): Map<number, [number, number][]> {
  const groups = new Map<number, [number, number][]>();
  for (let t = 1; t <= nt; t++) {
    for (let s = 1; s <= ns; s++) {
      const root = uf.find(s - 1 + ns * (t - 1));
      const list = groups.get(root);
      if (list) list.push([s, t]);
      else groups.set(root, [[s, t]]);
    }
  }
  return groups;
}


/** A sampled gap at a tube position. */
export interface GapSample {
  at: Vec2;
  gap: number;
}

/** Vertex of the fitted gap^2 quadratic. */
export interface GapFit {
  /** Fitted position of the degeneracy (units of L). */
  at: Vec2;
  /** Fitted gap^2 at the vertex (may be slightly negative from noise; clamp before taking a root). */
  gap2: number;
  /** False when the quadratic is not convex or its vertex leaves `bounds` (then `at` is the best sample). */
  ok: boolean;
}

/**
 * Fits gap^2 = c0 + c1 x + c2 y + c3 x^2 + c4 x y + c5 y^2 by (by default relatively weighted) least squares and
 * returns its vertex. Near a conical
 * degeneracy gap^2, not the gap, is smooth in the tube position (Herzberg & Longuet-Higgins 1963; PHYSICS.md section 4).
 *
 * @param samples - at least 6 positions with their gaps
 * @param bounds - box the vertex must fall in (else the best sample is returned with ok = false)
 * @returns the vertex, its fitted gap^2, and whether the fit was usable
 * @example
 * fitGapSquaredVertex(samples, { min: [-0.1, -0.1], max: [0.1, 0.1] }).at; // near the true crossing
 */
export function fitGapSquaredVertex(
  samples: readonly GapSample[],
  bounds: { min: Vec2; max: Vec2 },
  options: { weighting?: 'uniform' | 'near' } = {},
): GapFit {
  let best = samples[0];
  for (const s of samples) if (s.gap < best.gap) best = s;
  const fallback: GapFit = { at: [best.at[0], best.at[1]], gap2: best.gap * best.gap, ok: false };
  if (samples.length < 6) return fallback;
  // Centre and scale for conditioning.
  const cx = samples.reduce((acc, s) => acc + s.at[0], 0) / samples.length;
  const cy = samples.reduce((acc, s) => acc + s.at[1], 0) / samples.length;
  let scale = 0;
  for (const s of samples) scale = Math.max(scale, Math.abs(s.at[0] - cx), Math.abs(s.at[1] - cy));
  if (scale === 0) return fallback;
  // 'near' weights each equation by 1 / gap^2 (relative error of gap^2), so the samples closest to the cone's tip,
  // where the quadratic form is exact, dominate over the window's far samples.
  let g2max = 0;
  for (const s of samples) g2max = Math.max(g2max, s.gap * s.gap);
  const weight = (s: GapSample) => (options.weighting === 'uniform' ? 1 : 1 / Math.sqrt(s.gap ** 4 + 1e-12 * g2max * g2max));
  const rows = samples.map((s) => {
    const x = (s.at[0] - cx) / scale;
    const y = (s.at[1] - cy) / scale;
    const w = weight(s);
    return [w, w * x, w * y, w * x * x, w * x * y, w * y * y];
  });
  const a = new Matrix(rows);
  const g2 = Matrix.columnVector(samples.map((s) => weight(s) * s.gap * s.gap));
  let c: number[];
  try {
    const at = a.transpose();
    c = solve(at.mmul(a), at.mmul(g2)).to1DArray();
  } catch {
    return fallback;
  }
  if (!c.every(Number.isFinite)) return fallback;
  const [c0, c1, c2, c3, c4, c5] = c;
  const det = 4 * c3 * c5 - c4 * c4;
  if (!(c3 > 0 && det > 0)) return fallback;
  const x = (-2 * c5 * c1 + c4 * c2) / det;
  const y = (-2 * c3 * c2 + c4 * c1) / det;
  const vx = cx + x * scale;
  const vy = cy + y * scale;
  const eps = 1e-12 * scale;
  if (vx < bounds.min[0] - eps || vx > bounds.max[0] + eps || vy < bounds.min[1] - eps || vy > bounds.max[1] + eps) {
    return fallback;
  }
  const gap2 = c0 + c1 * x + c2 * y + c3 * x * x + c4 * x * y + c5 * y * y;
  return { at: [vx, vy], gap2, ok: true };
}

/** The parity verdict of a scan. */
export interface ParityReport {
  count: number;
  parity: 'odd' | 'even';
  /** Product of all resolved block signs (elementary loops and merged blocks). */
  loopProduct: 1 | -1;
  /** Sign of the loop around the whole scanned region evaluated directly, or null when it cannot be closed. */
  regionSign: 1 | -1 | null;
  /** True when the count's parity matches the loop product (and the region loop, and nothing is unresolved). */
  parityConsistent: boolean;
  unresolved: number;
}

/**
 * Parity bookkeeping: the product of all elementary-loop signs equals the sign of the loop around the region
 * (interior edges cancel as |overlap|^2), so the number of degeneracy points has the parity of that product
 * (Longuet-Higgins 1975; PHYSICS.md section 4). A disagreement is flagged, never hidden.
 */
export function parityReport(blocks: readonly LoopBlock[], count: number, regionSign: 1 | -1 | null): ParityReport {
  let product: 1 | -1 = 1;
  let unresolved = 0;
  for (const b of blocks) {
    if (b.sign === 0) unresolved++;
    else if (b.sign === -1) product = product === 1 ? -1 : 1;
  }
  const parity = count % 2 === 1 ? 'odd' : 'even';
  const consistent = (parity === 'odd') === (product === -1) && unresolved === 0 && (regionSign === null || regionSign === product);
  return { count, parity, loopProduct: product, regionSign, parityConsistent: consistent, unresolved };
}
