// Shared data types of the Fluxfolio solver (lib/physics): lattice, tubes, sparse matrices, eigenpairs.
// Pure TypeScript with no Next.js or React imports, so that the CLI, the job worker and the tests share it.

/** A point or vector in the plane, in units of the length L. */
export type Vec2 = [number, number];

/**
 * The square lattice that covers a well's bounding box (PHYSICS.md section 2).
 *
 * Global site (I, J) sits at ((I + 1/2 + fx) h, (J + 1/2 + fy) h), with (fx, fy) the grid offset in units of h.
 * The box holds the sites I = i0 .. i0 + nx - 1, J = j0 .. j0 + ny - 1; the local site (i, j) = (I - i0, J - j0)
 * has box index `i + nx * j` (x fastest). Plaquette (a, b) (global) has lower-left site (a, b) and centre
 * ((a + 1 + fx) h, (b + 1 + fy) h).
 */
export interface Lattice {
  h: number;
  offset: Vec2;
  i0: number;
  j0: number;
  nx: number;
  ny: number;
  /** Box index -> unknown index, or -1 for a wall site (held at zero). Length nx * ny. */
  unknownOf: Int32Array;
  /** Unknown index -> box index. Length n. */
  siteOf: Int32Array;
  /** Number of unknowns (sites strictly inside the well). */
  n: number;
  /** Potential V at each unknown (energy units hbar^2/(2 m L^2)), or null when there is none. */
  potential: Float64Array | null;
}

/** A flux tube after snapping to a plaquette centre. */
export interface SnappedTube {
  /** Snapped position (a plaquette centre). */
  at: Vec2;
  /** Flux in units of h/e, echoed as given. */
  alpha: number;
  /** Global plaquette indices (a, b): the lower-left site of the plaquette. */
  plaquette: [number, number];
  /** The position that was asked for. */
  requested: Vec2;
}

/**
 * A Hermitian sparse matrix in CSR form holding BOTH triangles (rows sorted by column).
 * `im` is null for a real symmetric matrix.
 */
export interface CsrMatrix {
  n: number;
  rowPtr: Int32Array;
  colIdx: Int32Array;
  re: Float64Array;
  im: Float64Array | null;
}

/** k vectors of length n, vector j stored at [j * n, (j + 1) * n). `im` is null for real vectors. */
export interface StateBlock {
  n: number;
  k: number;
  re: Float64Array;
  im: Float64Array | null;
}

export interface EigenOptions {
  /** Relative residual tolerance ||H v - lambda v|| / max(1, |lambda|). Default 1e-9. */
  tol?: number;
  maxIter?: number;
  /** Seed of the deterministic start vectors. Default 1. */
  seed?: number;
  /** Warm start: previous eigenvectors (any number of columns; extra columns are ignored). */
  initial?: StateBlock | null;
  signal?: AbortSignal;
  /** Called with a fraction in [0, 1]. */
  onProgress?: (fraction: number) => void;
  /** 'auto' picks by size and warm start; see lib/physics/eigen/choose-method.ts. */
  method?: 'auto' | 'lobpcg' | 'shift-invert' | 'dense';
  /** Optional preconditioner T ~ (H - sigma)^-1 for LOBPCG: writes T r into out, column by column. */
  preconditioner?: Preconditioner | null;
}

/** Applies an approximate inverse to a block of residuals (same n and k as the input), writing into `out`. */
export type Preconditioner = (r: StateBlock, out: StateBlock) => void;

export interface EigenResult {
  /** Ascending eigenvalues (length k). */
  values: Float64Array;
  vectors: StateBlock;
  residualNorms: Float64Array;
  iterations: number;
  converged: boolean;
  method: string;
}

/** Progress and cancellation handed to every task. */
export interface TaskContext {
  signal?: AbortSignal;
  onProgress?: (fraction: number, message?: string) => void;
}
