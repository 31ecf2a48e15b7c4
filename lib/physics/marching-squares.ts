// Nodal lines of a real lattice state as polylines: marching squares in a per-plaquette local gauge, so that the sign
// flip a real state shows ACROSS a branch cut draws no false line, and lines end in the plaquette of a half tube.
import type { Lattice, SnappedTube, Vec2 } from './types';

/** How one end of a nodal line terminates. */
export type NodalLineEnd = { kind: 'tube'; tube: number } | { kind: 'wall' } | { kind: 'closed' };

/** One nodal line: a polyline (units of L) and its two ends. */
export interface NodalLine {
  points: Vec2[];
  ends: [NodalLineEnd, NodalLineEnd];
}

/**
 * Sign (+1 or -1) of the hopping factor on the vertical link from global site (i, b) up to (i, b+1): the product over
 * tubes in row b with i >= a + 1 of exp(2 pi i alpha), which is +-1 for integer and half-integer alpha.
 */
function verticalLinkSign(tubes: readonly SnappedTube[], i: number, b: number): number {
  let s = 1;
  for (const t of tubes) {
    const [a, tb] = t.plaquette;
    if (tb === b && i >= a + 1 && isHalfOdd(t.alpha)) s = -s;
  }
  return s;
}

/** True when alpha is an odd multiple of 1/2. */
function isHalfOdd(alpha: number): boolean {
  const twice = Math.round(2 * alpha);
  return Math.abs(2 * alpha - twice) < 1e-12 && Math.abs(twice % 2) === 1;
}

/**
 * Extracts the zero lines of a real state.
 *
 * Every lattice link decides its own crossing from psi at its two ends, the upper one multiplied by the link's Peierls
 * sign (-1 on a cut link of a half tube), so the decision does not depend on where the cut runs; a crossing sits at the
 * linear-interpolation zero along the link. A plaquette with an odd number of crossings holds a half tube (the state is
 * double-valued around it): each crossing is joined to the tube. Saddles (4 crossings) are resolved by the mean of the
 * corners in the plaquette's local gauge (upper corners flipped where both vertical edges cross a cut). Only plaquettes
 * whose four corners are unknowns are contoured: a line that reaches the wall layer ends there ("wall").
 *
 * @param lattice - the lattice of the state (box indexing x fastest)
 * @param psi - real state on the unknowns (length lattice.n), in the cut gauge of `tubes`
 * @param tubes - the snapped tubes of the problem (every alpha integer or half-integer)
 * @returns polylines with their ends; closed loops have ends [closed, closed]
 * @example
 * const lines = nodalLines(lattice, state, tubes);
 * lines.filter((l) => l.ends.some((e) => e.kind === 'tube')).length; // >= 1 with a half tube inside the well
 */
export function nodalLines(lattice: Lattice, psi: Float64Array, tubes: readonly SnappedTube[]): NodalLine[] {
  const { nx, ny, i0, j0, h, unknownOf } = lattice;
  const [fx, fy] = lattice.offset;
  const value = (i: number, j: number) => psi[unknownOf[i + nx * j]];
  const xy = (i: number, j: number): Vec2 => [(i0 + i + 0.5 + fx) * h, (j0 + j + 0.5 + fy) * h];
  const isUnknown = (i: number, j: number) => i >= 0 && j >= 0 && i < nx && j < ny && unknownOf[i + nx * j] >= 0;

  // Tubes by local plaquette index (for odd cells).
  const tubeAtCell = new Map<number, number>();
  tubes.forEach((t, index) => {
    if (!isHalfOdd(t.alpha)) return;
    const ci = t.plaquette[0] - i0;
    const cj = t.plaquette[1] - j0;
    if (ci < 0 || cj < 0 || ci >= nx || cj >= ny) return;
    const key = ci + nx * cj;
    if (!tubeAtCell.has(key)) tubeAtCell.set(key, index);
  });
  // Vertical link signs per (local column, local row): computed per row from the tubes in that row.
  const vSign = (i: number, j: number) => verticalLinkSign(tubes, i + i0, j + j0);

  const crossingPoint = new Map<number, Vec2>();
  /** Crossing on the link from local site p to q (q = p + unit), with q's value multiplied by sigma. */
  const crossing = (id: number, ip: number, jp: number, iq: number, jq: number, sigma: number): boolean => {
    if (crossingPoint.has(id)) return true;
    const vp = value(ip, jp);
    const vq = sigma * value(iq, jq);
    if (vp >= 0 === vq >= 0) return false;
    const t = vp / (vp - vq);
    const [xp, yp] = xy(ip, jp);
    const [xq, yq] = xy(iq, jq);
    crossingPoint.set(id, [xp + t * (xq - xp), yp + t * (yq - yp)]);
    return true;
  };
  const hId = (i: number, j: number) => 2 * (i + nx * j);
  const vId = (i: number, j: number) => 2 * (i + nx * j) + 1;

  // Segments between nodes: edge crossings (id >= 0) and tube nodes (-(1 + tube index)).
  const segA: number[] = [];
  const segB: number[] = [];
  const tubePoint = new Map<number, Vec2>();
  for (let b = 0; b + 1 < ny; b++) {
    for (let a = 0; a + 1 < nx; a++) {
      if (!isUnknown(a, b) || !isUnknown(a + 1, b) || !isUnknown(a + 1, b + 1) || !isUnknown(a, b + 1)) continue;
      const sl = vSign(a, b);
      const sr = vSign(a + 1, b);
      const edges = [hId(a, b), vId(a + 1, b), hId(a, b + 1), vId(a, b)]; // bottom, right, top, left
      const hit = [
        crossing(edges[0], a, b, a + 1, b, 1),
        crossing(edges[1], a + 1, b, a + 1, b + 1, sr),
        crossing(edges[2], a, b + 1, a + 1, b + 1, 1),
        crossing(edges[3], a, b, a, b + 1, sl),
      ];
      const on = [0, 1, 2, 3].filter((e) => hit[e]);
      if (on.length === 0) continue;
      if (on.length % 2 === 1) {
        const tube = tubeAtCell.get(a + nx * b);
        const node = tube === undefined ? -(1 + tubes.length + a + nx * b) : -(1 + tube);
        const c = xy(a, b);
        tubePoint.set(node, [c[0] + h / 2, c[1] + h / 2]);
        for (const e of on) {
          segA.push(edges[e]);
          segB.push(node);
        }
        continue;
      }
      if (on.length === 2) {
        segA.push(edges[on[0]]);
        segB.push(edges[on[1]]);
        continue;
      }
      // Saddle: corner values in the local gauge (upper corners times the common vertical-link sign).
      const w = [value(a, b), value(a + 1, b), sr * value(a + 1, b + 1), sl * value(a, b + 1)];
      const centre = (w[0] + w[1] + w[2] + w[3]) / 4;
      // A corner whose sign differs from the centre is cut off by a segment joining its two edges.
      const cornerEdges = [
        [0, 3],
        [0, 1],
        [1, 2],
        [2, 3],
      ];
      for (let c = 0; c < 4; c++) {
        if (w[c] >= 0 !== centre >= 0) {
          segA.push(edges[cornerEdges[c][0]]);
          segB.push(edges[cornerEdges[c][1]]);
        }
      }
    }
  }
  return stitch(segA, segB, crossingPoint, tubePoint, tubes.length);
}

/** Joins segments into polylines; tube nodes are always line ends. */
function stitch(
  segA: number[],
  segB: number[],
  crossingPoint: Map<number, Vec2>,
  tubePoint: Map<number, Vec2>,
  tubeCount: number,
): NodalLine[] {
  const adjacency = new Map<number, number[]>();
  const link = (node: number, seg: number) => {
    const list = adjacency.get(node);
    if (list) list.push(seg);
    else adjacency.set(node, [seg]);
  };
  for (let s = 0; s < segA.length; s++) {
    link(segA[s], s);
    link(segB[s], s);
  }
  const used = new Uint8Array(segA.length);
  const point = (node: number): Vec2 => (node >= 0 ? crossingPoint.get(node)! : tubePoint.get(node)!);
  const endOf = (node: number, degree: number): NodalLineEnd => {
    if (node < 0) {
      const tube = -node - 1;
      return tube < tubeCount ? { kind: 'tube', tube } : { kind: 'wall' };
    }
    return degree === 1 ? { kind: 'wall' } : { kind: 'closed' };
  };
  const isTerminal = (node: number) => node < 0 || (adjacency.get(node)?.length ?? 0) !== 2;

  const walk = (startNode: number, firstSeg: number): { nodes: number[]; closed: boolean } => {
    const nodes = [startNode];
    let node = startNode;
    let seg = firstSeg;
    for (;;) {
      used[seg] = 1;
      const other = segA[seg] === node ? segB[seg] : segA[seg];
      nodes.push(other);
      if (other === startNode) return { nodes, closed: true };
      if (isTerminal(other)) return { nodes, closed: false };
      const nextSeg = adjacency.get(other)!.find((s) => !used[s]);
      if (nextSeg === undefined) return { nodes, closed: false };
      node = other;
      seg = nextSeg;
    }
  };

  const lines: NodalLine[] = [];
  // Open lines first, from every terminal node in a deterministic order.
  const terminals = [...adjacency.keys()].filter(isTerminal).sort((x, y) => x - y);
  for (const start of terminals) {
    for (const seg of adjacency.get(start)!) {
      if (used[seg]) continue;
      const { nodes } = walk(start, seg);
      const last = nodes[nodes.length - 1];
      lines.push({
        points: nodes.map(point),
        ends: [endOf(start, adjacency.get(start)!.length), endOf(last, adjacency.get(last)!.length)],
      });
    }
  }
  // Remaining segments form closed loops.
  for (let s = 0; s < segA.length; s++) {
    if (used[s]) continue;
    const { nodes } = walk(segA[s], s);
    lines.push({ points: nodes.map(point), ends: [{ kind: 'closed' }, { kind: 'closed' }] });
  }
  return lines;
}
