// Axis-aligned rectangle well {min, max}.
// Signed distance to the nearest side.
import type { Vec2 } from '../types';
import { classifyDistance, makeWell, type Well } from './well';

/**
 * @param min - lower-left corner (units of L)
 * @param max - upper-right corner, larger on both axes
 * @example
 * compileRectangle([0, 0], [2, 1]).contains(1, 0.5); // true
 */
export function compileRectangle(min: Vec2, max: Vec2): Well {
  return makeWell((x, y) => classifyDistance(Math.min(x - min[0], max[0] - x, y - min[1], max[1] - y)), {
    min: [min[0], min[1]],
    max: [max[0], max[1]],
  });
}
