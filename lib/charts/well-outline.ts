// Outlines of a well (closed polylines in units of L) from its spec, for drawing the wall over maps and loop figures:
// circles, ellipses, boxes, polygons, annuli, stadiums, the extent of a mask, and every part of a union or difference.
import type { WellSpec } from '@/lib/physics/schemas/common';
import type { DisplayUnits } from '@/lib/units';
import { OUTLINE_COLOUR, polylineLayer, type SpecPart } from './common';

/** A closed polyline (first point repeated at the end). */
export type Outline = [number, number][];

/** Points per full circle (enough for a smooth 8.6 cm figure). */
const CIRCLE_POINTS = 128;

function arc(cx: number, cy: number, rx: number, ry: number, angleDeg: number, from: number, to: number, n: number): Outline {
  const c = Math.cos((angleDeg * Math.PI) / 180);
  const s = Math.sin((angleDeg * Math.PI) / 180);
  const pts: Outline = [];
  for (let k = 0; k <= n; k++) {
    const t = from + ((to - from) * k) / n;
    const u = rx * Math.cos(t);
    const v = ry * Math.sin(t);
    pts.push([cx + c * u - s * v, cy + s * u + c * v]);
  }
  return pts;
}

function closed(points: [number, number][]): Outline {
  const first = points[0];
  const last = points[points.length - 1];
  return first[0] === last[0] && first[1] === last[1] ? points : [...points, [first[0], first[1]]];
}

function box(min: [number, number], max: [number, number]): Outline {
  return [
    [min[0], min[1]],
    [max[0], min[1]],
    [max[0], max[1]],
    [min[0], max[1]],
    [min[0], min[1]],
  ];
}

/**
 * The outlines of a well spec (units of L). Unions and differences give the outlines of all their parts.
 *
 * @example wellOutlines({ rectangle: { min: [0, 0], max: [2, 1] } })[0].length // returns 5
 */
export function wellOutlines(well: WellSpec): Outline[] {
  if ('disk' in well) {
    const { center, radius } = well.disk;
    return [arc(center[0], center[1], radius, radius, 0, 0, 2 * Math.PI, CIRCLE_POINTS)];
  }
  if ('ellipse' in well) {
    const { center, radii, angle } = well.ellipse;
    return [arc(center[0], center[1], radii[0], radii[1], angle ?? 0, 0, 2 * Math.PI, CIRCLE_POINTS)];
  }
  if ('rectangle' in well) return [box(well.rectangle.min as [number, number], well.rectangle.max as [number, number])];
  if ('polygon' in well) return [closed(well.polygon.points.map((p) => [p[0], p[1]] as [number, number]))];
  if ('annulus' in well) {
    const { center, radii } = well.annulus;
    return radii.map((r) => arc(center[0], center[1], r, r, 0, 0, 2 * Math.PI, CIRCLE_POINTS));
  }
  if ('stadium' in well) {
    const { center, length, radius, angle } = well.stadium;
    const a = ((angle ?? 0) * Math.PI) / 180;
    const ex = (Math.cos(a) * length) / 2;
    const ey = (Math.sin(a) * length) / 2;
    const right = arc(center[0] + ex, center[1] + ey, radius, radius, 0, a - Math.PI / 2, a + Math.PI / 2, CIRCLE_POINTS / 2);
    const left = arc(center[0] - ex, center[1] - ey, radius, radius, 0, a + Math.PI / 2, a + (3 * Math.PI) / 2, CIRCLE_POINTS / 2);
    return [closed([...right, ...left])];
  }
  if ('mask' in well) return [box(well.mask.extent.min as [number, number], well.mask.extent.max as [number, number])];
  if ('union' in well) return well.union.flatMap(wellOutlines);
  if ('difference' in well) return well.difference.flatMap(wellOutlines);
  return [];
}

/** Bounding box of a set of outlines, or null when empty. */
export function outlinesExtent(outlines: Outline[]): { min: [number, number]; max: [number, number] } | null {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const o of outlines) {
    for (const [x, y] of o) {
      minX = Math.min(minX, x);
      minY = Math.min(minY, y);
      maxX = Math.max(maxX, x);
      maxY = Math.max(maxY, y);
    }
  }
  return Number.isFinite(minX) ? { min: [minX, minY], max: [maxX, maxY] } : null;
}

/** Vega-Lite layer of the wall outline from a task spec (`params.well`), or null when the spec is unknown. */
export function outlineLayer(params: unknown, units: DisplayUnits): SpecPart | null {
  if (typeof params !== 'object' || params === null || !('well' in params)) return null;
  const well = (params as { well: unknown }).well;
  if (typeof well !== 'object' || well === null) return null;
  const outlines = wellOutlines(well as WellSpec);
  return polylineLayer(
    outlines.map((points, i) => ({ points, id: `wall ${i}` })),
    units,
    { stroke: OUTLINE_COLOUR, strokeWidth: 1, clip: true },
  );
}
