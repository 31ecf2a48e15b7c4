// Union and difference of compiled wells, through the inside / wall / outside classes of each part.
// Union takes the best class (like max of signed distances); A minus B is inside A and strictly outside B.
import type { Vec2 } from '../types';
import { makeWell, type PointClass, type Well } from './well';

/**
 * Union: inside when inside any part. Parts that only touch along a shared wall keep that wall (common practice for
 * constructive solid geometry with signed distances).
 * @example
 * compileUnion([compileDisk([0, 0], 1), compileDisk([1.5, 0], 1)]).contains(0.75, 0); // true
 */
export function compileUnion(parts: Well[]): Well {
  const min: Vec2 = [Infinity, Infinity];
  const max: Vec2 = [-Infinity, -Infinity];
  for (const p of parts) {
    min[0] = Math.min(min[0], p.bbox.min[0]);
    min[1] = Math.min(min[1], p.bbox.min[1]);
    max[0] = Math.max(max[0], p.bbox.max[0]);
    max[1] = Math.max(max[1], p.bbox.max[1]);
  }
  return makeWell((x, y) => {
    let best: PointClass = -1;
    for (const p of parts) {
      const c = p.classify(x, y);
      if (c === 1) return 1;
      if (c > best) best = c;
    }
    return best;
  }, { min, max });
}

/**
 * Difference A minus B: a point is inside when strictly inside A and farther than the wall tolerance from B.
 * @example
 * compileDifference(compileDisk([0, 0], 1), compileDisk([0, 0], 0.5)).contains(0, 0); // false
 */
export function compileDifference(a: Well, b: Well): Well {
  return makeWell((x, y) => {
    const ca = a.classify(x, y);
    if (ca === -1) return -1;
    const cb = b.classify(x, y);
    return Math.min(ca, -cb) as PointClass;
  }, { min: [a.bbox.min[0], a.bbox.min[1]], max: [a.bbox.max[0], a.bbox.max[1]] });
}
