// The chart of one figure result: builds the Vega-Lite spec for the figure's kind (lib/charts) in the display units
// in force, applies the figure's edited view spec, and draws it. Shows a readable message when the spec cannot be built.
'use client';

import { useMemo } from 'react';
import type { VisualizationSpec } from 'vega-embed';
import { chartSpecFor } from '@/lib/charts';
import { VegaChart } from '../charts/vega-chart';
import { useDisplayUnits } from './display-units';

export interface FigureChartProps {
  kind: string;
  /** The solver result (stored data, without diagnostics is fine). */
  data: unknown;
  /** The task spec the result came from (well outline, loops, exact overlays). */
  params: unknown;
  viewSpec?: Record<string, unknown> | null;
  height?: number;
  label: string;
}

/** Draws a solver result as the figure kind's chart in the page's display units. */
export function FigureChart({ kind, data, params, viewSpec, height, label }: FigureChartProps) {
  const { units } = useDisplayUnits();
  const built = useMemo(() => {
    try {
      const spec = chartSpecFor(kind as Parameters<typeof chartSpecFor>[0], data as Parameters<typeof chartSpecFor>[1], {
        viewSpec: viewSpec ?? undefined,
        units,
        params,
        ...(height ? { height } : {}),
      });
      return { spec: spec as unknown as VisualizationSpec, error: null };
    } catch (error) {
      return { spec: null, error: error instanceof Error ? error.message : String(error) };
    }
  }, [kind, data, params, viewSpec, units, height]);
  if (!built.spec) {
    return (
      <p role="alert" className="rounded-md border border-red-200 bg-red-50 p-3 text-sm text-red-800">
        This result cannot be drawn: {built.error}
      </p>
    );
  }
  return <VegaChart spec={built.spec} label={label} className="w-full" />;
}
