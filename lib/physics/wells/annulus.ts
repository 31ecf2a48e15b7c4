// Annulus well: points between an inner and an outer circle about one centre.
// Signed distance min(r - inner, outer - r).
import type { Vec2 } from '../types';
import { classifyDistance, makeWell, type Well } from './well';

/**
 * @param center - centre (units of L)
 * @param radii - [inner, outer] with 0 < inner < outer
 * @example
 * compileAnnulus([0, 0], [0.5, 1]).contains(0, 0); // false
 */
export function compileAnnulus(center: Vec2, radii: [number, number]): Well {
  const [cx, cy] = center;
  const [inner, outer] = radii;
  return makeWell(
    (x, y) => {
      const r = Math.hypot(x - cx, y - cy);
      return classifyDistance(Math.min(r - inner, outer - r));
    },
    { min: [cx - outer, cy - outer], max: [cx + outer, cy + outer] },
  );
}
