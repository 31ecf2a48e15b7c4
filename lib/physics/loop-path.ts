// Rasterises a closed loop (circle or polygon) into a cycle of adjacent plaquette centres (PHYSICS.md section 3),
// and walks the counter-clockwise boundary of any simply connected set of grid sites (shared with the degeneracy scan).
import { SpecError } from './errors';
import type { LoopSpec } from './schemas/common';
import type { Vec2 } from './types';

/** Grid geometry: spacing h and site offset in units of h (sites at ((I + 1/2 + fx) h, (J + 1/2 + fy) h)). */
export interface GridGeometry {
  h: number;
  offset: Vec2;
}

/** A closed walk of tube positions: `plaquettes[k]` to `plaquettes[(k + 1) % N]` is one unit step. */
export interface LoopPath {
  /** Global plaquette indices (a, b) of P_0 .. P_{N-1}; P_N = P_0 is not repeated. */
  plaquettes: [number, number][];
  /** Plaquette centres of the same positions, units of L. */
  points: Vec2[];
  orientation: 'ccw' | 'cw';
  /** Global indices (I, J) of the sites enclosed by the walk (the set S). */
  sites: [number, number][];
}

/** A point within this distance (units of L) of the curve counts as on it, not strictly inside (as for well walls). */
export const LOOP_EDGE_TOLERANCE = 1e-9;

/** Site (I, J) centre in units of L. */
export function siteCentre(grid: GridGeometry, i: number, j: number): Vec2 {
  return [(i + 0.5 + grid.offset[0]) * grid.h, (j + 0.5 + grid.offset[1]) * grid.h];
}

/** Plaquette (a, b) centre in units of L: the upper-right corner of site (a, b)'s square. */
export function plaquetteCentreOf(grid: GridGeometry, a: number, b: number): Vec2 {
  return [(a + 1 + grid.offset[0]) * grid.h, (b + 1 + grid.offset[1]) * grid.h];
}

/** Site key for sets of sites. Safe for |I|, |J| < 2^20. */
export function siteKey(i: number, j: number): number {
  return (i + 1_048_576) * 2_097_152 + (j + 1_048_576);
}

function distanceToSegment(px: number, py: number, ax: number, ay: number, bx: number, by: number): number {
  const dx = bx - ax;
  const dy = by - ay;
  const len2 = dx * dx + dy * dy;
  let t = len2 > 0 ? ((px - ax) * dx + (py - ay) * dy) / len2 : 0;
  t = Math.max(0, Math.min(1, t));
  return Math.hypot(px - (ax + t * dx), py - (ay + t * dy));
}

/** Even-odd rule point-in-polygon plus a distance check: strictly inside by more than LOOP_EDGE_TOLERANCE. */
function strictlyInsidePolygon(points: readonly Vec2[], x: number, y: number): boolean {
  let inside = false;
  const n = points.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const [xi, yi] = points[i];
    const [xj, yj] = points[j];
    if (distanceToSegment(x, y, xi, yi, xj, yj) <= LOOP_EDGE_TOLERANCE) return false;
    if (yi > y !== yj > y && x < ((xj - xi) * (y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** Twice the signed area of a polygon (positive when counter-clockwise). */
export function signedArea2(points: readonly Vec2[]): number {
  let s = 0;
  for (let i = 0, j = points.length - 1; i < points.length; j = i++) {
    s += points[j][0] * points[i][1] - points[i][0] * points[j][1];
  }
  return s;
}

/**
 * The sites strictly inside a loop curve (more than 1e-9 L from it), as global (I, J), sorted by J then I.
 * @example
 * sitesInsideLoop({ circle: { center: [0, 0], radius: 0.1 } }, { h: 0.1, offset: [0, 0] }); // [[-1, -1], [0, -1], [-1, 0], [0, 0]]
 */
export function sitesInsideLoop(loop: LoopSpec, grid: GridGeometry): [number, number][] {
  let minX: number;
  let minY: number;
  let maxX: number;
  let maxY: number;
  let inside: (x: number, y: number) => boolean;
  if ('circle' in loop) {
    const { center, radius } = loop.circle;
    minX = center[0] - radius;
    maxX = center[0] + radius;
    minY = center[1] - radius;
    maxY = center[1] + radius;
    inside = (x, y) => radius - Math.hypot(x - center[0], y - center[1]) > LOOP_EDGE_TOLERANCE;
  } else {
    const pts = loop.polygon;
    minX = Math.min(...pts.map((p) => p[0]));
    maxX = Math.max(...pts.map((p) => p[0]));
    minY = Math.min(...pts.map((p) => p[1]));
    maxY = Math.max(...pts.map((p) => p[1]));
    inside = (x, y) => strictlyInsidePolygon(pts, x, y);
  }
  const { h } = grid;
  const [fx, fy] = grid.offset;
  const i0 = Math.floor(minX / h - 0.5 - fx) - 1;
  const i1 = Math.ceil(maxX / h - 0.5 - fx) + 1;
  const j0 = Math.floor(minY / h - 0.5 - fy) - 1;
  const j1 = Math.ceil(maxY / h - 0.5 - fy) + 1;
  const count = (i1 - i0 + 1) * (j1 - j0 + 1);
  if (count > 4_000_000) {
    throw new SpecError(`the loop covers about ${count.toLocaleString('en-US')} grid sites; use a smaller loop or a coarser grid`, 'loop');
  }
  const sites: [number, number][] = [];
  for (let j = j0; j <= j1; j++) {
    for (let i = i0; i <= i1; i++) {
      const [x, y] = siteCentre(grid, i, j);
      if (inside(x, y)) sites.push([i, j]);
    }
  }
  return sites;
}

/**
 * Why a set of sites has no simple boundary (empty, not 4-connected, or holed), or null when it has one.
 * @example
 * siteSetProblem([[0, 0], [1, 1]]); // 'encloses grid sites that are not connected (...)'
 */
export function siteSetProblem(sites: readonly [number, number][]): string | null {
  if (sites.length === 0) return 'encloses no grid site (make it larger than the grid spacing)';
  const set = new Set(sites.map(([i, j]) => siteKey(i, j)));
  // 4-connectivity of the set.
  const seen = new Set<number>([siteKey(sites[0][0], sites[0][1])]);
  const stack: [number, number][] = [sites[0]];
  while (stack.length > 0) {
    const [i, j] = stack.pop()!;
    for (const [di, dj] of NEIGHBOURS) {
      const key = siteKey(i + di, j + dj);
      if (set.has(key) && !seen.has(key)) {
        seen.add(key);
        stack.push([i + di, j + dj]);
      }
    }
  }
  if (seen.size !== set.size) return 'encloses grid sites that are not connected (the loop is too thin for this grid)';
  if (holeSites(sites).length > 0) return 'encloses a set of grid sites with a hole (the loop is too thin for this grid)';
  return null;
}

const NEIGHBOURS: readonly [number, number][] = [
  [1, 0],
  [-1, 0],
  [0, 1],
  [0, -1],
];

/**
 * The counter-clockwise boundary of the union of the h x h squares centred on `sites`, as a cycle of plaquettes.
 * The set must be non-empty, 4-connected and without holes (check with `siteSetProblem`); the walk starts at the
 * lowest, then leftmost corner and returns each plaquette once (P_N = P_0 omitted).
 *
 * @param sites - global site indices (I, J)
 * @returns plaquette indices (a, b); site (I, J)'s square has corners (I-1, J-1), (I, J-1), (I, J), (I-1, J)
 * @example
 * boundaryOfSites([[0, 0]]); // [[-1, -1], [0, -1], [0, 0], [-1, 0]]
 */
export function boundaryOfSites(sites: readonly [number, number][]): [number, number][] {
  const set = new Set(sites.map(([i, j]) => siteKey(i, j)));
  const has = (i: number, j: number) => set.has(siteKey(i, j));
  // Directed edges with the set on the left, keyed by their start corner. Corner (p, q) is the lower-left corner of
  // site (p, q), i.e. plaquette (p - 1, q - 1).
  const next = new Map<number, [number, number]>();
  const add = (p: number, q: number, p2: number, q2: number) => {
    const key = siteKey(p, q);
    if (next.has(key)) throw new Error(`internal: boundary corner (${p}, ${q}) visited twice`);
    next.set(key, [p2, q2]);
  };
  let start: [number, number] | null = null;
  for (const [i, j] of sites) {
    if (!has(i, j - 1)) {
      add(i, j, i + 1, j);
      if (start === null || j < start[1] || (j === start[1] && i < start[0])) start = [i, j];
    }
    if (!has(i + 1, j)) add(i + 1, j, i + 1, j + 1);
    if (!has(i, j + 1)) add(i + 1, j + 1, i, j + 1);
    if (!has(i - 1, j)) add(i, j + 1, i, j);
  }
  if (start === null) return [];
  const out: [number, number][] = [];
  let cur: [number, number] = start;
  do {
    out.push([cur[0] - 1, cur[1] - 1]);
    const nxt = next.get(siteKey(cur[0], cur[1]));
    if (!nxt) throw new Error('internal: open boundary');
    cur = nxt;
    if (out.length > next.size) throw new Error('internal: boundary is not one simple cycle');
  } while (cur[0] !== start[0] || cur[1] !== start[1]);
  if (out.length !== next.size) throw new Error('internal: boundary is not one simple cycle');
  return out;
}

/**
 * Rasterises a loop exactly as PHYSICS.md section 3: the sites strictly inside the curve, the union of their squares,
 * the boundary walked counter-clockwise (reversed for a clockwise loop).
 *
 * @param loop - a circle {center, radius} or polygon [[x, y], ...] in units of L
 * @param grid - spacing h and offset (units of h)
 * @param orientation - 'ccw' (default for circles) or 'cw'; for polygons the default is the vertex order
 * @returns the closed walk of plaquette centres and the enclosed sites
 * @throws SpecError (path "loop") when the enclosed set is empty, disconnected or holed
 * @example
 * const path = rasteriseLoop({ circle: { center: [0, 0], radius: 0.2 } }, { h: 0.1, offset: [0, 0] });
 * path.points.length; // 16 (the boundary of the 12 sites within 0.2 of the origin)
 */
export function rasteriseLoop(loop: LoopSpec, grid: GridGeometry, orientation?: 'ccw' | 'cw'): LoopPath {
  const sites = sitesInsideLoop(loop, grid);
  const problem = siteSetProblem(sites);
  if (problem) throw new SpecError(`the loop ${problem}`, 'loop');
  let orient: 'ccw' | 'cw' = orientation ?? 'ccw';
  if (!orientation && 'polygon' in loop) orient = signedArea2(loop.polygon) < 0 ? 'cw' : 'ccw';
  let plaquettes = boundaryOfSites(sites);
  if (orient === 'cw') plaquettes = [plaquettes[0], ...plaquettes.slice(1).reverse()];
  return {
    plaquettes,
    points: plaquettes.map(([a, b]) => plaquetteCentreOf(grid, a, b)),
    orientation: orient,
    sites,
  };
}

/**
 * The holes of a set of sites: sites inside its bounding box that are not in the set and not 4-connected to the
 * outside of the box.
 * @example
 * holeSites([[0, 0], [1, 0], [2, 0], [0, 1], [2, 1], [0, 2], [1, 2], [2, 2]]); // [[1, 1]]
 */
export function holeSites(sites: readonly [number, number][]): [number, number][] {
  let iMin = Infinity;
  let iMax = -Infinity;
  let jMin = Infinity;
  let jMax = -Infinity;
  for (const [i, j] of sites) {
    iMin = Math.min(iMin, i);
    iMax = Math.max(iMax, i);
    jMin = Math.min(jMin, j);
    jMax = Math.max(jMax, j);
  }
  // A one-site margin around the box, so that the outside is one connected region starting at cell 0.
  const w = iMax - iMin + 3;
  const hgt = jMax - jMin + 3;
  const inSet = new Uint8Array(w * hgt);
  for (const [i, j] of sites) inSet[i - iMin + 1 + w * (j - jMin + 1)] = 1;
  const outside = new Uint8Array(w * hgt);
  const stack: number[] = [0];
  outside[0] = 1;
  while (stack.length > 0) {
    const c = stack.pop()!;
    const ci = c % w;
    const cj = (c - ci) / w;
    for (const [di, dj] of NEIGHBOURS) {
      const ni = ci + di;
      const nj = cj + dj;
      if (ni < 0 || nj < 0 || ni >= w || nj >= hgt) continue;
      const idx = ni + w * nj;
      if (outside[idx] || inSet[idx]) continue;
      outside[idx] = 1;
      stack.push(idx);
    }
  }
  const holes: [number, number][] = [];
  for (let nj = 0; nj < hgt; nj++) {
    for (let ni = 0; ni < w; ni++) {
      if (!outside[ni + w * nj] && !inSet[ni + w * nj]) holes.push([ni + iMin - 1, nj + jMin - 1]);
    }
  }
  return holes;
}
