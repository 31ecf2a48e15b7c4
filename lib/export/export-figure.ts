// One call for the export routes: a figure's chart (kind default + stored view spec, chosen units) as SVG, PNG or PDF at a
// journal column width (Vega runs in a limited child process), or its data as CSV, with the content type and a file name.
import { chartSpecFor, ChartDataError } from '@/lib/charts';
import { snapshotFileName } from '@/lib/cite/citation';
import { invalid } from '@/lib/domain-error';
import type { DisplayUnits } from '@/lib/units';
import type { ExportFormat } from './export-query';
import { resultCsv } from './csv';
import { renderSvgInChild } from './render-in-child';
import { pdfFromSvg } from './render-pdf';
import { pngFromSvg } from './render-png';
import { DEFAULT_ASPECT, figureSize, type FigureWidth } from './widths';

export interface ExportFigureInput {
  kind: string;
  /** The result data (diagnostics may be present; CSV leaves them out). */
  result: unknown;
  /** The task spec the result came from (walls, loops, exact levels). */
  params?: unknown;
  viewSpec?: unknown;
  label: string;
  /** Snapshot version for the file name (`<label>-v<version>.<ext>`); omitted for a live run. */
  version?: number | null;
  format: ExportFormat;
  width?: FigureWidth;
  units?: DisplayUnits;
  /**
   * Height over width of the chart's frame (e.g. DEFAULT_ASPECT for the snapshot downloads); omitted, the chart keeps the
   * height of its view spec or kind (maps to scale).
   */
  aspect?: number;
  /** PDF metadata: the document title (default: the label) and creation date (default: a fixed date, reproducible bytes). */
  title?: string;
  createdAt?: Date;
}

export interface ExportedFile {
  body: Buffer | string;
  contentType: string;
  fileName: string;
}

const CONTENT_TYPES: Record<ExportFormat, string> = {
  svg: 'image/svg+xml; charset=utf-8',
  png: 'image/png',
  pdf: 'application/pdf',
  csv: 'text/csv; charset=utf-8; header=present',
};

/**
 * Export a figure. Charts are laid out at the column width in CSS px (8.6 cm = 325 px) so that 10-11 px labels print at
 * 7.5-8 pt, then written as SVG (size in cm), PNG (300 dpi) or vector PDF (page = figure).
 *
 * @example
 * const file = await exportFigure({ kind: 'degeneracy', result, params, label: 'gap-map', version: 2, format: 'pdf' })
 * file.fileName // returns 'gap-map-v2.pdf'
 */
export async function exportFigure(input: ExportFigureInput): Promise<ExportedFile> {
  const width = input.width ?? 'one-column';
  const fileName = input.version ? snapshotFileName(input.label, input.version, input.format) : `${input.label}.${input.format}`;
  if (input.format === 'csv') return { body: resultCsv(input.result), contentType: CONTENT_TYPES.csv, fileName };
  const cssWidth = Math.round(figureSize(width, DEFAULT_ASPECT).width.cssPx);
  const spec = chartSpecOf(input, cssWidth);
  if (input.format === 'svg') {
    const { svg } = await renderSvgInChild(spec, { width });
    return { body: svg, contentType: CONTENT_TYPES.svg, fileName };
  }
  const rendered = await renderSvgInChild(spec);
  if (input.format === 'png') {
    const { png } = pngFromSvg(rendered, { width });
    return { body: png, contentType: CONTENT_TYPES.png, fileName };
  }
  const { pdf } = await pdfFromSvg(rendered, { width, title: input.title ?? input.label, createdAt: input.createdAt });
  return { body: pdf, contentType: CONTENT_TYPES.pdf, fileName };
}

/** The chart spec to export; a stored view spec the schema refuses, or a result the chart cannot use, is `invalid`. */
function chartSpecOf(input: ExportFigureInput, cssWidth: number) {
  try {
    return chartSpecFor(input.kind, input.result, {
      units: input.units ?? { system: 'dimensionless' },
      params: input.params,
      viewSpec: input.viewSpec,
      width: cssWidth,
      height: input.aspect === undefined ? undefined : Math.round(cssWidth * input.aspect),
      fit: true,
    });
  } catch (error) {
    if (error instanceof ChartDataError) throw invalid(`The figure cannot be exported: ${error.message}`);
    throw error;
  }
}
