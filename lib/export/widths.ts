// Figure widths of physics journals for export: one column about 8.6 cm, two columns about 17.8 cm (common practice for
// two-column journals), with their sizes in points, CSS pixels (96 per inch) and device pixels at 300 dpi.
import { z } from 'zod';

export const CM_PER_INCH = 2.54;
export const PT_PER_INCH = 72;
/** CSS pixels per inch: the unit of Vega's SVG coordinates. */
export const CSS_PX_PER_INCH = 96;
/** Raster resolution of PNG exports (common practice for print). */
export const PRINT_DPI = 300;

/** Height over width of exported figures (a 4:3 landscape frame, common practice). */
export const DEFAULT_ASPECT = 0.75;

export const figureWidthSchema = z.enum(['one-column', 'two-column'], {
  error: 'width must be "one-column" (8.6 cm) or "two-column" (17.8 cm)',
});
export type FigureWidth = z.infer<typeof figureWidthSchema>;

/** Physical widths in centimetres (common practice for single- and double-column physics journals). */
export const FIGURE_WIDTH_CM: Record<FigureWidth, number> = { 'one-column': 8.6, 'two-column': 17.8 };

export interface FigureSize {
  cm: number;
  pt: number;
  cssPx: number;
  px300: number;
}

/** Centimetres to points (1 pt = 1/72 in). @example cmToPt(2.54) // returns 72 */
export function cmToPt(cm: number): number {
  return (cm / CM_PER_INCH) * PT_PER_INCH;
}

/** Centimetres to CSS pixels (1 px = 1/96 in). @example cmToCssPx(2.54) // returns 96 */
export function cmToCssPx(cm: number): number {
  return (cm / CM_PER_INCH) * CSS_PX_PER_INCH;
}

/** Centimetres to device pixels at `dpi` (rounded). @example cmToPx(8.6) // returns 1016 */
export function cmToPx(cm: number, dpi = PRINT_DPI): number {
  return Math.round((cm / CM_PER_INCH) * dpi);
}

/** A length in cm in every unit the exporters need. */
export function sizeOfCm(cm: number): FigureSize {
  return { cm, pt: cmToPt(cm), cssPx: cmToCssPx(cm), px300: cmToPx(cm) };
}

/**
 * Width and height of a figure for a journal column.
 *
 * @param width - 'one-column' (8.6 cm) or 'two-column' (17.8 cm)
 * @param aspect - height / width (default 0.75)
 * @example figureSize('one-column').width.px300 // returns 1016
 */
export function figureSize(width: FigureWidth, aspect = DEFAULT_ASPECT): { width: FigureSize; height: FigureSize } {
  const cm = FIGURE_WIDTH_CM[width];
  return { width: sizeOfCm(cm), height: sizeOfCm(cm * aspect) };
}
