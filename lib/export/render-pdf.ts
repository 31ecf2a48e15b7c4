// PDF export of a chart as VECTOR graphics: the server SVG drawn into a PDFKit page by svg-to-pdfkit, with DejaVu Sans
// embedded (subset) so the file prints the same everywhere. The page is exactly the figure (journal width, height in proportion).
import PDFDocument from 'pdfkit';
import SVGtoPDF from 'svg-to-pdfkit';
import type { ChartSpec } from '@/lib/charts/common';
import { dejavuFontPath, FONT_FAMILY } from './fonts';
import { type RenderedSvg, renderSvg, widthInCm } from './render-svg';
import { cmToPt, type FigureWidth } from './widths';

export interface RenderPdfOptions {
  /** Journal width (8.6 / 17.8 cm) or cm. Default one column. */
  width?: FigureWidth | { cm: number };
  /** Document title (metadata). */
  title?: string;
  /** Creation date written in the metadata; fixed by default so the same chart gives the same bytes. */
  createdAt?: Date;
}

/** Fixed metadata date used when none is given (keeps exports byte-for-byte reproducible). */
const FIXED_DATE = new Date('2000-01-01T00:00:00Z');

const FONT_NAMES = {
  regular: `${FONT_FAMILY}`,
  bold: `${FONT_FAMILY} Bold`,
  italic: `${FONT_FAMILY} Oblique`,
  boldItalic: `${FONT_FAMILY} Bold Oblique`,
} as const;

/**
 * PDFKit refuses dash patterns with a zero length, which SVG allows ("1,0" is a solid line, as Vega writes for solid
 * legend symbols). Such patterns draw solid, so the attribute is dropped.
 */
export function solidifyZeroDashes(svg: string): string {
  return svg.replace(/\sstroke-dasharray="([^"]*)"/g, (attr, value: string) => {
    const parts = value.split(/[\s,]+/).filter(Boolean).map(Number);
    return parts.length === 0 || parts.some((p) => !(p > 0)) ? '' : attr;
  });
}

/**
 * Draw an SVG string on a PDF page of the given size in points and return the PDF bytes.
 *
 * @param svg - SVG document (CSS px units; scaled to fit the page)
 * @param size - page width and height in pt
 */
export function svgToPdf(svg: string, size: { width: number; height: number }, meta: { title?: string; createdAt?: Date } = {}): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const date = meta.createdAt ?? FIXED_DATE;
    const doc = new PDFDocument({
      size: [size.width, size.height],
      margin: 0,
      compress: true,
      info: { Title: meta.title ?? 'Fluxfolio figure', Creator: 'Fluxfolio', Producer: 'Fluxfolio', CreationDate: date, ModDate: date },
    });
    const chunks: Buffer[] = [];
    doc.on('data', (c: Buffer) => chunks.push(c));
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
    doc.registerFont(FONT_NAMES.regular, dejavuFontPath('regular'));
    doc.registerFont(FONT_NAMES.bold, dejavuFontPath('bold'));
    doc.registerFont(FONT_NAMES.italic, dejavuFontPath('italic'));
    doc.registerFont(FONT_NAMES.boldItalic, dejavuFontPath('boldItalic'));
    try {
      SVGtoPDF(doc, solidifyZeroDashes(svg), 0, 0, {
        width: size.width,
        height: size.height,
        preserveAspectRatio: 'xMidYMid meet',
        // Every family maps to the embedded DejaVu Sans face of the right weight and slant.
        fontCallback: (_family: string, bold: boolean, italic: boolean) =>
          bold && italic ? FONT_NAMES.boldItalic : bold ? FONT_NAMES.bold : italic ? FONT_NAMES.italic : FONT_NAMES.regular,
      });
      doc.end();
    } catch (error) {
      reject(error);
    }
  });
}

/**
 * Render a Vega-Lite spec to a one-page vector PDF whose page is the figure at a journal width.
 *
 * @param spec - a Vega-Lite spec with inline data
 * @returns PDF bytes (start with "%PDF") and the page size in pt
 * @example
 * const { pdf, width } = await renderPdf(spec, { width: 'one-column' }) // width ≈ 243.78 pt (8.6 cm)
 */
export async function renderPdf(spec: ChartSpec, options: RenderPdfOptions = {}): Promise<{ pdf: Buffer; width: number; height: number }> {
  return pdfFromSvg(await renderSvg(spec), options);
}

/** PDF bytes of an already rendered chart SVG (renderSvg or renderSvgInChild, without a physical width). */
export async function pdfFromSvg(rendered: RenderedSvg, options: RenderPdfOptions = {}): Promise<{ pdf: Buffer; width: number; height: number }> {
  const { svg, width: w, height: h } = rendered;
  const width = cmToPt(widthInCm(options.width ?? 'one-column'));
  const height = w > 0 ? (width * h) / w : width;
  const pdf = await svgToPdf(svg, { width, height }, { title: options.title, createdAt: options.createdAt });
  return { pdf, width, height };
}
