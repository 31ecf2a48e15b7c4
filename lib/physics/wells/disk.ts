// Disk well: points closer to the centre than the radius (minus the wall tolerance).
// Signed distance r - |p - c|.
import type { Vec2 } from '../types';
import { classifyDistance, makeWell, type Well } from './well';

/**
 * @param center - centre (units of L)
 * @param radius - radius > 0 (units of L)
 * @example
 * compileDisk([0, 0], 1).contains(0.5, 0); // true
 */
export function compileDisk(center: Vec2, radius: number): Well {
  const [cx, cy] = center;
  return makeWell((x, y) => classifyDistance(radius - Math.hypot(x - cx, y - cy)), {
    min: [cx - radius, cy - radius],
    max: [cx + radius, cy + radius],
  });
}
