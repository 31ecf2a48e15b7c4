// Server exports at journal widths (8.6 cm one column, 17.8 cm two columns; common practice): deterministic SVG with a
// physical size, PNG at 300 dpi with the right pixel width, vector PDF with DejaVu Sans embedded, and data-URL refusal.
import { PNG } from 'pngjs';
import { inflateSync } from 'node:zlib';
import { beforeAll, describe, expect, it } from 'vitest';
import { defaultViewSpec, type ChartSpec } from '@/lib/charts';
import { renderPdf, solidifyZeroDashes } from '@/lib/export/render-pdf';
import { renderPng, svgToPng } from '@/lib/export/render-png';
import { renderSvg } from '@/lib/export/render-svg';
import { exportFigure } from '@/lib/export/export-figure';
import { exportQuerySchema } from '@/lib/export/export-query';
import { cmToPt, cmToPx, figureSize, figureWidthSchema } from '@/lib/export/widths';
import { smallResult } from './solver-results';
import { refusalOf } from '../helpers/refusal';

let chart: ChartSpec;

beforeAll(async () => {
  const { spec, result } = await smallResult('flux-sweep');
  chart = defaultViewSpec('flux-sweep', result, { params: spec, width: 325, height: 240, fit: true });
}, 600_000);

/** Uncompressed text of every Flate stream in a PDF plus its raw bytes, to look for operators and objects. */
function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  const parts = [raw];
  const re = /stream\r?\n/g;
  let m: RegExpExecArray | null;
  while ((m = re.exec(raw))) {
    const start = m.index + m[0].length;
    const end = raw.indexOf('endstream', start);
    try {
      parts.push(inflateSync(pdf.subarray(start, end)).toString('latin1'));
    } catch {
      // not a Flate stream (e.g. font data): skip
    }
  }
  return parts.join('\n');
}

describe('widths', () => {
  it('one and two journal columns in pt and px at 300 dpi (common practice)', () => {
    expect(cmToPt(2.54)).toBe(72);
    expect(cmToPx(8.6)).toBe(1016);
    expect(cmToPx(17.8)).toBe(2102);
    expect(figureSize('one-column').width.pt).toBeCloseTo(243.78, 2);
    expect(figureSize('two-column').width.pt).toBeCloseTo(504.57, 2);
    expect(figureWidthSchema.safeParse('three-column').success).toBe(false);
  });
});

describe('SVG', () => {
  it('is deterministic and carries its physical width', async () => {
    const a = await renderSvg(chart, { width: 'one-column' });
    const b = await renderSvg(chart, { width: 'one-column' });
    expect(a.svg).toBe(b.svg);
    expect(a.svg).toMatch(/<svg[^>]* width="8\.6cm" height="[\d.]+cm"/);
    expect(a.svg).toMatch(/viewBox="0 0 325 240"/);
    expect(a.width).toBe(325);
    const wide = await renderSvg(chart, { width: 'two-column' });
    expect(wide.svg).toMatch(/width="17\.8cm"/);
  });

  it('refuses specs that would load data from a URL or file', async () => {
    const bad = { data: { url: 'file:///etc/passwd' }, mark: 'point', encoding: { x: { field: 'a', type: 'quantitative' } } } as unknown as ChartSpec;
    await expect(renderSvg(bad)).rejects.toThrow(/may not load external data/);
    const lookup = { data: { values: [{ a: 1 }] }, transform: [{ lookup: 'a', from: { data: { url: '/etc/hosts' }, key: 'a' } }], mark: 'point' } as unknown as ChartSpec;
    await expect(renderSvg(lookup)).rejects.toThrow(/may not load external data/);
  });
});

describe('PNG', () => {
  it('one column is 1016 px wide at 300 dpi, two columns 2102 px, with drawn pixels', async () => {
    const { png, width, height } = await renderPng(chart, { width: 'one-column' });
    const image = PNG.sync.read(png);
    expect(image.width).toBe(1016);
    expect(width).toBe(1016);
    expect(Math.abs(image.height - height)).toBeLessThanOrEqual(1);
    expect(Math.abs(image.height - Math.round((1016 * 240) / 325))).toBeLessThanOrEqual(1);
    let dark = 0;
    for (let i = 0; i < image.data.length; i += 4) if (image.data[i] < 128 && image.data[i + 3] > 0) dark++;
    expect(dark).toBeGreaterThan(1000);
    const wide = PNG.sync.read((await renderPng(chart, { width: 'two-column' })).png);
    expect(wide.width).toBe(2102);
  });

  it('text is drawn with the bundled font (a title-only SVG is not blank)', () => {
    const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="30" viewBox="0 0 100 30"><text x="2" y="20" font-family="sans-serif" font-size="16">αħ² E</text></svg>';
    const image = PNG.sync.read(svgToPng(svg, 200));
    let dark = 0;
    for (let i = 0; i < image.data.length; i += 4) if (image.data[i] < 100 && image.data[i + 3] > 200) dark++;
    expect(dark).toBeGreaterThan(50);
    expect(() => svgToPng(svg, 0)).toThrow(RangeError);
  });
});

describe('PDF', () => {
  it('starts with %PDF, has a page of the column width, embeds DejaVu Sans and draws vectors (no images)', async () => {
    const { pdf, width, height } = await renderPdf(chart, { width: 'one-column', title: 'Spectral flow' });
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(width).toBeCloseTo(243.78, 2);
    const text = pdfText(pdf);
    const box = /\/MediaBox \[0 0 ([\d.]+) ([\d.]+)\]/.exec(text);
    expect(Number(box?.[1])).toBeCloseTo(width, 4);
    expect(Number(box?.[2])).toBeCloseTo(height, 4);
    expect(height).toBeCloseTo((width * 240) / 325, 4);
    expect(text).toMatch(/\/FontFile2 \d+ 0 R/);
    expect(text).toMatch(/\/BaseFont \/[A-Z]{6}\+DejaVuSans/);
    expect(text).not.toMatch(/\/Subtype \/Image/);
    // Path construction and stroke operators of the chart lines: vector graphics.
    expect(text).toMatch(/\d l\n/);
    expect(text).toMatch(/\bS\n/);
  });

  it('zero-length dash patterns (solid in SVG) are drawn solid', () => {
    expect(solidifyZeroDashes('<path stroke-dasharray="1,0" d="M0"/><path stroke-dasharray="4,3"/>')).toBe('<path d="M0"/><path stroke-dasharray="4,3"/>');
  });

  it('is byte-for-byte reproducible with the fixed metadata date', async () => {
    const a = await renderPdf(chart);
    const b = await renderPdf(chart);
    expect(a.pdf.equals(b.pdf)).toBe(true);
  });
});

describe('exportFigure and the export query', () => {
  it('PDF, PNG, SVG and CSV of a figure with snapshot file names', async () => {
    const { spec, result } = await smallResult('degeneracy');
    const base = { kind: 'degeneracy', result, params: spec, label: 'gap-map', version: 2 } as const;
    const pdf = await exportFigure({ ...base, format: 'pdf' });
    expect(pdf.fileName).toBe('gap-map-v2.pdf');
    expect(pdf.contentType).toBe('application/pdf');
    expect((pdf.body as Buffer).subarray(0, 4).toString('latin1')).toBe('%PDF');
    const png = await exportFigure({ ...base, format: 'png', width: 'two-column' });
    expect(PNG.sync.read(png.body as Buffer).width).toBe(2102);
    const svg = await exportFigure({ ...base, format: 'svg', version: null });
    expect(svg.fileName).toBe('gap-map.svg');
    expect(svg.body as string).toMatch(/width="8\.6cm"/);
    const csv = await exportFigure({ ...base, format: 'csv' });
    expect(csv.contentType).toMatch(/^text\/csv/);
    expect((csv.body as string).split('\r\n')[0]).toBe('table,row,column,value');
    expect(csv.body as string).toContain('gapMap');
  });

  it('query schema: defaults, units, and per-field errors', () => {
    expect(exportQuerySchema.parse({})).toEqual({ format: 'pdf', width: 'one-column', units: { system: 'dimensionless' } });
    expect(exportQuerySchema.parse({ format: 'png', width: 'two-column', units: 'physical', L: '50' })).toEqual({
      format: 'png',
      width: 'two-column',
      units: { system: 'physical', lengthNm: 50, effectiveMass: 0.067 },
    });
    const bad = exportQuerySchema.safeParse({ format: 'gif', width: 'half' });
    expect(refusalOf(bad).issues.map((i) => i.path[0]).sort()).toEqual(['format', 'width']);
    const badUnits = exportQuerySchema.safeParse({ units: 'physical', L: 'abc' });
    expect(refusalOf(badUnits).issues[0].path).toEqual(['L']);
  });
});
