// Location of the TrueType fonts embedded in PNG and PDF exports: DejaVu Sans from the dejavu-fonts-ttf package (resvg and
// PDFKit need TTF; woff/woff2 is silently ignored by resvg, STACK.md §5 gotcha 6).
import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

export const FONT_FAMILY = 'DejaVu Sans';

const FONT_FILES = {
  regular: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  italic: 'DejaVuSans-Oblique.ttf',
  boldItalic: 'DejaVuSans-BoldOblique.ttf',
} as const;

export type FontStyle = keyof typeof FONT_FILES;

let fontDir: string | null = null;

/** Directory holding the DejaVu TTF files (node_modules/dejavu-fonts-ttf/ttf), found from this module or the working dir. */
export function dejavuFontDir(): string {
  if (fontDir) return fontDir;
  const candidates: string[] = [];
  try {
    const require = createRequire(import.meta.url);
    candidates.push(path.join(path.dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf'));
  } catch {
    // resolution can fail inside bundles; fall back to the project's node_modules
  }
  candidates.push(path.join(process.cwd(), 'node_modules', 'dejavu-fonts-ttf', 'ttf'));
  const found = candidates.find((dir) => fs.existsSync(path.join(dir, FONT_FILES.regular)));
  if (!found) throw new Error('DejaVu Sans TTF not found: install the dejavu-fonts-ttf package');
  fontDir = found;
  return found;
}

/** Absolute path of a DejaVu Sans TTF file. */
export function dejavuFontPath(style: FontStyle = 'regular'): string {
  return path.join(dejavuFontDir(), FONT_FILES[style]);
}
