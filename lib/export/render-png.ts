// PNG export of a chart: the server SVG rasterised by resvg (the rasteriser ships inside @resvg/resvg-js) with DejaVu Sans
// TTF, at 300 dpi for a journal column width or at a chosen pixel width.
import { Resvg } from '@resvg/resvg-js';
import type { ChartSpec } from '@/lib/charts/common';
import { dejavuFontPath, FONT_FAMILY } from './fonts';
import { type RenderedSvg, renderSvg, widthInCm } from './render-svg';
import { cmToPx, type FigureWidth, PRINT_DPI } from './widths';

export interface RenderPngOptions {
  /** Journal width (8.6 / 17.8 cm) or cm, rasterised at `dpi`; or an exact pixel width. Default: one column. */
  width?: FigureWidth | { cm: number } | { px: number };
  /** Resolution for cm widths. Default 300. */
  dpi?: number;
}

/**
 * Rasterise an SVG string to PNG bytes at a pixel width (height in proportion). Text uses DejaVu Sans only, so the result
 * does not depend on the fonts installed on the machine.
 *
 * @example (await svgToPng(svg, 1016)).subarray(1, 4).toString() // returns 'PNG'
 */
export function svgToPng(svg: string, pixelWidth: number): Buffer {
  if (!Number.isInteger(pixelWidth) || pixelWidth < 1 || pixelWidth > 20000) {
    throw new RangeError(`pixel width must be an integer in 1..20000, got ${pixelWidth}`);
  }
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'width', value: pixelWidth },
    background: 'white',
    font: {
      loadSystemFonts: false,
      fontFiles: [dejavuFontPath('regular'), dejavuFontPath('bold'), dejavuFontPath('italic'), dejavuFontPath('boldItalic')],
      defaultFontFamily: FONT_FAMILY,
      sansSerifFamily: FONT_FAMILY,
    },
  });
  return resvg.render().asPng();
}

/** Pixel width of a PNG width option. */
export function pngPixelWidth(width: RenderPngOptions['width'] = 'one-column', dpi = PRINT_DPI): number {
  if (typeof width === 'object' && 'px' in width) return width.px;
  return cmToPx(widthInCm(width), dpi);
}

/**
 * Render a Vega-Lite spec to PNG bytes.
 *
 * @param spec - a Vega-Lite spec with inline data
 * @param options - width: 'one-column' (8.6 cm -> 1016 px at 300 dpi), 'two-column' (17.8 cm -> 2102 px), { cm } or { px }
 * @returns PNG bytes and the pixel size
 * @example
 * const { png, width } = await renderPng(spec, { width: 'one-column' }) // width === 1016
 */
export async function renderPng(spec: ChartSpec, options: RenderPngOptions = {}): Promise<{ png: Buffer; width: number; height: number }> {
  return pngFromSvg(await renderSvg(spec), options);
}

/** PNG bytes of an already rendered chart SVG (renderSvg or renderSvgInChild, without a physical width). */
export function pngFromSvg(rendered: RenderedSvg, options: RenderPngOptions = {}): { png: Buffer; width: number; height: number } {
  const { svg, width: w, height: h } = rendered;
  const width = pngPixelWidth(options.width, options.dpi ?? PRINT_DPI);
  const png = svgToPng(svg, width);
  return { png, width, height: Math.round((width * h) / w) };
}
