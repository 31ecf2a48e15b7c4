// Follows levels through true crossings by the overlaps of neighbouring states (PHYSICS.md section 5): sorted energies
// alone turn every crossing into a fake avoided crossing. Assignment by maximum total |overlap|^2 (Hungarian method).
import type { StateBlock } from './types';

/**
 * Optimal assignment maximising sum weight[r][assign[r]] over a square matrix (Hungarian / Kuhn–Munkres,
 * O(k^3); Kuhn 1955, Naval Res. Logist. Q. 2, 83). Ties resolve deterministically (lowest index first).
 *
 * @param weight - row-major k x k weights
 * @param k - size
 * @returns assign[r] = column given to row r
 * @example
 * maxWeightAssignment(Float64Array.from([0.1, 0.9, 0.8, 0.2]), 2); // Int32Array [1, 0]
 */
export function maxWeightAssignment(weight: Float64Array, k: number): Int32Array {
  // Minimise cost = max - weight with the classic potentials formulation (1-based internals).
  let max = 0;
  for (let i = 0; i < k * k; i++) max = Math.max(max, weight[i]);
  const cost = (r: number, c: number) => max - weight[r * k + c];
  const u = new Float64Array(k + 1);
  const v = new Float64Array(k + 1);
  const p = new Int32Array(k + 1);
  const way = new Int32Array(k + 1);
  for (let i = 1; i <= k; i++) {
    p[0] = i;
    let j0 = 0;
    const minv = new Float64Array(k + 1).fill(Infinity);
    const used = new Uint8Array(k + 1);
    do {
      used[j0] = 1;
      const i0 = p[j0];
      let delta = Infinity;
      let j1 = 0;
      for (let j = 1; j <= k; j++) {
        if (used[j]) continue;
        const cur = cost(i0 - 1, j - 1) - u[i0] - v[j];
        if (cur < minv[j]) {
          minv[j] = cur;
          way[j] = j0;
        }
        if (minv[j] < delta) {
          delta = minv[j];
          j1 = j;
        }
      }
      for (let j = 0; j <= k; j++) {
        if (used[j]) {
          u[p[j]] += delta;
          v[j] -= delta;
        } else {
          minv[j] -= delta;
        }
      }
      j0 = j1;
    } while (p[j0] !== 0);
    do {
      const j1 = way[j0];
      p[j0] = p[j1];
      j0 = j1;
    } while (j0 !== 0);
  }
  const assign = new Int32Array(k);
  for (let j = 1; j <= k; j++) if (p[j] > 0) assign[p[j] - 1] = j - 1;
  return assign;
}

/** |<a_i | b_j>|^2 for all i, j (row-major), optionally with b first mapped by a gauge (done by the caller). */
export function overlapWeights(a: StateBlock, b: StateBlock): Float64Array {
  const k = a.k;
  const { n } = a;
  const out = new Float64Array(k * b.k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < b.k; j++) {
      let sr = 0;
      let si = 0;
      for (let s = 0; s < n; s++) {
        const ar = a.re[i * n + s];
        const ai = a.im ? a.im[i * n + s] : 0;
        const br = b.re[j * n + s];
        const bi = b.im ? b.im[j * n + s] : 0;
        sr += ar * br + ai * bi;
        si += ar * bi - ai * br;
      }
      out[i * b.k + j] = sr * sr + si * si;
    }
  }
  return out;
}

/** Result of following levels over a sequence of configurations. */
export interface TrackedLevels {
  /** sorted[l][s]: the l-th lowest level at step s. */
  sorted: number[][];
  /** tracked[t][s]: the energy of track t at step s (track t starts as level t at step 0). */
  tracked: number[][];
  /** order[t][s]: which sorted level track t occupies at step s. */
  order: number[][];
  /** Smallest |overlap|^2 of an accepted match per track (1 = perfect continuity; below 0.5 is doubtful). */
  minOverlap: number[];
}

/**
 * Incremental level tracker. Feed it each step's ascending energies and states (already in a common gauge with the
 * previous step's states: map them through the gauge map first when the gauge changes). Within a degenerate group
 * (|E_i - E_j| <= degeneracyTol max(1, |E_i|)) the states are arbitrary, so a track's reference state is only replaced where its
 * level is isolated; the next isolated step is matched against the last reliable one.
 */
export class LevelTracker {
  private readonly k: number;
  private readonly degeneracyTol: number;
  private refs: StateBlock | null = null;
  private readonly sortedRows: number[][] = [];
  private readonly orderRows: number[][] = [];
  private readonly minOverlap: number[];

  /**
   * @param k - number of levels to follow
   * @param degeneracyTol - relative tolerance: |E_i - E_j| <= degeneracyTol * max(1, |E_i|) counts as degenerate
   */
  constructor(k: number, degeneracyTol: number) {
    this.k = k;
    this.degeneracyTol = degeneracyTol;
    this.minOverlap = new Array<number>(k).fill(1);
  }

  /** The reference states (one column per track), to be mapped by the caller when the gauge changes. */
  references(): StateBlock | null {
    return this.refs;
  }

  /** Replace the references (e.g. after applying a gauge map). */
  setReferences(block: StateBlock): void {
    this.refs = block;
  }

  /**
   * Adds one step.
   * @param values - ascending energies (at least k)
   * @param states - the matching states (at least k columns)
   */
  push(values: ArrayLike<number>, states: StateBlock): void {
    const { k } = this;
    const n = states.n;
    const sortedRow = Array.from({ length: k }, (_, l) => values[l]);
    let order: number[];
    if (this.refs === null) {
      order = sortedRow.map((_, t) => t);
    } else {
      const cols = Math.min(states.k, k);
      const sub: StateBlock = { n, k: cols, re: states.re.subarray(0, cols * n), im: states.im ? states.im.subarray(0, cols * n) : null };
      const w = overlapWeights(this.refs, sub);
      const assign = maxWeightAssignment(w, k);
      order = Array.from(assign);
      for (let t = 0; t < k; t++) this.minOverlap[t] = Math.min(this.minOverlap[t], w[t * k + order[t]]);
    }
    // Update references for tracks whose level is isolated.
    const refs: StateBlock = this.refs
      ? { n, k, re: Float64Array.from(this.refs.re), im: this.refs.im || states.im ? new Float64Array(n * k) : null }
      : { n, k, re: new Float64Array(n * k), im: states.im ? new Float64Array(n * k) : null };
    if (this.refs?.im && refs.im) refs.im.set(this.refs.im);
    for (let t = 0; t < k; t++) {
      const l = order[t];
      const tol = this.degeneracyTol * Math.max(1, Math.abs(values[l]));
      const isolated = (l === 0 || values[l] - values[l - 1] > tol) && (l + 1 >= values.length || values[l + 1] - values[l] > tol);
      if (isolated || this.refs === null) {
        refs.re.set(states.re.subarray(l * n, (l + 1) * n), t * n);
        if (refs.im) {
          if (states.im) refs.im.set(states.im.subarray(l * n, (l + 1) * n), t * n);
          else refs.im.fill(0, t * n, (t + 1) * n);
        }
      }
    }
    this.refs = refs;
    this.sortedRows.push(sortedRow);
    this.orderRows.push(order);
  }

  /** The tracked and sorted levels so far. */
  result(): TrackedLevels {
    const steps = this.sortedRows.length;
    const { k } = this;
    const sorted = Array.from({ length: k }, (_, l) => this.sortedRows.map((row) => row[l]));
    const order = Array.from({ length: k }, (_, t) => this.orderRows.map((row) => row[t]));
    const tracked = Array.from({ length: k }, (_, t) => Array.from({ length: steps }, (_, s) => this.sortedRows[s][order[t][s]]));
    return { sorted, tracked, order, minOverlap: this.minOverlap.slice() };
  }
}
