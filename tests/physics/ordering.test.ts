// Tests of the nested-dissection ordering: valid permutations, determinism, fill reduction and bad input.
// Graphs are 5-point lattices (rectangles, the unit disk from the core lattice) and small hand-made graphs.
import { describe, expect, it } from 'vitest';
import { analyzeLdl } from '@/lib/physics/eigen/ldl';
import { isValidOrdering, nestedDissectionOrdering, type GraphPattern } from '@/lib/physics/eigen/ordering';
import { buildLattice } from '@/lib/physics/lattice';
import { buildHamiltonian } from '@/lib/physics/hamiltonian';
import { compileWell } from '@/lib/physics/wells';

/** 5-point grid graph on nx x ny nodes, index i + nx j, with self loops (as a CSR matrix pattern has). */
function gridGraph(nx: number, ny: number): GraphPattern & { x: Int32Array; y: Int32Array } {
  const n = nx * ny;
  const rows: number[][] = [];
  const x = new Int32Array(n);
  const y = new Int32Array(n);
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const v = i + nx * j;
      x[v] = i;
      y[v] = j;
      const row = [v];
      if (i > 0) row.push(v - 1);
      if (i < nx - 1) row.push(v + 1);
      if (j > 0) row.push(v - nx);
      if (j < ny - 1) row.push(v + nx);
      rows.push(row.sort((a, b) => a - b));
    }
  }
  return { ...fromRows(rows), x, y };
}

function fromRows(rows: number[][]): GraphPattern {
  const rowPtr = new Int32Array(rows.length + 1);
  rows.forEach((r, i) => (rowPtr[i + 1] = rowPtr[i] + r.length));
  return { n: rows.length, rowPtr, colIdx: Int32Array.from(rows.flat()) };
}

describe('nestedDissectionOrdering', () => {
  it('returns a valid permutation and its inverse for grids, with and without coordinates', () => {
    for (const [nx, ny] of [[1, 1], [2, 3], [17, 9], [40, 40]]) {
      const g = gridGraph(nx, ny);
      expect(isValidOrdering(nestedDissectionOrdering(g), g.n)).toBe(true);
      expect(isValidOrdering(nestedDissectionOrdering(g, { coordinates: { x: g.x, y: g.y } }), g.n)).toBe(true);
      expect(isValidOrdering(nestedDissectionOrdering(g, { leafSize: 1 }), g.n)).toBe(true);
    }
  });

  it('handles the empty graph, isolated nodes and several components', () => {
    expect(nestedDissectionOrdering({ n: 0, rowPtr: Int32Array.of(0), colIdx: new Int32Array(0) }).perm.length).toBe(0);
    const isolated = fromRows([[], [], [], []]);
    expect(isValidOrdering(nestedDissectionOrdering(isolated, { leafSize: 1 }), 4)).toBe(true);
    // Two separate 30 x 30 grids.
    const a = gridGraph(30, 30);
    const rows: number[][] = [];
    for (let v = 0; v < a.n; v++) rows.push(Array.from(a.colIdx.subarray(a.rowPtr[v], a.rowPtr[v + 1])));
    for (let v = 0; v < a.n; v++) rows.push(Array.from(a.colIdx.subarray(a.rowPtr[v], a.rowPtr[v + 1]), (c) => c + a.n));
    const two = fromRows(rows);
    expect(isValidOrdering(nestedDissectionOrdering(two), two.n)).toBe(true);
  });

  it('is deterministic', () => {
    const g = gridGraph(33, 21);
    expect(Array.from(nestedDissectionOrdering(g).perm)).toEqual(Array.from(nestedDissectionOrdering(g).perm));
  });

  it('reduces the fill of the Cholesky factor of a 60 x 60 lattice well below the natural (band) order', () => {
    // Band order: about n * nx entries; nested dissection: O(n log n) (George 1973).
    const g = gridGraph(60, 60);
    const natural = Int32Array.from({ length: g.n }, (_, i) => i);
    const band = analyzeLdl(g, { ordering: { perm: natural, inverse: natural } }).factorNonzeros;
    const dissection = analyzeLdl(g).factorNonzeros;
    const byLines = analyzeLdl(g, { coordinates: { x: g.x, y: g.y } }).factorNonzeros;
    expect(band).toBeGreaterThan(60 * 59 * 59); // the band fills completely (common practice: profile = bandwidth)
    expect(dissection).toBeLessThan(band / 2);
    expect(byLines).toBeLessThan(band / 2);
  });

  it('orders the unknowns of the unit-disk lattice', () => {
    const lattice = buildLattice({ well: compileWell({ disk: { center: [0, 0], radius: 1 } }), h: 1 / 20 });
    const h = buildHamiltonian(lattice, []);
    expect(isValidOrdering(nestedDissectionOrdering(h), h.n)).toBe(true);
  });

  it('rejects bad input with messages naming the parameter', () => {
    const g = gridGraph(3, 3);
    expect(() => nestedDissectionOrdering({ ...g, rowPtr: g.rowPtr.subarray(0, 5) })).toThrow('graph.rowPtr must have length n + 1 = 10');
    expect(() => nestedDissectionOrdering(g, { leafSize: 0 })).toThrow('leafSize must be a positive integer');
    expect(() => nestedDissectionOrdering(g, { coordinates: { x: [0], y: [0] } })).toThrow('coordinates.x and coordinates.y must have length n = 9');
    expect(() => nestedDissectionOrdering({ n: -1, rowPtr: new Int32Array(0), colIdx: new Int32Array(0) })).toThrow('graph.n must be a non-negative integer');
  });
});
