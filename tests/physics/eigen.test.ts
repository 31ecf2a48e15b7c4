// Tests of the eigensolvers: closed-form lattice spectra of rectangles (discrete Dirichlet Laplacian, PHYSICS.md
// section 2), a dense oracle (ml-matrix EVD) against LOBPCG, residuals, orthonormality, degeneracy and input checks.
import { describe, expect, it } from 'vitest';
import { csrMatVecColumns, toDense } from '@/lib/physics/csr';
import { degenerateGroups, fixPhases, lowestEigenpairs } from '@/lib/physics/eigen';
import { chebyshevPreconditioner } from '@/lib/physics/eigen/chebyshev';
import { hermitianEigen, symmetricEigen } from '@/lib/physics/eigen/dense';
import { prepareProblem } from '@/lib/physics/problem';
import type { CsrMatrix, EigenResult } from '@/lib/physics/types';

/** Discrete Dirichlet levels (4/h^2)(sin^2(n pi / 2(Nx+1)) + sin^2(m pi / 2(Ny+1))), ascending (LaplacianNd formula). */
function discreteRectangle(nx: number, ny: number, h: number, count: number): number[] {
  const out: number[] = [];
  for (let a = 1; a <= nx; a++) {
    for (let b = 1; b <= ny; b++) {
      out.push((4 / (h * h)) * (Math.sin((a * Math.PI) / (2 * (nx + 1))) ** 2 + Math.sin((b * Math.PI) / (2 * (ny + 1))) ** 2));
    }
  }
  return out.sort((p, q) => p - q).slice(0, count);
}

function rectangle(h: number, a: number, b: number, offset?: [number, number]) {
  return prepareProblem({ well: { rectangle: { min: [0, 0], max: [a, b] } }, grid: { h, offset }, tubes: [] });
}

/** max_j ||H v_j - lambda_j v_j|| and max |<v_i, v_j> - delta_ij|. */
function quality(H: CsrMatrix, r: EigenResult): { residual: number; orthogonality: number } {
  const { n, k, re, im } = r.vectors;
  const complex = H.im !== null || im !== null;
  const yr = new Float64Array(n * k);
  const yi = complex ? new Float64Array(n * k) : null;
  csrMatVecColumns(H, re, im, yr, yi, k);
  let residual = 0;
  let orthogonality = 0;
  for (let j = 0; j < k; j++) {
    let s = 0;
    for (let u = 0; u < n; u++) {
      s += (yr[j * n + u] - r.values[j] * re[j * n + u]) ** 2;
      if (yi) s += (yi[j * n + u] - r.values[j] * (im ? im[j * n + u] : 0)) ** 2;
    }
    residual = Math.max(residual, Math.sqrt(s));
    for (let l = 0; l < k; l++) {
      let dr = 0;
      let di = 0;
      for (let u = 0; u < n; u++) {
        const ar = re[l * n + u];
        const ai = im ? im[l * n + u] : 0;
        const br = re[j * n + u];
        const bi = im ? im[j * n + u] : 0;
        dr += ar * br + ai * bi;
        di += ar * bi - ai * br;
      }
      orthogonality = Math.max(orthogonality, Math.hypot(dr - (l === j ? 1 : 0), di));
    }
  }
  return { residual, orthogonality };
}

describe('rectangle: closed-form lattice levels', () => {
  it('walls through rows of sites (offset -1/2): levels equal the discrete formula to rounding', () => {
    const h = 0.05;
    const p = rectangle(h, 1, 0.75, [-0.5, -0.5]);
    // Sites at multiples of h: Nx = 1/h - 1 = 19, Ny = 0.75/h - 1 = 14.
    expect(p.lattice.n).toBe(19 * 14);
    const expected = discreteRectangle(19, 14, h, 8);
    for (const method of ['dense', 'lobpcg'] as const) {
      const r = lowestEigenpairs(p.matrix(), 8, { method });
      expect(r.values).toHaveLength(8);
      r.values.forEach((v, i) => expect(Math.abs(v - expected[i]) / expected[i], `${method} level ${i}`).toBeLessThan(1e-11));
    }
  });

  it('default anchoring: walls fall between sites, Nx = a / h unknowns per row', () => {
    const h = 0.05;
    const p = rectangle(h, 1, 0.75);
    expect(p.lattice.n).toBe(20 * 15);
    const expected = discreteRectangle(20, 15, h, 6);
    const r = lowestEigenpairs(p.matrix(), 6, { method: 'lobpcg' });
    expect(r.values).toHaveLength(6);
    r.values.forEach((v, i) => expect(Math.abs(v - expected[i]) / expected[i]).toBeLessThan(1e-11));
  });

  it('approaches pi^2 (n^2 / a^2 + m^2 / b^2) like h^2 when walls pass through sites', () => {
    const exact = Math.PI ** 2 * (1 + 1 / 0.75 ** 2);
    const errors = [0.1, 0.05, 0.025].map((h) => Math.abs(lowestEigenpairs(rectangle(h, 1, 0.75, [-0.5, -0.5]).matrix(), 1).values[0] - exact));
    expect(errors[0] / errors[1]).toBeGreaterThan(3.5);
    expect(errors[1] / errors[2]).toBeGreaterThan(3.5);
    expect(errors[2] / exact).toBeLessThan(2e-3);
  });
});

describe('LOBPCG against the dense oracle', () => {
  const disk = (h: number, tubes: { at: [number, number]; alpha: number }[]) =>
    prepareProblem({ well: { disk: { center: [0, 0], radius: 1 } }, grid: { h }, tubes });

  const cases = [
    { name: 'real, no tube', tubes: [] },
    { name: 'real, half tube off centre', tubes: [{ at: [0.2, 0.1] as [number, number], alpha: 0.5 }] },
    { name: 'complex, two tubes', tubes: [{ at: [0.2, 0.1] as [number, number], alpha: 0.3 }, { at: [-0.3, 0] as [number, number], alpha: 0.15 }] },
  ];
  for (const c of cases) {
    it(c.name, () => {
      const p = disk(1 / 9, c.tubes);
      const H = p.matrix();
      const k = 6;
      const dense = lowestEigenpairs(H, k, { method: 'dense' });
      const iter = lowestEigenpairs(H, k, { method: 'lobpcg', tol: 1e-10 });
      expect(iter.converged).toBe(true);
      for (let i = 0; i < k; i++) expect(Math.abs(iter.values[i] - dense.values[i]) / dense.values[i]).toBeLessThan(1e-12);
      for (const r of [dense, iter]) {
        const q = quality(H, r);
        expect(q.residual).toBeLessThan(1e-8 * Math.max(1, r.values[k - 1]));
        expect(q.orthogonality).toBeLessThan(1e-10);
        expect(r.vectors.im === null).toBe(H.im === null);
      }
      // Unpreconditioned and explicitly preconditioned runs agree too.
      const plain = lowestEigenpairs(H, k, { method: 'lobpcg', preconditioner: null, tol: 1e-10 });
      const cheb = lowestEigenpairs(H, k, { method: 'lobpcg', preconditioner: chebyshevPreconditioner(H, 6), tol: 1e-10 });
      for (let i = 0; i < k; i++) {
        expect(plain.values[i]).toBeCloseTo(dense.values[i], 9);
        expect(cheb.values[i]).toBeCloseTo(dense.values[i], 9);
      }
    });
  }

  it('warm start from the previous states converges in fewer iterations', () => {
    const H = disk(1 / 20, []).matrix();
    const cold = lowestEigenpairs(H, 4, { method: 'lobpcg' });
    const warm = lowestEigenpairs(H, 4, { method: 'lobpcg', initial: cold.vectors });
    expect(warm.iterations).toBeLessThan(cold.iterations);
    for (let i = 0; i < 4; i++) expect(warm.values[i]).toBeCloseTo(cold.values[i], 9);
  });

  it('degenerate levels: the m = +-1 pair of the disk is exactly double (PHYSICS.md section 2)', () => {
    const r = lowestEigenpairs(disk(1 / 20, []).matrix(), 4, { method: 'lobpcg' });
    expect(Math.abs(r.values[2] - r.values[1]) / r.values[1]).toBeLessThan(1e-10);
    expect(degenerateGroups(r.values, 1e-8)).toEqual([[1, 2]]);
  });
});

describe('dense solvers', () => {
  it('symmetric 2 x 2', () => {
    const e = symmetricEigen(new Float64Array([2, 1, 1, 2]), 2);
    expect(e.values[0]).toBeCloseTo(1, 14);
    expect(e.values[1]).toBeCloseTo(3, 14);
  });

  it('Hermitian through the real embedding, with a degenerate pair', () => {
    // [[1, -i, 0], [i, 1, 0], [0, 0, 2]]: eigenvalues 0, 2, 2.
    const re = new Float64Array([1, 0, 0, 0, 1, 0, 0, 0, 2]);
    const im = new Float64Array([0, -1, 0, 1, 0, 0, 0, 0, 0]);
    const e = hermitianEigen(re, im, 3);
    expect(Array.from(e.values).map((v) => Number(v.toFixed(12)))).toEqual([0, 2, 2]);
    // The two vectors of the degenerate level are orthonormal.
    const dot = (a: number, b: number) => {
      let r = 0;
      let i = 0;
      for (let t = 0; t < 3; t++) {
        r += e.vectorsRe[a * 3 + t] * e.vectorsRe[b * 3 + t] + e.vectorsIm![a * 3 + t] * e.vectorsIm![b * 3 + t];
        i += e.vectorsRe[a * 3 + t] * e.vectorsIm![b * 3 + t] - e.vectorsIm![a * 3 + t] * e.vectorsRe[b * 3 + t];
      }
      return Math.hypot(r, i);
    };
    expect(dot(1, 2)).toBeLessThan(1e-12);
    expect(dot(1, 1)).toBeCloseTo(1, 12);
  });

  it('a 1 x 1 lattice', () => {
    const p = prepareProblem({ well: { disk: { center: [0, 0], radius: 0.1 } }, grid: { h: 0.1 }, tubes: [], potential: '3' });
    expect(p.lattice.n).toBe(4);
    const one = prepareProblem({ well: { rectangle: { min: [0, 0], max: [0.1, 0.1] } }, grid: { h: 0.1 }, tubes: [] });
    expect(one.lattice.n).toBe(1);
    const r = lowestEigenpairs(one.matrix(), 1);
    expect(r.values[0]).toBeCloseTo(400, 10);
    expect(Array.from(r.vectors.re)).toEqual([1]);
    expect(toDense(one.matrix()).re[0]).toBeCloseTo(400, 10);
  });
});

describe('input checks and conventions', () => {
  const H = prepareProblem({ well: { rectangle: { min: [0, 0], max: [1, 1] } }, grid: { h: 0.25 }, tubes: [] }).matrix();
  it('k must be 1 <= k <= n', () => {
    expect(() => lowestEigenpairs(H, 17)).toThrow(/1 <= k <= n = 16/);
    expect(() => lowestEigenpairs(H, 0)).toThrow(RangeError);
    expect(() => lowestEigenpairs(H, 1.5)).toThrow(RangeError);
    expect(lowestEigenpairs(H, 16).values.length).toBe(16);
  });

  it('options are checked', () => {
    expect(() => lowestEigenpairs(H, 2, { tol: 0 })).toThrow(/options.tol/);
    expect(() => lowestEigenpairs(H, 2, { maxIter: 0 })).toThrow(/options.maxIter/);
    expect(() => lowestEigenpairs(H, 2, { method: 'magic' as 'dense' })).toThrow(/auto, lobpcg, shift-invert, dense/);
  });

  it('phase convention: largest component real and positive, ties to the lowest index', () => {
    const re = new Float64Array([0.6, -0.8, 0, 0]);
    const im = new Float64Array([0, 0, 0.6, 0.8]);
    fixPhases(2, 2, re, im);
    expect(re[1]).toBeCloseTo(0.8, 15);
    expect(re[3]).toBeCloseTo(0.8, 15);
    expect(im[3]).toBe(0);
    const tie = new Float64Array([-0.5, 0.5]);
    fixPhases(2, 1, tie, null);
    expect(Array.from(tie)).toEqual([0.5, -0.5]);
  });

  it('is deterministic: identical runs give identical bytes', () => {
    const p = prepareProblem({ well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 1 / 20 }, tubes: [{ at: [0.1, 0], alpha: 0.3 }] });
    const a = lowestEigenpairs(p.matrix(), 4, { method: 'lobpcg' });
    const b = lowestEigenpairs(p.matrix(), 4, { method: 'lobpcg' });
    expect(Buffer.from(a.values.buffer).equals(Buffer.from(b.values.buffer))).toBe(true);
    expect(Buffer.from(a.vectors.re.buffer).equals(Buffer.from(b.vectors.re.buffer))).toBe(true);
  });
});
