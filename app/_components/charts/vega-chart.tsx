// The one client component that draws a Vega-Lite chart in the browser (react-vega's VegaEmbed, SVG renderer), evaluating
// expressions with Vega's interpreter (no generated code, so the CSP needs no unsafe-eval). Nothing else imports Vega here.
'use client';

import { useMemo, useState } from 'react';
import { VegaEmbed } from 'react-vega';
import type { EmbedOptions, VisualizationSpec } from 'vega-embed';
import { expressionInterpreter } from 'vega-interpreter';

export interface VegaChartProps {
  /** A complete Vega-Lite spec with inline data (built by lib/charts). */
  spec: VisualizationSpec;
  /** Accessible description of the chart (read by screen readers). */
  label: string;
  className?: string;
}

/**
 * Embed options fixed by the app: the AST interpreter instead of compiled expressions, no action menu, and no injected
 * default stylesheet (the menu is off, and the CSP does not need to admit it).
 */
const EMBED_OPTIONS: EmbedOptions = {
  ast: true,
  expr: expressionInterpreter,
  actions: false,
  renderer: 'svg',
  defaultStyle: false,
};

/**
 * The spec without `usermeta.embedOptions`: vega-embed would let those override ours (loaders, expression evaluation), and
 * view specs are stored user input.
 */
export function withoutEmbedOptions(spec: VisualizationSpec): VisualizationSpec {
  const usermeta = (spec as { usermeta?: unknown }).usermeta;
  if (!usermeta || typeof usermeta !== 'object' || !('embedOptions' in usermeta)) return spec;
  const { embedOptions: _ignored, ...rest } = usermeta as Record<string, unknown>;
  return { ...spec, usermeta: rest } as VisualizationSpec;
}

/**
 * Renders a Vega-Lite spec as SVG, without the embed action menu. Errors from Vega (a bad edited view spec,
 * for instance) are shown in place instead of breaking the page.
 */
export function VegaChart({ spec, label, className }: VegaChartProps) {
  const [error, setError] = useState<string | null>(null);
  const safeSpec = useMemo(() => withoutEmbedOptions(spec), [spec]);
  return (
    <figure className={className} data-testid="chart" aria-label={label} role="img">
      {error ? (
        <p role="alert" className="rounded-md border border-red-200 bg-red-50 p-3 text-sm text-red-800">
          The chart could not be drawn: {error}
        </p>
      ) : null}
      <VegaEmbed
        spec={safeSpec}
        options={EMBED_OPTIONS}
        onError={(err) => setError(err instanceof Error ? err.message : String(err))}
        onEmbed={() => setError(null)}
        className="w-full overflow-x-auto"
      />
    </figure>
  );
}
