// Ellipse well with semi-axes (a, b) turned counter-clockwise by `angle` degrees.
// Distance to the wall uses the first-order estimate (1 - f) / |grad f| with f = (u/a)^2 + (v/b)^2, exact at the wall.
import type { Vec2 } from '../types';
import { classifyDistance, makeWell, toLocalFrame, type Well } from './well';

/**
 * @param center - centre (units of L)
 * @param radii - semi-axes [a, b] > 0 along the rotated x and y axes
 * @param angleDeg - rotation in degrees, counter-clockwise
 * @example
 * compileEllipse([0, 0], [2, 1], 90).contains(0, 1.5); // true
 */
export function compileEllipse(center: Vec2, radii: [number, number], angleDeg: number): Well {
  const [cx, cy] = center;
  const [a, b] = radii;
  const t = (angleDeg * Math.PI) / 180;
  const hx = Math.hypot(a * Math.cos(t), b * Math.sin(t));
  const hy = Math.hypot(a * Math.sin(t), b * Math.cos(t));
  return makeWell(
    (x, y) => {
      const [u, v] = toLocalFrame(x - cx, y - cy, angleDeg);
      const f = (u / a) ** 2 + (v / b) ** 2;
      const g = 2 * Math.hypot(u / (a * a), v / (b * b));
      // At the centre g = 0 and the point is deep inside.
      return g === 0 ? 1 : classifyDistance((1 - f) / g);
    },
    { min: [cx - hx, cy - hy], max: [cx + hx, cy + hy] },
  );
}
