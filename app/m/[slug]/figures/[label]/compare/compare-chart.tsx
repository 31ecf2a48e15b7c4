// Two snapshot results drawn together in one Vega-Lite chart: the kind's chart for each version side by side with
// SHARED x, y and colour scales (so equal values sit at equal places), in the page's display units.
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

/**
 * One spec holding both versions: `hconcat` of the two charts with shared scales.
 *
 * @example combineVersions(specA, specB, 1, 2).hconcat.length // 2
 */
export function combineVersions(a: Record<string, unknown>, b: Record<string, unknown>, va: number, vb: number): Record<string, unknown> {
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
      const specOf = (side: CompareSide) =>
        chartSpecFor(side.kind as Parameters<typeof chartSpecFor>[0], side.data as Parameters<typeof chartSpecFor>[1], {
          viewSpec: side.viewSpec ?? undefined,
          units,
          params: side.params,
          width: 360,
        }) as unknown as Record<string, unknown>;
      return { spec: combineVersions(specOf(a), specOf(b), a.version, b.version) as unknown as VisualizationSpec, error: null };
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
