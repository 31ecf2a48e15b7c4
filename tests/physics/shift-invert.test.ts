// Tests of the shift-invert eigensolver: the closed-form rectangle lattice spectrum, a dense oracle for complex
// Hermitian (generic flux) problems, the half-tube disk, warm starts, the preconditioner and error messages.
import { describe, expect, it } from 'vitest';
import { toDense, csrMatVecColumns } from '@/lib/physics/csr';
import { hermitianEigen } from '@/lib/physics/eigen/dense';
import { LdlPivotError } from '@/lib/physics/eigen/ldl';
import { factorPreconditioner, gershgorinLowerBound, shiftInvertEigenpairs } from '@/lib/physics/eigen/shift-invert';
import { AbortError } from '@/lib/physics/errors';
import { buildHamiltonian } from '@/lib/physics/hamiltonian';
import { buildLattice, snapTube } from '@/lib/physics/lattice';
import { compileWell } from '@/lib/physics/wells';
import type { CsrMatrix, StateBlock } from '@/lib/physics/types';

function disk(h: number, tubes: Array<{ at: [number, number]; alpha: number }>): CsrMatrix {
  const lattice = buildLattice({ well: compileWell({ disk: { center: [0, 0], radius: 1 } }), h });
  return buildHamiltonian(lattice, tubes.map((t) => snapTube(lattice, t.at, t.alpha)));
}

/** Max over columns of |<v_i, v_j> - delta_ij|. */
function orthonormalityError(v: StateBlock): number {
  const { n, k } = v;
  let worst = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      let re = 0;
      let im = 0;
      for (let r = 0; r < n; r++) {
        const ar = v.re[i * n + r];
        const ai = v.im ? v.im[i * n + r] : 0;
        const br = v.re[j * n + r];
        const bi = v.im ? v.im[j * n + r] : 0;
        re += ar * br + ai * bi;
        im += ar * bi - ai * br;
      }
      worst = Math.max(worst, Math.hypot(re - (i === j ? 1 : 0), im));
    }
  }
  return worst;
}

/** ||H v - lambda v|| recomputed independently. */
function residual(h: CsrMatrix, v: StateBlock, j: number, lambda: number): number {
  const n = h.n;
  const xr = v.re.slice(j * n, (j + 1) * n);
  const xi = v.im ? v.im.slice(j * n, (j + 1) * n) : null;
  const yr = new Float64Array(n);
  const yi = xi || h.im ? new Float64Array(n) : null;
  csrMatVecColumns(h, xr, xi, yr, yi, 1);
  let s = 0;
  for (let r = 0; r < n; r++) {
    s += (yr[r] - lambda * xr[r]) ** 2;
    if (yi) s += (yi[r] - lambda * (xi ? xi[r] : 0)) ** 2;
  }
  return Math.sqrt(s);
}

describe('shiftInvertEigenpairs', () => {
  it('reproduces the closed-form lattice spectrum of a rectangle (PHYSICS.md section 2)', () => {
    const h = 1 / 30;
    const lattice = buildLattice({ well: compileWell({ rectangle: { min: [0, 0], max: [1, 0.7] } }), h });
    const H = buildHamiltonian(lattice, []);
    const xs = new Set<number>();
    const ys = new Set<number>();
    for (let u = 0; u < lattice.n; u++) {
      xs.add(lattice.siteOf[u] % lattice.nx);
      ys.add(Math.floor(lattice.siteOf[u] / lattice.nx));
    }
    const nx = xs.size;
    const ny = ys.size;
    expect(nx * ny).toBe(lattice.n);
    // (4/h^2)(sin^2(n pi / (2 (Nx + 1))) + sin^2(m pi / (2 (Ny + 1)))): the 2D Dirichlet lattice Laplacian
    // (separable; each factor is the path-graph spectrum, common practice, see SciPy LaplacianNd).
    const exact: number[] = [];
    for (let a = 1; a <= 6; a++) {
      for (let b = 1; b <= 6; b++) {
        exact.push((4 / h ** 2) * (Math.sin((a * Math.PI) / (2 * (nx + 1))) ** 2 + Math.sin((b * Math.PI) / (2 * (ny + 1))) ** 2));
      }
    }
    exact.sort((x, y) => x - y);
    const result = shiftInvertEigenpairs(H, 6, { seed: 3 });
    expect(result.converged).toBe(true);
    expect(result.method).toBe('shift-invert');
    for (let j = 0; j < 6; j++) {
      expect(Math.abs(result.values[j] - exact[j]) / exact[j]).toBeLessThan(1e-10);
      expect(result.residualNorms[j] / Math.max(1, result.values[j])).toBeLessThanOrEqual(1e-9);
      expect(residual(H, result.vectors, j, result.values[j])).toBeCloseTo(result.residualNorms[j], 8);
    }
    expect(orthonormalityError(result.vectors)).toBeLessThan(1e-10);
  });

  it('matches a dense oracle for a complex Hermitian disk with two generic tubes', () => {
    const H = disk(1 / 9, [
      { at: [0.2, 0.1], alpha: 0.3 },
      { at: [-0.3, -0.2], alpha: 0.17 },
    ]);
    expect(H.im).not.toBeNull();
    const dense = toDense(H);
    const oracle = hermitianEigen(dense.re, dense.im, H.n);
    const result = shiftInvertEigenpairs(H, 5, { seed: 7 });
    expect(result.converged).toBe(true);
    expect(result.vectors.im).not.toBeNull();
    for (let j = 0; j < 5; j++) {
      expect(Math.abs(result.values[j] - oracle.values[j]) / oracle.values[j]).toBeLessThan(1e-10);
      expect(residual(H, result.vectors, j, result.values[j]) / result.values[j]).toBeLessThanOrEqual(1e-9);
    }
    expect(orthonormalityError(result.vectors)).toBeLessThan(1e-10);
  });

  it('finds the exactly doubly degenerate half-tube ground level of the disk near pi^2', () => {
    // A half tube at the centre of an inversion-symmetric well makes every level doubly degenerate (PHYSICS.md
    // section 2); the continuum value is j_{1/2,1}^2 = pi^2 (DLMF 10.16.1). Curved walls converge like h, so at
    // h = 1/40 the lattice level is a few per cent low.
    const H = disk(1 / 40, [{ at: [0, 0], alpha: 0.5 }]);
    expect(H.im).toBeNull();
    const result = shiftInvertEigenpairs(H, 4);
    expect(result.converged).toBe(true);
    expect(Math.abs(result.values[1] - result.values[0]) / result.values[0]).toBeLessThan(1e-10);
    expect(Math.abs(result.values[3] - result.values[2]) / result.values[2]).toBeLessThan(1e-10);
    expect(Math.abs(result.values[0] - Math.PI ** 2) / Math.PI ** 2).toBeLessThan(0.05);
    expect(Math.abs(result.values[2] - 4.493409457909064 ** 2) / 4.493409457909064 ** 2).toBeLessThan(0.05);
  });

  it('converges without expansion from its own answer and faster from a neighbouring configuration', () => {
    const H = disk(1 / 30, [{ at: [0.1, 0.1], alpha: 0.3 }]);
    const cold = shiftInvertEigenpairs(H, 4, { seed: 2 });
    const again = shiftInvertEigenpairs(H, 4, { initial: cold.vectors });
    expect(again.iterations).toBe(0);
    for (let j = 0; j < 4; j++) expect(again.values[j]).toBeCloseTo(cold.values[j], 9);
    // The tube moved one plaquette along x: the cut only changes length, so the states are directly comparable.
    const moved = disk(1 / 30, [{ at: [0.1 + 1 / 30, 0.1], alpha: 0.3 }]);
    const warm = shiftInvertEigenpairs(moved, 4, { initial: cold.vectors });
    const fresh = shiftInvertEigenpairs(moved, 4, { seed: 2 });
    expect(warm.converged).toBe(true);
    expect(warm.iterations).toBeLessThan(fresh.iterations);
    for (let j = 0; j < 4; j++) expect(Math.abs(warm.values[j] - fresh.values[j]) / fresh.values[j]).toBeLessThan(1e-10);
  });

  it('handles k = n, a tiny matrix and a potential that pushes levels below zero', () => {
    const tiny: CsrMatrix = {
      n: 3,
      rowPtr: Int32Array.of(0, 2, 5, 7),
      colIdx: Int32Array.of(0, 1, 0, 1, 2, 1, 2),
      re: Float64Array.of(2, -1, -1, 2, -1, -1, 2),
      im: null,
    };
    const all = shiftInvertEigenpairs(tiny, 3);
    // Path graph: 2 - 2 cos(pi j / 4) (common practice).
    [1, 2, 3].forEach((j, t) => expect(all.values[t]).toBeCloseTo(2 - 2 * Math.cos((Math.PI * j) / 4), 12));

    const H = disk(1 / 12, [{ at: [0, 0], alpha: 0.25 }]);
    const base = shiftInvertEigenpairs(H, 3);
    const lowered: CsrMatrix = { ...H, re: H.re.slice() };
    for (let r = 0; r < H.n; r++) {
      for (let p = H.rowPtr[r]; p < H.rowPtr[r + 1]; p++) if (H.colIdx[p] === r) lowered.re[p] -= 500;
    }
    expect(gershgorinLowerBound(lowered)).toBeLessThan(-400);
    const shifted = shiftInvertEigenpairs(lowered, 3);
    for (let j = 0; j < 3; j++) expect(shifted.values[j]).toBeCloseTo(base.values[j] - 500, 7);
  });

  it('reports progress up to 1 and stops on an aborted signal', () => {
    const H = disk(1 / 20, [{ at: [0, 0], alpha: 0.5 }]);
    const seen: number[] = [];
    shiftInvertEigenpairs(H, 2, { onProgress: (f) => seen.push(f) });
    expect(seen.length).toBeGreaterThan(1);
    expect(seen.every((f, i) => f >= 0 && f <= 1 && (i === 0 || f >= seen[i - 1]))).toBe(true);
    expect(seen[seen.length - 1]).toBe(1);
    const controller = new AbortController();
    controller.abort();
    expect(() => shiftInvertEigenpairs(H, 2, { signal: controller.signal })).toThrow(AbortError);
  });

  it('refuses bad input with clear messages', () => {
    const H = disk(1 / 10, []);
    expect(() => shiftInvertEigenpairs(H, 0)).toThrow('k must be a positive integer, got 0');
    expect(() => shiftInvertEigenpairs(H, H.n + 1)).toThrow(`k = ${H.n + 1} exceeds the number of unknowns n = ${H.n}`);
    expect(() => shiftInvertEigenpairs(H, 2, { tol: 0 })).toThrow('tol must be positive');
    expect(() => shiftInvertEigenpairs(H, 2, { initial: { n: 3, k: 1, re: new Float64Array(3), im: null } })).toThrow(
      `initial has n = 3 rows but the matrix has ${H.n}`,
    );
    // A shift above the ground level is not below the spectrum: the factorisation says so.
    expect(() => shiftInvertEigenpairs(H, 2, { sigma: 10 })).toThrow(LdlPivotError);
    expect(() => shiftInvertEigenpairs(H, 2, { sigma: 10 })).toThrow(/not positive definite/);
  });
});

describe('factorPreconditioner', () => {
  it('applies (A - sigma)^-1 of a real zero-flux matrix to complex residual blocks', () => {
    const H0 = disk(1 / 15, []);
    const precondition = factorPreconditioner(H0);
    const n = H0.n;
    const r: StateBlock = { n, k: 2, re: new Float64Array(2 * n), im: new Float64Array(2 * n) };
    for (let i = 0; i < 2 * n; i++) {
      r.re[i] = Math.sin(i);
      r.im![i] = Math.cos(3 * i);
    }
    const out: StateBlock = { n, k: 2, re: new Float64Array(2 * n), im: new Float64Array(2 * n) };
    precondition(r, out);
    const back = { re: new Float64Array(2 * n), im: new Float64Array(2 * n) };
    csrMatVecColumns(H0, out.re, out.im, back.re, back.im, 2);
    for (let i = 0; i < 2 * n; i++) {
      expect(back.re[i]).toBeCloseTo(r.re[i], 9);
      expect(back.im[i]).toBeCloseTo(r.im![i], 9);
    }
  });
});

describe('shiftInvertEigenpairs at an unreachable tolerance', () => {
  it('stops when rounding stalls the residual and says it did not converge', () => {
    const H = disk(1 / 12, [{ at: [0, 0], alpha: 0.5 }]);
    const result = shiftInvertEigenpairs(H, 2, { tol: 1e-18 });
    expect(result.converged).toBe(false);
    expect(result.iterations).toBeLessThan(30);
    expect(result.residualNorms[0] / result.values[0]).toBeLessThan(1e-11);
  });
});
