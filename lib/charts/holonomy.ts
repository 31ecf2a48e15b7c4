// Loop-phase chart: left, the rasterised loop of tube positions over the wall with the fixed tubes, its start and walking
// direction; right, W in the complex plane with the unit circle, W/|W| on it and the phase (or the sign of a half tube).
import { lengthScale } from '@/lib/units';
import {
  baseSpec,
  type ChartOptions,
  type ChartSpec,
  DEFAULT_WIDTH,
  layers,
  LOOP_COLOUR,
  mapAxesFor,
  POINT_COLOUR,
  polylineLayer,
  type SpecPart,
  tidy,
  toDisplayPoint,
  tubeLayer,
  unitsOf,
  withMapAxes,
} from './common';
import { asRecord, ChartDataError, isRecord, point, tubesOf } from './read-result';
import { outlineLayer, outlinesExtent, wellOutlines } from './well-outline';

/** Segments of the unit circle drawn in the complex-plane panel. */
const CIRCLE_POINTS = 120;

/** Phase as a multiple of pi, e.g. "−0.600π". */
export function phaseInPi(phase: number): string {
  const x = phase / Math.PI;
  const text = Math.abs(x) < 5e-13 ? '0' : x.toFixed(3);
  return `${text.replace('-', '−')}π`;
}

/** Direction arrow (a rotated triangle) at the middle of the path, pointing along the walk. */
function directionLayer(path: [number, number][], units: ReturnType<typeof unitsOf>): SpecPart | null {
  if (path.length < 3) return null;
  const k = Math.floor(path.length / 4);
  const a = path[k];
  const b = path[k + 1];
  const [x, y] = toDisplayPoint([(a[0] + b[0]) / 2, (a[1] + b[1]) / 2], units);
  // Triangle-up points to screen up; rotate clockwise by atan2(dx, dy) (screen y runs down, data y up).
  const angle = (Math.atan2(b[0] - a[0], b[1] - a[1]) * 180) / Math.PI;
  return {
    data: { values: [{ x, y, angle: tidy(angle) }] },
    mark: { type: 'point', shape: 'triangle-up', size: 120, filled: true, color: LOOP_COLOUR },
    encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' }, angle: { field: 'angle', type: 'quantitative', scale: null } },
  };
}

/**
 * Vega-Lite spec of a holonomy result (two panels side by side).
 *
 * @param result - `{ holonomy: W/|W| as { re, im }, phase, modulus: |W|, orientation, sign?, residual?, path: [[x, y], …], tubes }`
 * @param options - units, total width; `params` (the holonomy spec) for the wall
 */
export function holonomySpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const r = asRecord(result, 'holonomy result');
  // The solver reports the holonomy W/|W| and the modulus |W| separately.
  const unitW = asRecord(r.holonomy, 'holonomy');
  const ure = Number(unitW.re);
  const uim = Number(unitW.im);
  if (!Number.isFinite(ure) || !Number.isFinite(uim)) throw new ChartDataError('holonomy must have finite re and im');
  const modulus = typeof r.modulus === 'number' ? r.modulus : 1;
  const phase = typeof r.phase === 'number' ? r.phase : Math.atan2(uim, ure);
  const re = ure * modulus;
  const im = uim * modulus;
  const rawPath = r.path;
  if (!Array.isArray(rawPath) || rawPath.length < 2) throw new ChartDataError('holonomy result has no path');
  const path = rawPath.map((p, i) => point(p, `path[${i}]`));
  const units = unitsOf(options);

  // Left panel: the loop over the well.
  let extent = outlinesExtent([path]) ?? { min: [-1, -1], max: [1, 1] };
  const params = options.params;
  if (isRecord(params) && isRecord(params.well)) {
    const wall = outlinesExtent(wellOutlines(params.well as never));
    if (wall) {
      extent = {
        min: [Math.min(extent.min[0], wall.min[0]), Math.min(extent.min[1], wall.min[1])],
        max: [Math.max(extent.max[0], wall.max[0]), Math.max(extent.max[1], wall.max[1])],
      };
    }
  }
  const pad = 0.05 * Math.max(extent.max[0] - extent.min[0], extent.max[1] - extent.min[1]);
  extent = { min: [extent.min[0] - pad, extent.min[1] - pad], max: [extent.max[0] + pad, extent.max[1] + pad] };
  const closedPath = [...path];
  const first = path[0];
  const last = path[path.length - 1];
  if (first[0] !== last[0] || first[1] !== last[1]) closedPath.push(first);
  const [sx, sy] = toDisplayPoint(first, units);
  const total = options.width ?? DEFAULT_WIDTH;
  const panel = Math.max(120, Math.round((total - 40) / 2));
  const axes = mapAxesFor(extent, units);
  const dxSpan = (extent.max[0] - extent.min[0]) * lengthScale(units);
  const dySpan = (extent.max[1] - extent.min[1]) * lengthScale(units);
  const loopPanel = {
    width: panel,
    height: Math.round(panel * Math.min(Math.max(dySpan / dxSpan, 0.4), 2.5)),
    layer: withMapAxes(
      layers(
        outlineLayer(params, units),
        polylineLayer([{ id: 'loop', points: closedPath }], units, { stroke: POINT_COLOUR, strokeWidth: 1.6 }),
        {
          data: { values: [{ x: sx, y: sy, label: 'start' }] },
          mark: { type: 'point', shape: 'circle', size: 50, filled: true, color: POINT_COLOUR },
          encoding: { x: { field: 'x', type: 'quantitative' }, y: { field: 'y', type: 'quantitative' }, tooltip: [{ field: 'label' }] },
        },
        directionLayer(path, units),
        tubeLayer(tubesOf(r), units),
      ),
      axes.x,
      axes.y,
    ),
  };

  // Right panel: W in the complex plane.
  const circle = Array.from({ length: CIRCLE_POINTS + 1 }, (_, k) => {
    const t = (2 * Math.PI * k) / CIRCLE_POINTS;
    return { re: tidy(Math.cos(t)), im: tidy(Math.sin(t)), order: k };
  });
  const unit = { re: ure, im: uim };
  const sign = typeof r.sign === 'number' ? r.sign : null;
  const orientation = typeof r.orientation === 'string' ? r.orientation : null;
  const lines = [
    sign !== null ? `W/|W| = ${sign > 0 ? '+1' : '−1'}` : `arg W = ${phaseInPi(phase)}`,
    `|W| = ${modulus.toPrecision(4)}`,
    ...(typeof r.residual === 'number' ? [`|Im W|/|W| = ${r.residual === 0 ? '0' : r.residual.toExponential(1)}`] : []),
    ...(orientation ? [orientation === 'ccw' ? 'counter-clockwise loop' : 'clockwise loop'] : []),
  ];
  const axis = (title: string) => ({ type: 'quantitative', title, scale: { domain: [-1.25, 1.25], nice: false } });
  const planePanel = {
    width: panel,
    height: panel,
    layer: [
      { data: { values: circle }, mark: { type: 'line', stroke: '#777777', strokeWidth: 1 }, encoding: { x: { field: 're', ...axis('Re W') }, y: { field: 'im', ...axis('Im W') }, order: { field: 'order' } } },
      {
        data: { values: [{ re: 0, im: 0, re2: tidy(unit.re), im2: tidy(unit.im) }] },
        mark: { type: 'rule', stroke: POINT_COLOUR, strokeWidth: 1.2 },
        encoding: { x: { field: 're', ...axis('Re W') }, y: { field: 'im', ...axis('Im W') }, x2: { field: 're2' }, y2: { field: 'im2' } },
      },
      // W as a ring and W/|W| as a filled diamond drawn over it, so both show when |W| = 1.
      ...(
        [
          ['W', { re: tidy(re), im: tidy(im) }, { filled: false, size: 110, strokeWidth: 1.5 }],
          ['W/|W|', { re: tidy(unit.re), im: tidy(unit.im) }, { filled: true, size: 60 }],
        ] as const
      ).map(([what, at, mark]) => ({
        data: { values: [{ ...at, what }] },
        mark: { type: 'point', color: POINT_COLOUR, ...mark },
        encoding: {
          x: { field: 're', ...axis('Re W') },
          y: { field: 'im', ...axis('Im W') },
          shape: { field: 'what', type: 'nominal', title: null, scale: { domain: ['W/|W|', 'W'], range: ['diamond', 'circle'] } },
          tooltip: [{ field: 'what' }, { field: 're', format: '.6f' }, { field: 'im', format: '.6f' }],
        },
      })),
      {
        data: { values: [{}] },
        mark: { type: 'text', align: 'left', baseline: 'top', fontSize: 10, x: 4, y: 4, lineBreak: '\n', lineHeight: 13 },
        encoding: { text: { value: lines.join('\n') } },
      },
    ],
  };
  return baseSpec(options, { hconcat: [loopPanel, planePanel], spacing: 24 }, null);
}
