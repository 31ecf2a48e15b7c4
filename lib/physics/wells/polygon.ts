// Simple-polygon well (either orientation): even-odd point-in-polygon test plus distance to the nearest edge.
// Self-intersecting or degenerate polygons are refused with a SpecError.
import { SpecError } from '../errors';
import type { Vec2 } from '../types';
import { makeWell, WALL_TOLERANCE, type Well } from './well';

/** Above this many edges the O(n^2) self-intersection check is skipped (it would dominate the set-up time). */
const MAX_EDGES_CHECKED = 2000;

function cross(ax: number, ay: number, bx: number, by: number): number {
  return ax * by - ay * bx;
}

/** True when segments p1p2 and p3p4 share a point (collinear overlaps included). */
function segmentsTouch(p1: Vec2, p2: Vec2, p3: Vec2, p4: Vec2): boolean {
  const d1 = cross(p4[0] - p3[0], p4[1] - p3[1], p1[0] - p3[0], p1[1] - p3[1]);
  const d2 = cross(p4[0] - p3[0], p4[1] - p3[1], p2[0] - p3[0], p2[1] - p3[1]);
  const d3 = cross(p2[0] - p1[0], p2[1] - p1[1], p3[0] - p1[0], p3[1] - p1[1]);
  const d4 = cross(p2[0] - p1[0], p2[1] - p1[1], p4[0] - p1[0], p4[1] - p1[1]);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) return true;
  const on = (a: Vec2, b: Vec2, c: Vec2, d: number) =>
    d === 0 && Math.min(a[0], b[0]) <= c[0] && c[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= c[1] && c[1] <= Math.max(a[1], b[1]);
  return on(p3, p4, p1, d1) || on(p3, p4, p2, d2) || on(p1, p2, p3, d3) || on(p1, p2, p4, d4);
}

/** Throws SpecError unless the closed polygon is simple with non-zero area. */
export function assertSimplePolygon(points: Vec2[], path: string): void {
  const n = points.length;
  let area2 = 0;
  for (let i = 0; i < n; i++) {
    const p = points[i];
    const q = points[(i + 1) % n];
    if (p[0] === q[0] && p[1] === q[1]) throw new SpecError(`points ${i} and ${(i + 1) % n} coincide`, path);
    area2 += cross(p[0], p[1], q[0], q[1]);
  }
  if (Math.abs(area2) === 0) throw new SpecError('the polygon has zero area', path);
  if (n > MAX_EDGES_CHECKED) return;
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue; // adjacent through the closing edge
      if (segmentsTouch(points[i], points[(i + 1) % n], points[j], points[(j + 1) % n])) {
        throw new SpecError(`the polygon is not simple: edge ${i} crosses or touches edge ${j}`, path);
      }
    }
  }
}

/** Distance from (x, y) to segment ab. */
function segmentDistance(x: number, y: number, a: Vec2, b: Vec2): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(x - a[0] - t * dx, y - a[1] - t * dy);
}

/**
 * @param points - vertices of a simple polygon, in either orientation (units of L)
 * @param path - spec path used in error messages
 * @throws SpecError for a self-intersecting or zero-area polygon
 * @example
 * compilePolygon([[0, 0], [1, 0], [0, 1]]).contains(0.2, 0.2); // true
 */
export function compilePolygon(points: Vec2[], path = 'polygon.points'): Well {
  assertSimplePolygon(points, path);
  const n = points.length;
  const min: Vec2 = [Infinity, Infinity];
  const max: Vec2 = [-Infinity, -Infinity];
  for (const [x, y] of points) {
    min[0] = Math.min(min[0], x);
    min[1] = Math.min(min[1], y);
    max[0] = Math.max(max[0], x);
    max[1] = Math.max(max[1], y);
  }
  return makeWell(
    (x, y) => {
      if (x < min[0] - WALL_TOLERANCE || x > max[0] + WALL_TOLERANCE || y < min[1] - WALL_TOLERANCE || y > max[1] + WALL_TOLERANCE) return -1;
      let inside = false;
      let dist = Infinity;
      for (let i = 0, j = n - 1; i < n; j = i++) {
        const pi = points[i];
        const pj = points[j];
        if (pi[1] > y !== pj[1] > y && x < ((pj[0] - pi[0]) * (y - pi[1])) / (pj[1] - pi[1]) + pi[0]) inside = !inside;
        dist = Math.min(dist, segmentDistance(x, y, pj, pi));
      }
      if (dist <= WALL_TOLERANCE) return 0;
      return inside ? 1 : -1;
    },
    { min, max },
  );
}
