// Gauge identity of the per-step map G_k (PHYSICS.md section 3): H_{k+1} - G_k H_k G_k^dagger vanishes except on the
// single link the moving tube crosses; checked on every step of loops inside, across and outside the well.
import { describe, expect, it } from 'vitest';
import { applyGaugeMap, fluxPhase, gaugeMapForStep, gaugedOverlap, type GaugeMap } from '@/lib/physics/gauge-map';
import { buildHamiltonian } from '@/lib/physics/hamiltonian';
import { buildLattice, snapTube } from '@/lib/physics/lattice';
import { rasteriseLoop } from '@/lib/physics/loop-path';
import type { CsrMatrix, Lattice, SnappedTube } from '@/lib/physics/types';
import { compileWell } from '@/lib/physics/wells';
import type { LoopSpec } from '@/lib/physics/schemas/common';

function entry(m: CsrMatrix, r: number, c: number): [number, number] {
  for (let p = m.rowPtr[r]; p < m.rowPtr[r + 1]; p++) if (m.colIdx[p] === c) return [m.re[p], m.im ? m.im[p] : 0];
  return [0, 0];
}

/** The unknowns at the two ends of the link crossed when the tube steps between plaquettes (-1 when a wall site). */
function crossedLink(lattice: Lattice, from: [number, number], to: [number, number]): [number, number] {
  const [a, b] = from;
  const [a2, b2] = to;
  const u = (I: number, J: number) => {
    const i = I - lattice.i0;
    const j = J - lattice.j0;
    if (i < 0 || j < 0 || i >= lattice.nx || j >= lattice.ny) return -1;
    return lattice.unknownOf[i + lattice.nx * j];
  };
  if (b2 === b) {
    const col = Math.max(a, a2);
    return [u(col, b), u(col, b + 1)];
  }
  const row = Math.max(b, b2);
  return [u(a, row), u(a + 1, row)];
}

/** Max |H_{k+1} - G H_k G^dagger| over all entries off the crossed link, and the max on it. */
function gaugeDefect(lattice: Lattice, h0: CsrMatrix, h1: CsrMatrix, map: GaugeMap, link: [number, number]): { off: number; on: number } {
  const g = new Float64Array(lattice.n * 2);
  for (let u = 0; u < lattice.n; u++) g[2 * u] = 1;
  for (const s of map.sites) {
    g[2 * s] = map.factor.re;
    g[2 * s + 1] = map.factor.im;
  }
  let off = 0;
  let on = 0;
  for (let r = 0; r < lattice.n; r++) {
    const cols = new Set<number>();
    for (let p = h0.rowPtr[r]; p < h0.rowPtr[r + 1]; p++) cols.add(h0.colIdx[p]);
    for (let p = h1.rowPtr[r]; p < h1.rowPtr[r + 1]; p++) cols.add(h1.colIdx[p]);
    for (const c of cols) {
      const [ar, ai] = entry(h0, r, c);
      // g_r * H * conj(g_c)
      const gr = g[2 * r];
      const gi = g[2 * r + 1];
      const hr = g[2 * c];
      const hi = -g[2 * c + 1];
      const tr = gr * ar - gi * ai;
      const ti = gr * ai + gi * ar;
      const mr = tr * hr - ti * hi;
      const mi = tr * hi + ti * hr;
      const [br, bi] = entry(h1, r, c);
      const d = Math.hypot(br - mr, bi - mi);
      const onLink = (r === link[0] && c === link[1]) || (r === link[1] && c === link[0]);
      if (onLink) on = Math.max(on, d);
      else off = Math.max(off, d);
    }
  }
  return { off, on };
}

function checkLoop(loop: LoopSpec, alpha: number, fixed: SnappedTube[]) {
  const well = compileWell({ disk: { center: [0, 0], radius: 1 } });
  const h = 1 / 16;
  const path = rasteriseLoop(loop, { h, offset: [0, 0] });
  const xs = path.points.map((p) => p[0]);
  const ys = path.points.map((p) => p[1]);
  const lattice = buildLattice({ well, h, cover: [{ min: [Math.min(...xs), Math.min(...ys)], max: [Math.max(...xs), Math.max(...ys)] }] });
  const scale = 1 / (h * h);
  let crossedInside = 0;
  for (let k = 0; k < path.plaquettes.length; k++) {
    const from = path.plaquettes[k];
    const to = path.plaquettes[(k + 1) % path.plaquettes.length];
    const tubeAt = (pq: [number, number]): SnappedTube => {
      const at: [number, number] = [(pq[0] + 1) * h, (pq[1] + 1) * h];
      return { at, alpha, plaquette: pq, requested: at };
    };
    const h0 = buildHamiltonian(lattice, [...fixed, tubeAt(from)]);
    const h1 = buildHamiltonian(lattice, [...fixed, tubeAt(to)]);
    const map = gaugeMapForStep(lattice, { from, to }, alpha);
    const link = crossedLink(lattice, from, to);
    const { off, on } = gaugeDefect(lattice, h0, h1, map, link);
    expect(off).toBeLessThan(1e-12 * scale);
    if (link[0] >= 0 && link[1] >= 0 && Math.abs(alpha - Math.round(alpha)) > 0) {
      // The crossed link carries the flux: its entry changes by |1 - exp(2 pi i alpha)| / h^2.
      expect(on).toBeGreaterThan(1e-3 * scale);
      crossedInside++;
    }
  }
  return crossedInside;
}

describe('gauge map G_k (PHYSICS.md section 3)', () => {
  it('uses exact phases at quarter fluxes and the documented signs', () => {
    expect(fluxPhase(0.5, 1)).toEqual({ re: -1, im: 0 });
    expect(fluxPhase(0.25, -1)).toEqual({ re: 0, im: -1 });
    const z = fluxPhase(0.3, -1);
    expect(z.re).toBeCloseTo(Math.cos(2 * Math.PI * 0.3), 15);
    expect(z.im).toBeCloseTo(-Math.sin(2 * Math.PI * 0.3), 15);
  });

  it('is non-zero only on the crossed link, for every step of a generic-flux loop inside the disk', () => {
    const n = checkLoop({ circle: { center: [0.1, -0.05], radius: 0.45 } }, 0.3, []);
    expect(n).toBeGreaterThan(20);
  });

  it('holds with a fixed tube present, for a polygon loop that leaves the well, at alpha = 0.5 and 0.7', () => {
    const fixed = [snapTube({ h: 1 / 16, offset: [0, 0] }, [0.2, 0.1], 0.5)];
    const loop: LoopSpec = { polygon: [[-1.3, -0.4], [0.6, -1.2], [0.9, 0.9], [-0.5, 1.1]] };
    expect(checkLoop(loop, 0.5, fixed)).toBeGreaterThan(10);
    expect(checkLoop(loop, 0.7, fixed)).toBeGreaterThan(10);
  });

  it('maps states so that the mapped overlap equals the plain overlap of mapped vectors', () => {
    const well = compileWell({ rectangle: { min: [0, 0], max: [1, 1] } });
    const lattice = buildLattice({ well, h: 0.125 });
    const map = gaugeMapForStep(lattice, { from: [2, 3], to: [2, 4] }, 0.3);
    expect(map.sites.length).toBeGreaterThan(0);
    const n = lattice.n;
    const block = { n, k: 1, re: Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1)), im: Float64Array.from({ length: n }, (_, i) => Math.cos(3 * i)) };
    const other = { n, k: 1, re: Float64Array.from({ length: n }, (_, i) => Math.cos(i * 0.7)), im: null };
    // <psi | G^dagger phi> = <G psi | phi>
    const gpsi = applyGaugeMap(map, block);
    const direct = gaugedOverlap(map, block, 0, other, 0);
    const identity = { sites: new Int32Array(0), factor: { re: 1, im: 0 } };
    const viaMapped = gaugedOverlap(identity, gpsi, 0, other, 0);
    expect(direct.re).toBeCloseTo(viaMapped.re, 12);
    expect(direct.im).toBeCloseTo(viaMapped.im, 12);
  });
});
