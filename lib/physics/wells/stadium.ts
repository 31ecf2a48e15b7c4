// Stadium well: a straight part of given length capped by two half disks, turned counter-clockwise by `angle` degrees.
// Signed distance radius - (distance to the central segment).
import type { Vec2 } from '../types';
import { classifyDistance, makeWell, toLocalFrame, type Well } from './well';

/**
 * @param center - centre (units of L)
 * @param length - length of the straight part (>= 0; 0 gives a disk)
 * @param radius - radius of the caps (> 0)
 * @param angleDeg - rotation of the long axis, degrees counter-clockwise
 * @example
 * compileStadium([0, 0], 2, 1, 0).contains(1.9, 0); // true
 */
export function compileStadium(center: Vec2, length: number, radius: number, angleDeg: number): Well {
  const [cx, cy] = center;
  const half = length / 2;
  const t = (angleDeg * Math.PI) / 180;
  const ex = Math.abs(half * Math.cos(t)) + radius;
  const ey = Math.abs(half * Math.sin(t)) + radius;
  return makeWell(
    (x, y) => {
      const [u, v] = toLocalFrame(x - cx, y - cy, angleDeg);
      const du = Math.max(Math.abs(u) - half, 0);
      return classifyDistance(radius - Math.hypot(du, v));
    },
    { min: [cx - ex, cy - ey], max: [cx + ex, cy + ey] },
  );
}
