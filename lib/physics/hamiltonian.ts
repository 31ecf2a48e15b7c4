// Lattice Hamiltonian H = (-i grad - A)^2 + V with Peierls phases on branch cuts towards +x (PHYSICS.md section 2).
// Five-point Laplacian, Dirichlet walls; real symmetric when every 2 alpha is an integer, complex Hermitian otherwise.
import type { CsrMatrix, Lattice, SnappedTube } from './types';

/** |2 alpha - round(2 alpha)| below this counts as an integer or half-integer flux. */
const REAL_FLUX_SLACK = 1e-12;

/**
 * True when every flux is an integer or a half-integer, so that all Peierls factors are +-1 and H is real.
 * @example
 * isRealFlux([0.5, 1, -1.5]); // true
 * isRealFlux([0.25]); // false
 */
export function isRealFlux(alphas: number[]): boolean {
  return alphas.every((a) => Math.abs(2 * a - Math.round(2 * a)) <= REAL_FLUX_SLACK);
}

/**
 * Total flux (units of h/e) whose cut crosses the vertical link from global site (i, b) up to (i, b + 1):
 * the sum of alpha over tubes in plaquette (a, b) with i >= a + 1.
 * @example
 * cutFlux([{ plaquette: [-1, -1], alpha: 0.5, at: [0, 0], requested: [0, 0] }], 0, -1); // 0.5
 */
export function cutFlux(tubes: SnappedTube[], i: number, b: number): number {
  let sum = 0;
  for (const t of tubes) if (t.plaquette[1] === b && i >= t.plaquette[0] + 1) sum += t.alpha;
  return sum;
}

/**
 * exp(+2 pi i alpha) as [re, im], exact at multiples of a quarter flux quantum.
 * @example
 * phaseFactor(0.5); // [-1, 0]
 */
export function phaseFactor(alpha: number): [number, number] {
  const r = alpha - Math.round(alpha); // in [-1/2, 1/2]
  if (r === 0) return [1, 0];
  if (Math.abs(r) === 0.5) return [-1, 0];
  if (r === 0.25) return [0, 1];
  if (r === -0.25) return [0, -1];
  const t = 2 * Math.PI * r;
  return [Math.cos(t), Math.sin(t)];
}

/** Per link row b: the tubes whose cut runs along it, sorted by a, for fast cutFlux lookups. */
function tubesByRow(tubes: SnappedTube[]): Map<number, SnappedTube[]> {
  const rows = new Map<number, SnappedTube[]>();
  for (const t of tubes) {
    const list = rows.get(t.plaquette[1]) ?? [];
    list.push(t);
    rows.set(t.plaquette[1], list);
  }
  for (const list of rows.values()) list.sort((p, q) => p.plaquette[0] - q.plaquette[0]);
  return rows;
}

/**
 * Assembles the Hamiltonian on the lattice's unknowns.
 *
 * Row/column index = unknown index (box order, x fastest). Diagonal 4/h^2 + V; hopping -1/h^2 to each neighbouring
 * unknown; on a vertical link crossed by cuts, H[upper, lower] = -exp(+2 pi i sum alpha)/h^2 and its conjugate in
 * H[lower, upper]. Energies in hbar^2/(2 m L^2).
 *
 * @param lattice - from buildLattice
 * @param tubes - snapped tubes (any positions, inside or outside the well)
 * @returns CSR with both triangles and sorted columns; `im` is null when isRealFlux holds
 * @see PHYSICS.md section 2 (gauge convention); R. Peierls, Z. Phys. 80, 763 (1933) for lattice phases
 * @example
 * const H = buildHamiltonian(lattice, [snapTube(lattice, [0, 0], 0.5)]);
 * H.im; // null (half tube: real path)
 */
export function buildHamiltonian(lattice: Lattice, tubes: SnappedTube[]): CsrMatrix {
  const { nx, ny, i0, j0, unknownOf, siteOf, n, potential } = lattice;
  const inv = 1 / (lattice.h * lattice.h);
  const real = isRealFlux(tubes.map((t) => t.alpha));
  const rows = tubesByRow(tubes);

  const rowPtr = new Int32Array(n + 1);
  for (let u = 0; u < n; u++) {
    const s = siteOf[u];
    const i = s % nx;
    const j = (s - i) / nx;
    let count = 1;
    if (j > 0 && unknownOf[s - nx] >= 0) count++;
    if (i > 0 && unknownOf[s - 1] >= 0) count++;
    if (i < nx - 1 && unknownOf[s + 1] >= 0) count++;
    if (j < ny - 1 && unknownOf[s + nx] >= 0) count++;
    rowPtr[u + 1] = rowPtr[u] + count;
  }
  const nnz = rowPtr[n];
  const colIdx = new Int32Array(nnz);
  const re = new Float64Array(nnz);
  const im = real ? null : new Float64Array(nnz);

  // Factor on the link from (I, b) up to (I, b + 1), as seen from the upper site: exp(+2 pi i flux).
  const linkFactor = (I: number, b: number): [number, number] => {
    const list = rows.get(b);
    if (!list) return [1, 0];
    let flux = 0;
    let halves = 0;
    for (const t of list) {
      if (t.plaquette[0] + 1 > I) break;
      flux += t.alpha;
      halves += Math.round(2 * t.alpha);
    }
    if (real) return [halves % 2 === 0 ? 1 : -1, 0];
    return phaseFactor(flux);
  };

  let p = 0;
  for (let u = 0; u < n; u++) {
    const s = siteOf[u];
    const i = s % nx;
    const j = (s - i) / nx;
    const I = i + i0;
    const J = j + j0;
    if (j > 0 && unknownOf[s - nx] >= 0) {
      // This site is the upper end of the link (I, J-1)-(I, J): element -exp(+i theta)/h^2.
      const [c, d] = linkFactor(I, J - 1);
      colIdx[p] = unknownOf[s - nx];
      re[p] = -c * inv;
      if (im) im[p] = -d * inv;
      p++;
    }
    if (i > 0 && unknownOf[s - 1] >= 0) {
      colIdx[p] = unknownOf[s - 1];
      re[p++] = -inv;
    }
    colIdx[p] = u;
    re[p++] = 4 * inv + (potential ? potential[u] : 0);
    if (i < nx - 1 && unknownOf[s + 1] >= 0) {
      colIdx[p] = unknownOf[s + 1];
      re[p++] = -inv;
    }
    if (j < ny - 1 && unknownOf[s + nx] >= 0) {
      // This site is the lower end of the link (I, J)-(I, J+1): element -exp(-i theta)/h^2.
      const [c, d] = linkFactor(I, J);
      colIdx[p] = unknownOf[s + nx];
      re[p] = -c * inv;
      if (im) im[p] = d * inv;
      p++;
    }
  }
  return { n, rowPtr, colIdx, re, im };
}
