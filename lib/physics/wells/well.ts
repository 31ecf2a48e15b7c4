// The compiled well interface shared by every shape, and the wall tolerance of the strict-inside rule.
// classify() lets unions and differences combine shapes without losing the wall tolerance.
import type { Vec2 } from '../types';

/** A point within this distance (units of L) of a wall counts as wall (PHYSICS.md section 2). */
export const WALL_TOLERANCE = 1e-9;

/** Where a point lies relative to a well: 1 strictly inside, 0 on the wall (within WALL_TOLERANCE), -1 outside. */
export type PointClass = 1 | 0 | -1;

export interface Well {
  /** True when (x, y) lies strictly inside, farther than WALL_TOLERANCE from every wall. */
  contains(x: number, y: number): boolean;
  /** Finer answer used by set operations: inside (1), wall (0) or outside (-1). */
  classify(x: number, y: number): PointClass;
  /** Axis-aligned bounding box (units of L). */
  bbox: { min: Vec2; max: Vec2 };
}

/** Classifies a point from its signed distance to the wall (positive inside). */
export function classifyDistance(d: number): PointClass {
  if (d > WALL_TOLERANCE) return 1;
  if (d >= -WALL_TOLERANCE) return 0;
  return -1;
}

/** Builds a Well from a classifier and a bounding box. */
export function makeWell(classify: (x: number, y: number) => PointClass, bbox: { min: Vec2; max: Vec2 }): Well {
  return { classify, contains: (x, y) => classify(x, y) === 1, bbox };
}

/** Rotates (dx, dy) by -angle (degrees), i.e. into the frame of a shape turned counter-clockwise by `angleDeg`. */
export function toLocalFrame(dx: number, dy: number, angleDeg: number): Vec2 {
  if (angleDeg === 0) return [dx, dy];
  const t = (angleDeg * Math.PI) / 180;
  const c = Math.cos(t);
  const s = Math.sin(t);
  return [c * dx + s * dy, -s * dx + c * dy];
}
