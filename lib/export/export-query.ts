// The one query of an export request (format, journal width, display units), shared by the export route, the snapshot
// page's download links and exportFigure; plus the URL builder the links use, so every width and format is listed here.
import { z } from 'zod';
import { displayUnitsQuerySchema } from '@/lib/units';
import { FIGURE_WIDTH_CM, type FigureWidth, figureWidthSchema } from './widths';

export const exportFormatSchema = z.enum(['svg', 'png', 'pdf', 'csv'], { error: 'format must be svg, png, pdf or csv' });
export type ExportFormat = z.infer<typeof exportFormatSchema>;

/** The formats that draw the chart (CSV is the data), in the order the download links show them. */
export const CHART_FORMATS = ['svg', 'png', 'pdf'] as const satisfies readonly ExportFormat[];

/** The journal widths in the order the download links show them. */
export const FIGURE_WIDTHS = figureWidthSchema.options;

/** How a width is named on a download link (e.g. "One column, 8.6 cm"). */
export function figureWidthLabel(width: FigureWidth): string {
  return `${width === 'one-column' ? 'One column' : 'Two columns'}, ${FIGURE_WIDTH_CM[width]} cm`;
}

/**
 * Query of an export request (`?format=pdf&width=two-column&units=physical&L=50&mass=0.067`): format (default pdf), journal
 * width (default one column) and display units. Unknown keys are refused; per-field messages on bad input.
 */
export const exportQuerySchema = z
  .object({
    format: exportFormatSchema.default('pdf'),
    width: figureWidthSchema.default('one-column'),
    units: z.string().optional(),
    L: z.string().optional(),
    mass: z.string().optional(),
  })
  .strict()
  .transform((q, ctx) => {
    const units = displayUnitsQuerySchema.safeParse({ units: q.units, L: q.L, mass: q.mass });
    if (!units.success) {
      for (const issue of units.error.issues) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message });
      return z.NEVER;
    }
    return { format: q.format, width: q.width, units: units.data };
  });
export type ExportQuery = z.infer<typeof exportQuerySchema>;

/**
 * The query string of an export request, in the names {@link exportQuerySchema} reads (dimensionless units add nothing).
 *
 * @example exportQueryString({ format: 'svg', width: 'one-column', units: { system: 'dimensionless' } }) // 'format=svg&width=one-column'
 */
export function exportQueryString({ format, width, units }: ExportQuery): string {
  const query = new URLSearchParams({ format, width });
  if (units.system === 'physical') {
    query.set('units', 'physical');
    query.set('L', String(units.lengthNm));
    query.set('mass', String(units.effectiveMass));
  }
  return query.toString();
}
