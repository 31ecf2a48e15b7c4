// Symbolic phase of the sparse LDL: fill-reducing order, elimination tree, postorder, column counts and relaxed
// supernodes with their row structures. Depends only on the sparsity pattern, so one analysis serves many matrices.
import type { CsrMatrix } from '../types';
import type { LdlAnalyzeOptions, LdlSymbolic } from './ldl-types';
import { nestedDissectionOrdering } from './ordering';

/**
 * Symbolic analysis: nested dissection ordering, elimination tree (Liu 1986), postorder, column counts from
 * row subtrees, fundamental supernodes and their row structures (Davis 2006, chapters 4 and 9).
 *
 * @param matrix Hermitian CSR holding both triangles (only the pattern is read)
 * @example
 * const symbolic = analyzeLdl(matrix); // then factorLdl(matrix, { symbolic })
 * @see T. A. Davis, Direct Methods for Sparse Linear Systems, SIAM (2006)
 * @see J. W. H. Liu, "A compact row storage scheme for Cholesky factors using elimination trees", ACM TOMS 12, 127 (1986)
 */
export function analyzeLdl(matrix: Pick<CsrMatrix, 'n' | 'rowPtr' | 'colIdx'>, options: LdlAnalyzeOptions = {}): LdlSymbolic {
  const { n, rowPtr, colIdx } = matrix;
  checkPattern(matrix);
  const first = options.ordering ?? nestedDissectionOrdering({ n, rowPtr, colIdx }, options);
  if (first.perm.length !== n) throw new RangeError(`ordering.perm must have length n = ${n}`);

  // Elimination tree of the nested-dissection order, then relabel by its postorder so that every subtree
  // (and so every supernode) is a contiguous range of pivots.
  const parent0 = eliminationTree(n, rowPtr, colIdx, first.perm, first.inverse);
  const post = postorder(parent0);
  const perm = new Int32Array(n);
  for (let k = 0; k < n; k++) perm[k] = first.perm[post[k]];
  const inverse = new Int32Array(n);
  for (let k = 0; k < n; k++) inverse[perm[k]] = k;
  const parent = eliminationTree(n, rowPtr, colIdx, perm, inverse);

  // Lower triangle of C = P A P^T by column; C[i][j] (i >= j) is conj(A[perm[j]][perm[i]]).
  const lowerPtr = new Int32Array(n + 1);
  for (let j = 0; j < n; j++) {
    const p = perm[j];
    let count = 0;
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) if (inverse[colIdx[q]] >= j) count++;
    lowerPtr[j + 1] = lowerPtr[j] + count;
  }
  const lowerRow = new Int32Array(lowerPtr[n]);
  const lowerSource = new Int32Array(lowerPtr[n]);
  for (let j = 0; j < n; j++) {
    const p = perm[j];
    let at = lowerPtr[j];
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) {
      const i = inverse[colIdx[q]];
      if (i >= j) {
        lowerRow[at] = i;
        lowerSource[at++] = q;
      }
    }
  }

  const counts = columnCounts(n, rowPtr, colIdx, perm, inverse, parent);
  let factorNonzeros = 0;
  let flops = 0;
  for (let j = 0; j < n; j++) {
    factorNonzeros += counts[j];
    flops += (counts[j] - 1) * (counts[j] - 1) / 2 + counts[j];
  }

  // Fundamental supernodes (pivot j + 1 continues j's supernode when it is j's parent and L(:, j) minus its
  // diagonal has exactly the structure of L(:, j + 1)), then relaxed amalgamation of chains.
  const starts = relaxedSupernodes(n, parent, counts);
  const superCount = Math.max(0, starts.length - 1);
  const superStart = Int32Array.from(n > 0 ? starts : [0]);
  const superOf = new Int32Array(n);
  for (let s = 0; s < superCount; s++) for (let j = superStart[s]; j < superStart[s + 1]; j++) superOf[j] = s;
  const superParent = new Int32Array(superCount);
  for (let s = 0; s < superCount; s++) {
    const last = superStart[s + 1] - 1;
    superParent[s] = parent[last] === -1 ? -1 : superOf[parent[last]];
  }

  // Row structures: own pivots, rows of the original lower columns, and the children's rows above the supernode.
  const superRowPtr = new Int32Array(superCount + 1);
  // A (relaxed) supernode's rows are its own pivots plus the rows of its last pivot's column below it.
  for (let s = 0; s < superCount; s++) {
    const last = superStart[s + 1] - 1;
    superRowPtr[s + 1] = superRowPtr[s] + (superStart[s + 1] - superStart[s]) + counts[last] - 1;
  }
  const superRowIdx = new Int32Array(superRowPtr[superCount]);
  const childHead = new Int32Array(superCount).fill(-1);
  const childNext = new Int32Array(superCount).fill(-1);
  for (let s = superCount - 1; s >= 0; s--) {
    const p = superParent[s];
    if (p >= 0) {
      childNext[s] = childHead[p];
      childHead[p] = s;
    }
  }
  const mark = new Int32Array(n).fill(-1);
  const panelOffset = new Float64Array(superCount + 1);
  for (let s = 0; s < superCount; s++) {
    const f = superStart[s];
    const l = superStart[s + 1];
    const base = superRowPtr[s];
    let size = 0;
    for (let j = f; j < l; j++) {
      superRowIdx[base + size++] = j;
      mark[j] = s;
    }
    for (let j = f; j < l; j++) {
      for (let q = lowerPtr[j]; q < lowerPtr[j + 1]; q++) {
        const i = lowerRow[q];
        if (mark[i] !== s) {
          mark[i] = s;
          superRowIdx[base + size++] = i;
        }
      }
    }
    for (let c = childHead[s]; c !== -1; c = childNext[c]) {
      const cb = superRowPtr[c];
      const ce = superRowPtr[c + 1];
      for (let q = cb + (superStart[c + 1] - superStart[c]); q < ce; q++) {
        const i = superRowIdx[q];
        if (mark[i] !== s) {
          mark[i] = s;
          superRowIdx[base + size++] = i;
        }
      }
    }
    if (size !== superRowPtr[s + 1] - base) {
      throw new Error(`LDL analysis is inconsistent at supernode ${s}: ${size} rows, expected ${superRowPtr[s + 1] - base}`);
    }
    superRowIdx.subarray(base + (l - f), base + size).sort();
    panelOffset[s + 1] = panelOffset[s] + size * (l - f);
  }

  return {
    n,
    perm,
    inverse,
    lowerPtr,
    lowerRow,
    lowerSource,
    superCount,
    superStart,
    superRowPtr,
    superRowIdx,
    superParent,
    panelOffset,
    storedEntries: panelOffset[superCount],
    factorNonzeros,
    flops,
    rowPtr: rowPtr.slice(),
    colIdx: colIdx.slice(),
  };
}

/** True when `symbolic` was computed for exactly this sparsity pattern. */
export function matchesPattern(symbolic: LdlSymbolic, matrix: Pick<CsrMatrix, 'n' | 'rowPtr' | 'colIdx'>): boolean {
  if (symbolic.n !== matrix.n) return false;
  const a = symbolic.rowPtr;
  const b = matrix.rowPtr;
  if (a.length !== b.length || symbolic.colIdx.length !== matrix.colIdx.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  const c = symbolic.colIdx;
  const d = matrix.colIdx;
  for (let i = 0; i < c.length; i++) if (c[i] !== d[i]) return false;
  return true;
}

export function checkPattern(matrix: Pick<CsrMatrix, 'n' | 'rowPtr' | 'colIdx'>): void {
  const { n, rowPtr, colIdx } = matrix;
  if (!Number.isInteger(n) || n < 0) throw new RangeError(`matrix.n must be a non-negative integer, got ${n}`);
  if (rowPtr.length !== n + 1) throw new RangeError(`matrix.rowPtr must have length n + 1 = ${n + 1}`);
  if (rowPtr[0] !== 0 || rowPtr[n] !== colIdx.length) throw new RangeError('matrix.rowPtr must start at 0 and end at colIdx.length');
}

/** Relaxed amalgamation thresholds (pivots per supernode, largest fraction of explicit zeros): CHOLMOD's defaults. */
const RELAX_COLUMNS = [4, 16, 48];
const RELAX_ZEROS = [0.8, 0.1, 0.05];

/**
 * Supernode boundaries: fundamental supernodes, then a chain of supernodes is merged into its parent when the
 * merged front stores few explicit zeros (relaxed amalgamation, Ashcraft & Grimes 1989; thresholds as in
 * CHOLMOD, Chen, Davis, Hager & Rajamanickam, ACM TOMS 35, 22 (2008)). Larger dense blocks run faster than
 * the zeros they add cost.
 */
function relaxedSupernodes(n: number, parent: Int32Array, counts: Int32Array): number[] {
  if (n === 0) return [0];
  // Each entry: first pivot, number of pivots, front rows, true nonzeros.
  const first: number[] = [];
  const cols: number[] = [];
  const rows: number[] = [];
  const nonzeros: number[] = [];
  let j = 0;
  while (j < n) {
    let l = j + 1;
    while (l < n && parent[l - 1] === l && counts[l - 1] === counts[l] + 1) l++;
    let f = j;
    let ncol = l - j;
    let m = counts[j];
    let nz = 0;
    for (let t = j; t < l; t++) nz += counts[t];
    // Merge the preceding supernode(s) while they are children of this one and the zeros stay acceptable.
    while (first.length > 0 && parent[f - 1] >= f && parent[f - 1] < f + ncol) {
      const top = first.length - 1;
      const mc = cols[top] + ncol;
      const mm = cols[top] + m;
      const mnz = nonzeros[top] + nz;
      const dense = mc * mm - (mc * (mc - 1)) / 2;
      const zeros = (dense - mnz) / dense;
      const accept = mc <= RELAX_COLUMNS[0] || (mc <= RELAX_COLUMNS[1] && zeros < RELAX_ZEROS[0]) ||
        (mc <= RELAX_COLUMNS[2] && zeros < RELAX_ZEROS[1]) || zeros < RELAX_ZEROS[2];
      if (!accept) break;
      f = first[top];
      ncol = mc;
      m = mm;
      nz = mnz;
      first.pop();
      cols.pop();
      rows.pop();
      nonzeros.pop();
    }
    first.push(f);
    cols.push(ncol);
    rows.push(m);
    nonzeros.push(nz);
    j = l;
  }
  return [...first, n];
}

/** Elimination tree of P A P^T (parent -1 at roots), with path compression through `ancestor`. */
function eliminationTree(n: number, rowPtr: Int32Array, colIdx: Int32Array, perm: Int32Array, inverse: Int32Array): Int32Array {
  const parent = new Int32Array(n);
  const ancestor = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    parent[k] = -1;
    ancestor[k] = -1;
    const p = perm[k];
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) {
      let i = inverse[colIdx[q]];
      while (i !== -1 && i < k) {
        const next = ancestor[i];
        ancestor[i] = k;
        if (next === -1) {
          parent[i] = k;
          break;
        }
        i = next;
      }
    }
  }
  return parent;
}

/** Postorder of a forest given by parent pointers: post[k] = node visited k-th (children in index order). */
function postorder(parent: Int32Array): Int32Array {
  const n = parent.length;
  const head = new Int32Array(n).fill(-1);
  const next = new Int32Array(n).fill(-1);
  for (let j = n - 1; j >= 0; j--) {
    const p = parent[j];
    if (p !== -1) {
      next[j] = head[p];
      head[p] = j;
    }
  }
  const post = new Int32Array(n);
  const stack = new Int32Array(n);
  let k = 0;
  for (let root = 0; root < n; root++) {
    if (parent[root] !== -1) continue;
    let top = 0;
    stack[0] = root;
    while (top >= 0) {
      const v = stack[top];
      const child = head[v];
      if (child === -1) {
        top--;
        post[k++] = v;
      } else {
        head[v] = next[child];
        stack[++top] = child;
      }
    }
  }
  return post;
}

/** Column counts of L (diagonal included) by walking each row subtree of the elimination tree. */
function columnCounts(
  n: number,
  rowPtr: Int32Array,
  colIdx: Int32Array,
  perm: Int32Array,
  inverse: Int32Array,
  parent: Int32Array,
): Int32Array {
  const counts = new Int32Array(n);
  const mark = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    mark[k] = k;
    counts[k]++;
    const p = perm[k];
    for (let q = rowPtr[p]; q < rowPtr[p + 1]; q++) {
      let i = inverse[colIdx[q]];
      while (i < k && mark[i] !== k) {
        counts[i]++;
        mark[i] = k;
        i = parent[i];
      }
    }
  }
  return counts;
}
