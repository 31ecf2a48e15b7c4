// Tests of the sparse LDL^T / LDL^H factorisation: solves against dense ml-matrix solves on seeded random SPD and
// HPD matrices, column counts against a dense factor, inertia, pivot errors and pattern checks.
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { analyzeLdl, factorLdl, LdlPivotError, solveLdl } from '@/lib/physics/eigen/ldl';
import { mulberry32 } from '@/lib/physics/random';
import type { CsrMatrix, StateBlock } from '@/lib/physics/types';
import { thrownBy } from '../helpers/thrown';

/** Seeded random sparse Hermitian matrix, diagonally dominant (so positive definite) plus `shift` on the diagonal. */
function randomHermitian(n: number, density: number, complex: boolean, seed: number, shift = 0): CsrMatrix {
  const rng = mulberry32(seed);
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < i; j++) {
      if (rng() >= density) continue;
      const a = rng() - 0.5;
      const b = complex ? rng() - 0.5 : 0;
      re[i * n + j] = a;
      re[j * n + i] = a;
      im[i * n + j] = b;
      im[j * n + i] = -b;
    }
  }
  for (let i = 0; i < n; i++) {
    let sum = 0;
    for (let j = 0; j < n; j++) if (j !== i) sum += Math.hypot(re[i * n + j], im[i * n + j]);
    re[i * n + i] = sum + 0.1 + rng() + shift;
  }
  return toCsr(n, re, complex ? im : null);
}

function toCsr(n: number, re: Float64Array, im: Float64Array | null): CsrMatrix {
  const rowPtr = new Int32Array(n + 1);
  const cols: number[] = [];
  const vr: number[] = [];
  const vi: number[] = [];
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i !== j && re[i * n + j] === 0 && (!im || im[i * n + j] === 0)) continue;
      cols.push(j);
      vr.push(re[i * n + j]);
      vi.push(im ? im[i * n + j] : 0);
    }
    rowPtr[i + 1] = cols.length;
  }
  return { n, rowPtr, colIdx: Int32Array.from(cols), re: Float64Array.from(vr), im: im ? Float64Array.from(vi) : null };
}

/** Dense solve of (A - sigma I) x = b through the real embedding [[A, -B], [B, A]] (ml-matrix LU). */
function denseSolve(a: CsrMatrix, sigma: number, bre: Float64Array, bim: Float64Array): { re: Float64Array; im: Float64Array } {
  const n = a.n;
  const m = Matrix.zeros(2 * n, 2 * n);
  for (let i = 0; i < n; i++) {
    for (let p = a.rowPtr[i]; p < a.rowPtr[i + 1]; p++) {
      const j = a.colIdx[p];
      const r = a.re[p] - (i === j ? sigma : 0);
      const s = a.im ? a.im[p] : 0;
      m.set(i, j, r);
      m.set(i + n, j + n, r);
      m.set(i, j + n, -s);
      m.set(i + n, j, s);
    }
  }
  const rhs = Matrix.columnVector([...bre, ...bim]);
  const x = solve(m, rhs).getColumn(0);
  return { re: Float64Array.from(x.slice(0, n)), im: Float64Array.from(x.slice(n)) };
}

function randomBlock(n: number, k: number, complex: boolean, seed: number): StateBlock {
  const rng = mulberry32(seed);
  return {
    n,
    k,
    re: Float64Array.from({ length: n * k }, () => rng() - 0.5),
    im: complex ? Float64Array.from({ length: n * k }, () => rng() - 0.5) : null,
  };
}

function maxAbsDiff(a: Float64Array, b: Float64Array): number {
  let d = 0;
  for (let i = 0; i < a.length; i++) d = Math.max(d, Math.abs(a[i] - b[i]));
  return d;
}

describe('LDL factorisation', () => {
  it('solves real SPD systems like a dense solve (several sizes, densities and shifts)', () => {
    for (const [n, density, seed, sigma] of [[1, 0, 1, 0], [7, 0.5, 2, 0], [60, 0.08, 3, 0.05], [150, 0.03, 4, -2]] as const) {
      const a = randomHermitian(n, density, false, seed);
      const factor = factorLdl(a, { sigma });
      expect(factor.complex).toBe(false);
      expect(factor.negativePivots).toBe(0);
      const b = randomBlock(n, 3, false, seed + 100);
      const x: StateBlock = { n, k: 3, re: new Float64Array(3 * n), im: null };
      solveLdl(factor, b, x);
      for (let c = 0; c < 3; c++) {
        const ref = denseSolve(a, sigma, b.re.slice(c * n, (c + 1) * n), new Float64Array(n));
        expect(maxAbsDiff(x.re.slice(c * n, (c + 1) * n), ref.re)).toBeLessThan(1e-11);
      }
    }
  });

  it('solves complex Hermitian positive definite systems (LDL^H) like a dense solve', () => {
    for (const [n, density, seed] of [[5, 0.6, 11], [80, 0.06, 12], [200, 0.02, 13]] as const) {
      const a = randomHermitian(n, density, true, seed);
      const factor = factorLdl(a, { sigma: 0.02 });
      expect(factor.complex).toBe(true);
      const b = randomBlock(n, 2, true, seed + 100);
      const x: StateBlock = { n, k: 2, re: new Float64Array(2 * n), im: new Float64Array(2 * n) };
      solveLdl(factor, b, x);
      for (let c = 0; c < 2; c++) {
        const ref = denseSolve(a, 0.02, b.re.slice(c * n, (c + 1) * n), b.im!.slice(c * n, (c + 1) * n));
        expect(maxAbsDiff(x.re.slice(c * n, (c + 1) * n), ref.re)).toBeLessThan(1e-11);
        expect(maxAbsDiff(x.im!.slice(c * n, (c + 1) * n), ref.im)).toBeLessThan(1e-11);
      }
    }
  });

  it('applies a real factor to complex right-hand sides and a complex factor to real ones', () => {
    const n = 40;
    const real = randomHermitian(n, 0.1, false, 21);
    const b = randomBlock(n, 1, true, 22);
    const x: StateBlock = { n, k: 1, re: new Float64Array(n), im: new Float64Array(n) };
    solveLdl(factorLdl(real), b, x);
    const ref = denseSolve(real, 0, b.re, b.im!);
    expect(maxAbsDiff(x.re, ref.re)).toBeLessThan(1e-12);
    expect(maxAbsDiff(x.im!, ref.im)).toBeLessThan(1e-12);

    const herm = randomHermitian(n, 0.1, true, 23);
    const rb = randomBlock(n, 1, false, 24);
    solveLdl(factorLdl(herm), rb, x);
    const ref2 = denseSolve(herm, 0, rb.re, new Float64Array(n));
    expect(maxAbsDiff(x.re, ref2.re)).toBeLessThan(1e-12);
    expect(maxAbsDiff(x.im!, ref2.im)).toBeLessThan(1e-12);
  });

  it('solves blocks wider than one sweep (7 and 13 right-hand sides) column by column like single solves', () => {
    const n = 120;
    const a = randomHermitian(n, 0.04, false, 61);
    const factor = factorLdl(a);
    for (const k of [7, 13]) {
      const b = randomBlock(n, k, false, 62 + k);
      const x: StateBlock = { n, k, re: new Float64Array(k * n), im: null };
      solveLdl(factor, b, x);
      for (let c = 0; c < k; c++) {
        const single: StateBlock = { n, k: 1, re: new Float64Array(n), im: null };
        solveLdl(factor, { n, k: 1, re: b.re.slice(c * n, (c + 1) * n), im: null }, single);
        expect(maxAbsDiff(x.re.slice(c * n, (c + 1) * n), single.re)).toBeLessThan(1e-13);
      }
    }
  });

  it('counts the nonzeros of L exactly (symbolic column counts vs a dense factor of the permuted matrix)', () => {
    const n = 70;
    const a = randomHermitian(n, 0.05, false, 31);
    const symbolic = analyzeLdl(a);
    const { perm } = symbolic;
    // Dense LDL^T of P A P^T; random values give no accidental cancellation.
    const c = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      for (let p = a.rowPtr[perm[i]]; p < a.rowPtr[perm[i] + 1]; p++) c[i * n + symbolic.inverse[a.colIdx[p]]] = a.re[p];
    }
    let nonzeros = 0;
    for (let k = 0; k < n; k++) {
      const d = c[k * n + k];
      nonzeros++;
      for (let i = k + 1; i < n; i++) {
        const l = c[i * n + k] / d;
        if (Math.abs(l) > 1e-15) nonzeros++;
        for (let j = k + 1; j <= i; j++) c[i * n + j] -= l * d * (c[j * n + k] / d);
      }
    }
    expect(symbolic.factorNonzeros).toBe(nonzeros);
    expect(symbolic.storedEntries).toBeGreaterThanOrEqual(nonzeros);
  });

  it('reports the inertia: negative pivots = number of eigenvalues below sigma (Sylvester)', () => {
    // Path Laplacian, eigenvalues 2 - 2 cos(pi j / (n + 1)) (common practice: tridiagonal Toeplitz spectrum).
    const n = 30;
    const rows: number[][] = [];
    const vals: number[][] = [];
    for (let i = 0; i < n; i++) {
      const r: number[] = [];
      const v: number[] = [];
      if (i > 0) (r.push(i - 1), v.push(-1));
      r.push(i), v.push(2);
      if (i < n - 1) (r.push(i + 1), v.push(-1));
      rows.push(r);
      vals.push(v);
    }
    const rowPtr = new Int32Array(n + 1);
    rows.forEach((r, i) => (rowPtr[i + 1] = rowPtr[i] + r.length));
    const a: CsrMatrix = { n, rowPtr, colIdx: Int32Array.from(rows.flat()), re: Float64Array.from(vals.flat()), im: null };
    const sigma = 0.9;
    const below = Array.from({ length: n }, (_, j) => 2 - 2 * Math.cos((Math.PI * (j + 1)) / (n + 1))).filter((e) => e < sigma).length;
    const natural = Int32Array.from({ length: n }, (_, i) => i);
    const factor = factorLdl(a, { sigma, allowIndefinite: true, analyze: { ordering: { perm: natural, inverse: natural } } });
    expect(factor.negativePivots).toBe(below);
    expect(() => factorLdl(a, { sigma })).toThrow(LdlPivotError);
    expect(() => factorLdl(a, { sigma })).toThrow(/not positive definite .*sigma must lie below the lowest eigenvalue/);
    // sigma exactly at the lowest eigenvalue: singular.
    const lowest = 2 - 2 * Math.cos(Math.PI / (n + 1));
    const error = thrownBy(() =>
      factorLdl(a, { sigma: lowest, allowIndefinite: true, analyze: { ordering: { perm: natural, inverse: natural } } }),
    );
    expect(error).toBeInstanceOf(LdlPivotError);
    expect((error as LdlPivotError).kind).toBe('singular');
    expect((error as Error).message).toMatch(/singular to working precision/);
  });

  it('refuses a structurally zero pivot, a mismatched analysis and malformed input', () => {
    const zero: CsrMatrix = { n: 2, rowPtr: Int32Array.of(0, 1, 1), colIdx: Int32Array.of(0), re: Float64Array.of(1), im: null };
    expect(() => factorLdl(zero)).toThrow(/singular/);
    const a = randomHermitian(20, 0.2, false, 41);
    const b = randomHermitian(20, 0.2, false, 42);
    expect(() => factorLdl(b, { symbolic: analyzeLdl(a) })).toThrow('symbolic analysis does not match the sparsity pattern of the matrix');
    expect(() => factorLdl(a, { sigma: Number.NaN })).toThrow('sigma must be a finite number');
    expect(() => factorLdl({ ...a, rowPtr: a.rowPtr.subarray(1) })).toThrow('matrix.rowPtr must have length n + 1');
    const factor = factorLdl(a);
    expect(() => solveLdl(factor, randomBlock(19, 1, false, 1), randomBlock(19, 1, false, 1))).toThrow('right-hand side and output must have n = 20 rows');
    expect(() => solveLdl(factor, randomBlock(20, 1, true, 1), { n: 20, k: 1, re: new Float64Array(20), im: null })).toThrow(
      'output block needs an imaginary part',
    );
  });

  it('is deterministic', () => {
    const a = randomHermitian(90, 0.05, true, 51);
    const f1 = factorLdl(a);
    const f2 = factorLdl(a);
    expect(Array.from(f1.d)).toEqual(Array.from(f2.d));
    expect(Array.from(f1.lre)).toEqual(Array.from(f2.lre));
  });
});
