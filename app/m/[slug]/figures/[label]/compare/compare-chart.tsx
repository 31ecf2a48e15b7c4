// Two snapshot results drawn together in one Vega-Lite chart, in the page's display units: line charts (levels versus
// flux, position or h) are overlaid (v_a solid, v_b dashed) on shared axes; maps are put side by side with shared scales.
'use client';

import { useMemo } from 'react';
import type { VisualizationSpec } from 'vega-embed';
import { chartSpecFor } from '@/lib/charts';
import { VegaChart } from '../../../../../_components/charts/vega-chart';
import { useDisplayUnits } from '../../../../../_components/figures/display-units';

export interface CompareSide {
  version: number;
  kind: string;
  data: unknown;
  params: unknown;
  viewSpec: Record<string, unknown> | null;
}

const TOP_LEVEL_ONLY = ['$schema', 'config', 'autosize', 'background', 'padding'];

/** A view usable inside a concat: top-level-only properties removed, titled with its version. */
function asPanel(spec: Record<string, unknown>, title: string): Record<string, unknown> {
  const panel = Object.fromEntries(Object.entries(spec).filter(([key]) => !TOP_LEVEL_ONLY.includes(key)));
  return { ...panel, title };
}

/** Marks that can be overlaid meaningfully (maps with filled cells cannot). */
const OVERLAY_MARKS = new Set(['line', 'point', 'rule', 'tick', 'circle', 'square', 'trail']);

function markType(layer: Record<string, unknown>): string | null {
  const mark = layer.mark;
  if (typeof mark === 'string') return mark;
  if (mark && typeof mark === 'object' && typeof (mark as { type?: unknown }).type === 'string') return (mark as { type: string }).type;
  return null;
}

/** Both specs are single layered views with top-level data and only line-like marks. */
function overlayable(a: Record<string, unknown>, b: Record<string, unknown>): boolean {
  return [a, b].every(
    (spec) =>
      Array.isArray(spec.layer) &&
      spec.data !== undefined &&
      (spec.layer as Record<string, unknown>[]).every((layer) => {
        const type = markType(layer);
        return type !== null && OVERLAY_MARKS.has(type) && layer.data === undefined && layer.layer === undefined;
      }),
  );
}

/** The layers of one version, with its own data, drawn solid or dashed. */
function versionGroup(spec: Record<string, unknown>, dashed: boolean): Record<string, unknown> {
  return {
    data: spec.data,
    layer: (spec.layer as Record<string, unknown>[]).map((layer) => {
      const mark = typeof layer.mark === 'string' ? { type: layer.mark } : { ...(layer.mark as Record<string, unknown>) };
      return { ...layer, mark: dashed ? { ...mark, strokeDash: [5, 3], opacity: 0.9 } : mark };
    }),
  };
}

/**
 * One spec holding both versions: line charts overlaid (v_a solid, v_b dashed), anything else side by side
 * (`hconcat`) with shared x, y and colour scales.
 *
 * @example combineVersions(specA, specB, 1, 2).hconcat.length // 2
 */
export function combineVersions(a: Record<string, unknown>, b: Record<string, unknown>, va: number, vb: number): Record<string, unknown> {
  if (overlayable(a, b)) {
    const { data: _data, layer: _layer, ...top } = a;
    void _data;
    void _layer;
    return {
      ...top,
      title: { text: `v${va} solid, v${vb} dashed`, fontSize: 11, fontWeight: 'normal' },
      layer: [versionGroup(a, false), versionGroup(b, true)],
    };
  }
  return {
    $schema: a.$schema,
    config: a.config,
    background: 'white',
    padding: 6,
    hconcat: [asPanel(a, `v${va}`), asPanel(b, `v${vb}`)],
    resolve: { scale: { x: 'shared', y: 'shared', color: 'shared' } },
  };
}

export function CompareChart({ a, b }: { a: CompareSide; b: CompareSide }) {
  const { units } = useDisplayUnits();
  const built = useMemo(() => {
    try {
      const specOf = (side: CompareSide, width: number) =>
        chartSpecFor(side.kind, side.data, { viewSpec: side.viewSpec ?? undefined, units, params: side.params, width }) as unknown as Record<
          string,
          unknown
        >;
      // Side by side each chart gets half the room; overlaid, one chart gets all of it.
      const narrow = [specOf(a, 360), specOf(b, 360)] as const;
      const combined = overlayable(narrow[0], narrow[1])
        ? combineVersions(specOf(a, 640), specOf(b, 640), a.version, b.version)
        : combineVersions(narrow[0], narrow[1], a.version, b.version);
      return { spec: combined as unknown as VisualizationSpec, error: null };
    } catch (error) {
      return { spec: null, error: error instanceof Error ? error.message : String(error) };
    }
  }, [a, b, units]);
  if (!built.spec) {
    return (
      <p role="alert" className="rounded-md border border-red-200 bg-red-50 p-3 text-sm text-red-800">
        The two versions cannot be drawn together: {built.error}
      </p>
    );
  }
  return <VegaChart spec={built.spec} label={`Versions ${a.version} and ${b.version} side by side`} />;
}
