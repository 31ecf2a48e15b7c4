// Tests of the lattice Hamiltonian: five-point stencil, hermiticity, the cut gauge (plaquette fluxes), the real path,
// and the flux symmetries of Byers & Yang (1961): period 1 in alpha, E(alpha) = E(1 - alpha), tubes adding up.
import { describe, expect, it } from 'vitest';
import { toDense } from '@/lib/physics/csr';
import { hermitianEigen } from '@/lib/physics/eigen/dense';
import { buildHamiltonian, cutFlux, isRealFlux, phaseFactor } from '@/lib/physics/hamiltonian';
import { buildLattice, snapTube } from '@/lib/physics/lattice';
import type { CsrMatrix, Lattice } from '@/lib/physics/types';
import { compileWell } from '@/lib/physics/wells';

const h = 1 / 8;
const disk = buildLattice({ well: compileWell({ disk: { center: [0, 0], radius: 1 } }), h });

function spectrum(H: CsrMatrix): Float64Array {
  const d = toDense(H);
  return hermitianEigen(d.re, d.im, H.n).values;
}

/** Hopping factor t(to <- from) = -h^2 H[to][from] as [re, im]. */
function hop(H: CsrMatrix, to: number, from: number): [number, number] {
  for (let p = H.rowPtr[to]; p < H.rowPtr[to + 1]; p++) {
    if (H.colIdx[p] === from) return [-H.re[p] * h * h, -(H.im ? H.im[p] : 0) * h * h];
  }
  throw new Error('no link');
}

function mul(a: [number, number], b: [number, number]): [number, number] {
  return [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
}

/** Unknown index of global site (I, J), or -1. */
function unknown(lat: Lattice, I: number, J: number): number {
  const i = I - lat.i0;
  const j = J - lat.j0;
  if (i < 0 || j < 0 || i >= lat.nx || j >= lat.ny) return -1;
  return lat.unknownOf[i + lat.nx * j];
}

describe('buildHamiltonian', () => {
  it('has the five-point stencil, sorted columns and a real path', () => {
    const H = buildHamiltonian(disk, []);
    expect(H.im).toBeNull();
    for (let r = 0; r < H.n; r++) {
      for (let p = H.rowPtr[r]; p < H.rowPtr[r + 1]; p++) {
        if (p > H.rowPtr[r]) expect(H.colIdx[p]).toBeGreaterThan(H.colIdx[p - 1]);
        expect(H.re[p]).toBe(H.colIdx[p] === r ? 4 / (h * h) : -1 / (h * h));
      }
    }
    expect(buildHamiltonian(disk, [snapTube(disk, [0.3, 0.2], 0.5)]).im).toBeNull();
    expect(buildHamiltonian(disk, [snapTube(disk, [0.3, 0.2], 0.3)]).im).not.toBeNull();
  });

  it('is Hermitian on the complex path', () => {
    const H = buildHamiltonian(disk, [snapTube(disk, [0.3, 0.2], 0.3), snapTube(disk, [-0.4, 0.2], 0.15)]);
    const { re, im } = toDense(H);
    const n = H.n;
    for (let r = 0; r < n; r++) {
      for (let c = 0; c < n; c++) {
        expect(re[r * n + c]).toBe(re[c * n + r]);
        expect(im![r * n + c] + im![c * n + r]).toBe(0);
      }
    }
  });

  it('puts flux exp(2 pi i alpha) through the tube plaquette and 1 through every other (PHYSICS.md section 2)', () => {
    const alpha = 0.3;
    const tube = snapTube(disk, [0.25, -0.125], alpha);
    const H = buildHamiltonian(disk, [tube]);
    let checked = 0;
    for (let J = disk.j0; J < disk.j0 + disk.ny - 1; J++) {
      for (let I = disk.i0; I < disk.i0 + disk.nx - 1; I++) {
        const s00 = unknown(disk, I, J);
        const s10 = unknown(disk, I + 1, J);
        const s11 = unknown(disk, I + 1, J + 1);
        const s01 = unknown(disk, I, J + 1);
        if (s00 < 0 || s10 < 0 || s11 < 0 || s01 < 0) continue;
        // Counter-clockwise around the plaquette: s00 -> s10 -> s11 -> s01 -> s00.
        const loop = mul(mul(hop(H, s10, s00), hop(H, s11, s10)), mul(hop(H, s01, s11), hop(H, s00, s01)));
        const here = I === tube.plaquette[0] && J === tube.plaquette[1];
        const expected = here ? [Math.cos(2 * Math.PI * alpha), Math.sin(2 * Math.PI * alpha)] : [1, 0];
        expect(loop[0]).toBeCloseTo(expected[0], 14);
        expect(loop[1]).toBeCloseTo(expected[1], 14);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(100);
  });

  it('crosses only the vertical links right of the tube on its row: H[(i, b+1), (i, b)] = -exp(+2 pi i alpha) / h^2', () => {
    const tube = snapTube(disk, [0, 0], 0.25);
    const [a, b] = tube.plaquette;
    expect(cutFlux([tube], a + 1, b)).toBe(0.25);
    expect(cutFlux([tube], a, b)).toBe(0);
    expect(cutFlux([tube], a + 1, b + 1)).toBe(0);
    const H = buildHamiltonian(disk, [tube]);
    const lower = unknown(disk, a + 2, b);
    const upper = unknown(disk, a + 2, b + 1);
    const t = hop(H, upper, lower);
    expect(t[0]).toBeCloseTo(0, 15);
    expect(t[1]).toBeCloseTo(1, 15); // exp(+i pi / 2)
    expect(phaseFactor(0.5)).toEqual([-1, 0]);
  });

  it('isRealFlux: integers and half-integers only', () => {
    expect(isRealFlux([])).toBe(true);
    expect(isRealFlux([0.5, -1.5, 2])).toBe(true);
    expect(isRealFlux([0.5, 0.25])).toBe(false);
  });
});

describe('flux symmetries (Byers & Yang 1961)', () => {
  const at: [number, number] = [0.3, -0.2];
  const values = (alpha: number) => spectrum(buildHamiltonian(disk, [snapTube(disk, at, alpha)]));

  it('alpha and alpha + 1 give the same spectrum', () => {
    const a = values(0.3);
    const b = values(1.3);
    for (let i = 0; i < 10; i++) expect(b[i]).toBeCloseTo(a[i], 9);
  });

  it('E(alpha) = E(1 - alpha) for a tube off the centre (time reversal)', () => {
    const a = values(0.3);
    const b = values(0.7);
    for (let i = 0; i < 10; i++) expect(b[i]).toBeCloseTo(a[i], 9);
  });

  it('two half tubes at one point act as no tube; two tubes add their flux', () => {
    const none = spectrum(buildHamiltonian(disk, []));
    const pair = spectrum(buildHamiltonian(disk, [snapTube(disk, at, 0.5), snapTube(disk, at, 0.5)]));
    for (let i = 0; i < 10; i++) expect(pair[i]).toBeCloseTo(none[i], 9);
    const sum = spectrum(buildHamiltonian(disk, [snapTube(disk, at, 0.2), snapTube(disk, at, 0.1)]));
    const single = values(0.3);
    for (let i = 0; i < 10; i++) expect(sum[i]).toBeCloseTo(single[i], 9);
  });
});

describe('tubes outside the well', () => {
  it('a tube left of a simply connected well (its cut crossing the well) leaves the spectrum unchanged', () => {
    const none = spectrum(buildHamiltonian(disk, []));
    for (const alpha of [0.3, 0.5]) {
      const left = spectrum(buildHamiltonian(disk, [snapTube(disk, [-1.6, 0.1], alpha)]));
      for (let i = 0; i < 8; i++) expect(left[i]).toBeCloseTo(none[i], 9);
    }
  });

  it('a tube in the hole of an annulus shifts the levels (Aharonov & Bohm 1959), with period 1', () => {
    const ring = buildLattice({ well: compileWell({ annulus: { center: [0, 0], radii: [0.4, 1] } }), h });
    const none = spectrum(buildHamiltonian(ring, []));
    const half = spectrum(buildHamiltonian(ring, [snapTube(ring, [0, 0], 0.5)]));
    const whole = spectrum(buildHamiltonian(ring, [snapTube(ring, [0, 0], 1)]));
    expect(half[0] - none[0]).toBeGreaterThan(0.5);
    for (let i = 0; i < 8; i++) expect(whole[i]).toBeCloseTo(none[i], 9);
  });
});
