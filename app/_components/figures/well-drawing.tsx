// A to-scale SVG drawing of a task spec: the well (unions, differences, masks), fixed tubes, the moving tube's
// loop / region / path, the lattice when it is coarse enough to see, and a scale bar. Pure SVG: server or client.
import type { ReactNode } from 'react';
import type { WellSpec } from '@/lib/physics/schemas/common';
import { niceLength, overlayBox, overlayOf, signedArea, type Point } from './well-geometry';

export interface WellDrawingProps {
  /** A task spec (possibly half-edited in a form: malformed parts are skipped). */
  params: unknown;
  /** Prefix for the SVG ids (masks, markers); unique per page. */
  idPrefix: string;
  /** The length unit L in nanometres, to label the scale bar in nm; dimensionless when absent. */
  lengthNm?: number | null;
  className?: string;
}

const VIEW = 320;
const PAD = 22;
const MAX_LATTICE_DOTS = 2500;

/** Draws one well filled with `fill` in world coordinates (y up; the parent group flips y). */
function shape(well: WellSpec, fill: string, id: string): ReactNode {
  if ('disk' in well) return <circle cx={well.disk.center[0]} cy={well.disk.center[1]} r={well.disk.radius} fill={fill} />;
  if ('ellipse' in well) {
    const { center, radii, angle } = well.ellipse;
    return (
      <ellipse
        cx={center[0]}
        cy={center[1]}
        rx={radii[0]}
        ry={radii[1]}
        transform={`rotate(${angle ?? 0} ${center[0]} ${center[1]})`}
        fill={fill}
      />
    );
  }
  if ('rectangle' in well) {
    const { min, max } = well.rectangle;
    return <rect x={min[0]} y={min[1]} width={max[0] - min[0]} height={max[1] - min[1]} fill={fill} />;
  }
  if ('polygon' in well) return <polygon points={well.polygon.points.map((p) => p.join(',')).join(' ')} fill={fill} />;
  if ('annulus' in well) {
    const [cx, cy] = well.annulus.center;
    const [r0, r1] = well.annulus.radii;
    const ring = (r: number) => `M ${cx + r} ${cy} A ${r} ${r} 0 1 0 ${cx - r} ${cy} A ${r} ${r} 0 1 0 ${cx + r} ${cy} Z`;
    return <path d={`${ring(r1)} ${ring(r0)}`} fillRule="evenodd" fill={fill} />;
  }
  if ('stadium' in well) {
    const { center, length, radius: r, angle } = well.stadium;
    const l = length / 2;
    const d = `M ${-l} ${-r} L ${l} ${-r} A ${r} ${r} 0 0 1 ${l} ${r} L ${-l} ${r} A ${r} ${r} 0 0 1 ${-l} ${-r} Z`;
    return <path d={d} transform={`translate(${center[0]} ${center[1]}) rotate(${angle ?? 0})`} fill={fill} />;
  }
  if ('mask' in well) {
    const { min, max } = well.mask.extent;
    return <rect x={min[0]} y={min[1]} width={max[0] - min[0]} height={max[1] - min[1]} fill={fill} opacity={0.6} />;
  }
  if ('union' in well) return <g>{well.union.map((w, i) => <g key={i}>{shape(w, fill, `${id}u${i}`)}</g>)}</g>;
  const [from, remove] = well.difference;
  const maskId = `${id}-d`;
  return (
    <g>
      <mask id={maskId} maskUnits="userSpaceOnUse" x={-1e4} y={-1e4} width={2e4} height={2e4}>
        <rect x={-1e4} y={-1e4} width={2e4} height={2e4} fill="white" />
        {shape(remove, 'black', `${maskId}r`)}
      </mask>
      <g mask={`url(#${maskId})`}>{shape(from, fill, `${maskId}f`)}</g>
    </g>
  );
}

function formatAlpha(alpha: number): string {
  return Number.isInteger(alpha * 2) && Math.abs(alpha) < 10 ? (alpha * 2) % 2 === 0 ? `${alpha}` : `${alpha * 2}/2` : `${+alpha.toFixed(3)}`;
}

/**
 * The well of a spec drawn to scale with its tubes and loops. Coordinates are in units of L (y up).
 *
 * @example
 * <WellDrawing idPrefix="fig-a" params={{ task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.05 } }} />
 */
export function WellDrawing({ params, idPrefix, lengthNm, className }: WellDrawingProps) {
  const o = overlayOf(params);
  if (!o) {
    return (
      <div className={className} data-testid="well-drawing">
        <p className="rounded-md border border-dashed border-slate-300 p-6 text-center text-sm text-slate-500">
          The drawing appears once the well has valid dimensions.
        </p>
      </div>
    );
  }
  const box = overlayBox(o);
  const w = Math.max(box.max[0] - box.min[0], 1e-9);
  const hgt = Math.max(box.max[1] - box.min[1], 1e-9);
  const scale = (VIEW - 2 * PAD) / Math.max(w, hgt);
  const width = w * scale + 2 * PAD;
  const height = hgt * scale + 2 * PAD + 18;
  // world (x, y up) -> screen
  const sx = (x: number) => PAD + (x - box.min[0]) * scale;
  const sy = (y: number) => PAD + (box.max[1] - y) * scale;
  const world = `translate(${PAD - box.min[0] * scale} ${PAD + box.max[1] * scale}) scale(${scale} ${-scale})`;
  const stroke = { vectorEffect: 'non-scaling-stroke' as const };

  const dots: Point[] = [];
  if (o.h && (w / o.h) * (hgt / o.h) <= MAX_LATTICE_DOTS) {
    const h = o.h;
    const i0 = Math.ceil((box.min[0] - h / 2 - o.offset[0] * h) / h);
    const j0 = Math.ceil((box.min[1] - h / 2 - o.offset[1] * h) / h);
    for (let j = j0; (j + 0.5 + o.offset[1]) * h <= box.max[1]; j++) {
      for (let i = i0; (i + 0.5 + o.offset[0]) * h <= box.max[0]; i++) dots.push([(i + 0.5 + o.offset[0]) * h, (j + 0.5 + o.offset[1]) * h]);
    }
  }

  const barLength = niceLength((w * 0.4));
  const barLabel = lengthNm ? `${+(barLength * lengthNm).toPrecision(3)} nm` : `${barLength} L`;
  const loopCcw = o.loop ? ('circle' in o.loop ? true : signedArea(o.loop.polygon) > 0) : true;
  const arrow = `${idPrefix}-arrow`;
  const wellMask = `${idPrefix}-well`;

  return (
    <div className={className} data-testid="well-drawing">
      <svg
        viewBox={`0 0 ${width.toFixed(1)} ${height.toFixed(1)}`}
        className="h-auto w-full max-w-md"
        role="img"
        aria-label={`Drawing of the well to scale with ${o.tubes.length} fixed tube${o.tubes.length === 1 ? '' : 's'}${o.loop ? ' and the loop of the moving tube' : ''}`}
      >
        <defs>
          <marker id={arrow} viewBox="0 0 10 10" refX="6" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
            <path d="M 0 0 L 10 5 L 0 10 z" fill="#b45309" />
          </marker>
          <mask id={wellMask} maskUnits="userSpaceOnUse" x={0} y={0} width={width} height={height}>
            <g transform={world}>{shape(o.well, 'white', `${idPrefix}-m`)}</g>
          </mask>
        </defs>
        <rect x={0} y={0} width={width} height={height} fill="#f8fafc" />
        <rect x={0} y={0} width={width} height={height} fill="#c7d2fe" mask={`url(#${wellMask})`} />
        <g transform={world}>
          {dots.map(([x, y], k) => (
            <circle key={k} cx={x} cy={y} r={Math.min(o.h ?? 0, w) * 0.08} fill="#6366f1" opacity={0.35} />
          ))}
          {o.region ? (
            <rect
              x={o.region.min[0]}
              y={o.region.min[1]}
              width={o.region.max[0] - o.region.min[0]}
              height={o.region.max[1] - o.region.min[1]}
              fill="#f59e0b"
              fillOpacity={0.08}
              stroke="#b45309"
              strokeDasharray="4 3"
              strokeWidth={1.5}
              style={stroke}
            />
          ) : null}
          {o.loop && 'circle' in o.loop ? (
            <circle cx={o.loop.circle.center[0]} cy={o.loop.circle.center[1]} r={o.loop.circle.radius} fill="none" stroke="#b45309" strokeWidth={2} strokeDasharray="6 3" style={stroke} />
          ) : null}
          {o.loop && 'polygon' in o.loop ? (
            <polygon points={o.loop.polygon.map((p) => p.join(',')).join(' ')} fill="none" stroke="#b45309" strokeWidth={2} strokeDasharray="6 3" style={stroke} />
          ) : null}
          {o.path ? (
            <polyline
              points={(o.path.closed ? [...o.path.points, o.path.points[0]] : o.path.points).map((p) => p.join(',')).join(' ')}
              fill="none"
              stroke="#b45309"
              strokeWidth={2}
              markerEnd={`url(#${arrow})`}
              style={stroke}
            />
          ) : null}
        </g>
        {o.loop ? <LoopArrow loop={o.loop} ccw={loopCcw} sx={sx} sy={sy} arrow={arrow} /> : null}
        {o.tubes.map((t, k) => (
          <g key={k} data-testid="tube-marker">
            <circle cx={sx(t.at[0])} cy={sy(t.at[1])} r={6} fill="white" stroke={o.sweptTube === k ? '#b45309' : '#312e81'} strokeWidth={2} />
            <circle cx={sx(t.at[0])} cy={sy(t.at[1])} r={2} fill={o.sweptTube === k ? '#b45309' : '#312e81'} />
            <text x={sx(t.at[0]) + 9} y={sy(t.at[1]) - 7} fontSize={11} fill="#1e293b">
              {o.sweptTube === k ? 'α swept' : `α = ${formatAlpha(t.alpha)}`}
            </text>
          </g>
        ))}
        {o.movingAlpha !== null ? (
          <text x={PAD} y={14} fontSize={11} fill="#b45309">
            moving tube α = {formatAlpha(o.movingAlpha)}
          </text>
        ) : null}
        <g transform={`translate(${PAD} ${height - 14})`}>
          <line x1={0} x2={barLength * scale} y1={0} y2={0} stroke="#1e293b" strokeWidth={2} />
          <line x1={0} x2={0} y1={-4} y2={4} stroke="#1e293b" strokeWidth={1.5} />
          <line x1={barLength * scale} x2={barLength * scale} y1={-4} y2={4} stroke="#1e293b" strokeWidth={1.5} />
          <text x={barLength * scale + 6} y={4} fontSize={11} fill="#1e293b">
            {barLabel}
            {o.h ? `   ·  h = ${o.h} L` : ''}
          </text>
        </g>
      </svg>
    </div>
  );
}

/** An arrowhead on the loop showing its orientation (counter-clockwise or clockwise). */
function LoopArrow({
  loop,
  ccw,
  sx,
  sy,
  arrow,
}: {
  loop: NonNullable<ReturnType<typeof overlayOf>>['loop'];
  ccw: boolean;
  sx: (x: number) => number;
  sy: (y: number) => number;
  arrow: string;
}) {
  if (!loop) return null;
  let a: Point;
  let b: Point;
  if ('circle' in loop) {
    const { center, radius } = loop.circle;
    const t0 = 0.02;
    a = [center[0] + radius * Math.cos(-t0), center[1] + radius * Math.sin(-t0)];
    b = [center[0] + radius * Math.cos(t0), center[1] + radius * Math.sin(t0)];
  } else {
    const [p, q] = loop.polygon;
    a = [p[0] + 0.45 * (q[0] - p[0]), p[1] + 0.45 * (q[1] - p[1])];
    b = [p[0] + 0.55 * (q[0] - p[0]), p[1] + 0.55 * (q[1] - p[1])];
  }
  return (
    <g>
      <line x1={sx(a[0])} y1={sy(a[1])} x2={sx(b[0])} y2={sy(b[1])} stroke="#b45309" strokeWidth={2} markerEnd={`url(#${arrow})`} />
      <title>{ccw ? 'counter-clockwise loop' : 'clockwise loop'}</title>
    </g>
  );
}
