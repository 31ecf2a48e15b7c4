// Type declaration for svg-to-pdfkit 0.1.8, which ships no types: the single default export draws an SVG into a PDFKit doc.
// Options as documented in the package README (width/height in pt, preserveAspectRatio, fontCallback, warningCallback…).
declare module 'svg-to-pdfkit' {
  interface SvgToPdfOptions {
    width?: number;
    height?: number;
    preserveAspectRatio?: string;
    useCSS?: boolean;
    fontCallback?: (family: string, bold: boolean, italic: boolean, fontOptions: { fauxItalic: boolean }) => string;
    imageCallback?: (link: string) => string;
    documentCallback?: (link: string) => unknown;
    colorCallback?: (color: [number[], number]) => [number[], number];
    warningCallback?: (message: string) => void;
    assumePt?: boolean;
    precision?: number;
  }
  function SVGtoPDF(doc: PDFKit.PDFDocument, svg: string, x: number, y: number, options?: SvgToPdfOptions): void;
  export default SVGtoPDF;
}
