// The one client component that draws a Vega-Lite chart in the browser (react-vega's VegaEmbed, SVG renderer).
// Specs come from the pure builders in lib/charts with their data inline; nothing else imports the Vega runtime.
'use client';

import { useState } from 'react';
import { VegaEmbed } from 'react-vega';
import type { VisualizationSpec } from 'vega-embed';

export interface VegaChartProps {
  /** A complete Vega-Lite spec with inline data (built by lib/charts). */
  spec: VisualizationSpec;
  /** Accessible description of the chart (read by screen readers). */
  label: string;
  className?: string;
}

/**
 * Renders a Vega-Lite spec as SVG, without the embed action menu. Errors from Vega (a bad edited view spec,
 * for instance) are shown in place instead of breaking the page.
 */
export function VegaChart({ spec, label, className }: VegaChartProps) {
  const [error, setError] = useState<string | null>(null);
  return (
    <figure className={className} data-testid="chart" aria-label={label} role="img">
      {error ? (
        <p role="alert" className="rounded-md border border-red-200 bg-red-50 p-3 text-sm text-red-800">
          The chart could not be drawn: {error}
        </p>
      ) : null}
      <VegaEmbed
        spec={spec}
        options={{ actions: false, renderer: 'svg' }}
        onError={(err) => setError(err instanceof Error ? err.message : String(err))}
        onEmbed={() => setError(null)}
        className="w-full overflow-x-auto"
      />
    </figure>
  );
}
