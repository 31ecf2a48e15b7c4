// Geometry of a solver spec for drawing: bounding boxes of wells (recursive unions and differences), loops,
// regions and paths, plus the overlays a figure kind carries (fixed tubes, moving tube, loop, region, path).
import type { WellSpec } from '@/lib/physics/schemas/common';

export type Point = [number, number];
export interface Box {
  min: Point;
  max: Point;
}

const EMPTY: Box = { min: [Infinity, Infinity], max: [-Infinity, -Infinity] };

function merge(a: Box, b: Box): Box {
  return {
    min: [Math.min(a.min[0], b.min[0]), Math.min(a.min[1], b.min[1])],
    max: [Math.max(a.max[0], b.max[0]), Math.max(a.max[1], b.max[1])],
  };
}

function around(center: Point, halfX: number, halfY: number): Box {
  return { min: [center[0] - halfX, center[1] - halfY], max: [center[0] + halfX, center[1] + halfY] };
}

function ofPoints(points: readonly Point[]): Box {
  return points.reduce<Box>((box, p) => merge(box, { min: p, max: p }), EMPTY);
}

/**
 * The bounding box of a well in units of L (exact for rotated ellipses and stadiums; a difference takes the box
 * of the well it removes from).
 *
 * @example
 * wellBox({ disk: { center: [0, 0], radius: 1 } }); // { min: [-1, -1], max: [1, 1] }
 */
export function wellBox(well: WellSpec): Box {
  if ('disk' in well) return around(well.disk.center, well.disk.radius, well.disk.radius);
  if ('ellipse' in well) {
    const [a, b] = well.ellipse.radii;
    const t = ((well.ellipse.angle ?? 0) * Math.PI) / 180;
    const hx = Math.hypot(a * Math.cos(t), b * Math.sin(t));
    const hy = Math.hypot(a * Math.sin(t), b * Math.cos(t));
    return around(well.ellipse.center, hx, hy);
  }
  if ('rectangle' in well) return { min: well.rectangle.min, max: well.rectangle.max };
  if ('polygon' in well) return ofPoints(well.polygon.points);
  if ('annulus' in well) return around(well.annulus.center, well.annulus.radii[1], well.annulus.radii[1]);
  if ('stadium' in well) {
    const { length, radius } = well.stadium;
    const t = ((well.stadium.angle ?? 0) * Math.PI) / 180;
    return around(well.stadium.center, Math.abs((length / 2) * Math.cos(t)) + radius, Math.abs((length / 2) * Math.sin(t)) + radius);
  }
  if ('mask' in well) return { min: well.mask.extent.min, max: well.mask.extent.max };
  if ('union' in well) return well.union.map(wellBox).reduce(merge, EMPTY);
  return wellBox(well.difference[0]);
}

export type LoopShape = { circle: { center: Point; radius: number } } | { polygon: Point[] };

/** What a spec draws over its well: fixed tubes, the moving tube's loop / region / path, the swept tube. */
export interface SpecOverlay {
  well: WellSpec;
  h: number | null;
  offset: Point;
  tubes: { at: Point; alpha: number }[];
  movingAlpha: number | null;
  loop: LoopShape | null;
  region: Box | null;
  path: { points: Point[]; closed: boolean } | null;
  /** Index of the tube whose flux a flux sweep varies. */
  sweptTube: number | null;
}

type Loose = Record<string, unknown>;
const isObject = (v: unknown): v is Loose => typeof v === 'object' && v !== null && !Array.isArray(v);
const isPoint = (v: unknown): v is Point =>
  Array.isArray(v) && v.length === 2 && v.every((n) => typeof n === 'number' && Number.isFinite(n));

/**
 * Reads the drawable parts of a (possibly half-edited) task spec. Anything missing or malformed is skipped, so a
 * form can draw its current values while the user types. Returns null without a recognisable well.
 */
export function overlayOf(params: unknown): SpecOverlay | null {
  if (!isObject(params)) return null;
  const problem = params.task === 'convergence' && isObject(params.of) ? params.of : params;
  if (!isObject(problem.well) || !isDrawableWell(problem.well)) return null;
  const grid = isObject(problem.grid) ? problem.grid : {};
  const tubes = Array.isArray(problem.tubes)
    ? problem.tubes.flatMap((t) =>
        isObject(t) && isPoint(t.at) && typeof t.alpha === 'number' && Number.isFinite(t.alpha) ? [{ at: t.at, alpha: t.alpha }] : [],
      )
    : [];
  const moving = isObject(params.moving) && typeof params.moving.alpha === 'number' ? params.moving.alpha : null;
  let loop: LoopShape | null = null;
  if (isObject(params.loop)) {
    const c = params.loop.circle;
    if (isObject(c) && isPoint(c.center) && typeof c.radius === 'number' && c.radius > 0) loop = { circle: { center: c.center, radius: c.radius } };
    const p = params.loop.polygon;
    if (Array.isArray(p) && p.length >= 3 && p.every(isPoint)) loop = { polygon: p };
  }
  let region: Box | null = null;
  if (isObject(params.region) && isPoint(params.region.min) && isPoint(params.region.max)) {
    const { min, max } = params.region;
    if (min[0] < max[0] && min[1] < max[1]) region = { min, max };
  }
  let path: SpecOverlay['path'] = null;
  if (isObject(params.path) && Array.isArray(params.path.points) && params.path.points.length >= 2 && params.path.points.every(isPoint)) {
    path = { points: params.path.points, closed: params.path.closed === true };
  }
  const sweptTube = isObject(params.sweep) && typeof params.sweep.tube === 'number' ? params.sweep.tube : null;
  return {
    well: problem.well as WellSpec,
    h: typeof grid.h === 'number' && grid.h > 0 ? grid.h : null,
    offset: isPoint(grid.offset) ? grid.offset : [0, 0],
    tubes,
    movingAlpha: moving,
    loop,
    region,
    path,
    sweptTube,
  };
}

/** True when a well object is complete enough to draw (numbers where numbers are needed). */
export function isDrawableWell(w: unknown): w is WellSpec {
  if (!isObject(w)) return false;
  const keys = Object.keys(w);
  if (keys.length !== 1) return false;
  const v = w[keys[0]];
  const num = (x: unknown) => typeof x === 'number' && Number.isFinite(x);
  const pos = (x: unknown) => num(x) && (x as number) > 0;
  switch (keys[0]) {
    case 'disk':
      return isObject(v) && isPoint(v.center) && pos(v.radius);
    case 'ellipse':
      return isObject(v) && isPoint(v.center) && isPoint(v.radii) && v.radii[0] > 0 && v.radii[1] > 0;
    case 'rectangle':
    case 'mask': {
      const box = keys[0] === 'mask' && isObject(v) ? v.extent : v;
      return isObject(box) && isPoint(box.min) && isPoint(box.max) && box.min[0] < box.max[0] && box.min[1] < box.max[1];
    }
    case 'polygon':
      return isObject(v) && Array.isArray(v.points) && v.points.length >= 3 && v.points.every(isPoint);
    case 'annulus':
      return isObject(v) && isPoint(v.center) && isPoint(v.radii) && v.radii[0] > 0 && v.radii[0] < v.radii[1];
    case 'stadium':
      return isObject(v) && isPoint(v.center) && num(v.length) && (v.length as number) >= 0 && pos(v.radius);
    case 'union':
      return Array.isArray(v) && v.length > 0 && v.every(isDrawableWell);
    case 'difference':
      return Array.isArray(v) && v.length === 2 && v.every(isDrawableWell);
    default:
      return false;
  }
}

/** The box that holds the well and everything drawn over it. */
export function overlayBox(o: SpecOverlay): Box {
  let box = wellBox(o.well);
  box = merge(box, ofPoints(o.tubes.map((t) => t.at)));
  if (o.loop && 'circle' in o.loop) box = merge(box, around(o.loop.circle.center, o.loop.circle.radius, o.loop.circle.radius));
  if (o.loop && 'polygon' in o.loop) box = merge(box, ofPoints(o.loop.polygon));
  if (o.region) box = merge(box, o.region);
  if (o.path) box = merge(box, ofPoints(o.path.points));
  return box;
}

/** Signed area of a closed polygon (positive when counter-clockwise, y up). */
export function signedArea(points: readonly Point[]): number {
  let area = 0;
  for (let i = 0; i < points.length; i++) {
    const [x0, y0] = points[i];
    const [x1, y1] = points[(i + 1) % points.length];
    area += x0 * y1 - x1 * y0;
  }
  return area / 2;
}

/** A "nice" scale-bar length (1, 2 or 5 times a power of ten) not longer than `max`. */
export function niceLength(max: number): number {
  if (!(max > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(max));
  for (const m of [5, 2, 1]) if (m * p <= max) return m * p;
  return p;
}
