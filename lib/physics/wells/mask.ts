// Mask well from a PNG image stretched over an extent: dark pixels (luminance < 0.5 over white) are inside, y up.
// Sites within the wall tolerance of a pixel edge count as inside only when every pixel they touch is inside.
import { PNG } from 'pngjs';
import { SpecError } from '../errors';
import type { Vec2 } from '../types';
import { makeWell, WALL_TOLERANCE, type PointClass, type Well } from './well';

/** Largest accepted mask, in pixels (keeps decoding memory bounded). */
const MAX_MASK_PIXELS = 16_000_000;

/**
 * Decodes a PNG into a row-major boolean grid (row 0 = top row of the image = largest y).
 * Luminance uses the Rec. 709 weights on the stored values, composited over white by alpha (common practice).
 */
export function decodeMask(bytes: Uint8Array, file: string, path: string): { width: number; height: number; dark: Uint8Array } {
  let png: PNG;
  try {
    png = PNG.sync.read(Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength));
  } catch (error) {
    throw new SpecError(`mask file "${file}" is not a readable PNG image (${(error as Error).message})`, path);
  }
  const { width, height, data } = png;
  if (width * height > MAX_MASK_PIXELS) throw new SpecError(`mask file "${file}" is too large (${width} x ${height} pixels)`, path);
  const dark = new Uint8Array(width * height);
  for (let p = 0; p < width * height; p++) {
    const a = data[4 * p + 3] / 255;
    const lum = (0.2126 * data[4 * p] + 0.7152 * data[4 * p + 1] + 0.0722 * data[4 * p + 2]) / 255;
    dark[p] = a * lum + (1 - a) < 0.5 ? 1 : 0;
  }
  return { width, height, dark };
}

/** Pixel indices along one axis touched by coordinate u (in pixels): one, or two on a pixel edge. */
function touched(u: number, tol: number): [number, number] {
  const lo = Math.floor(u - tol);
  const hi = Math.floor(u + tol);
  return [lo, hi];
}

/**
 * @param bytes - PNG file contents
 * @param extent - the rectangle the image covers (units of L); the top image row lies at extent.max[1]
 * @param invert - when true light pixels are inside instead
 * @param file - the file key, for error messages
 * @throws SpecError naming the file when it cannot be decoded
 */
export function compileMask(
  bytes: Uint8Array,
  extent: { min: Vec2; max: Vec2 },
  invert: boolean,
  file: string,
  path = 'mask.file',
): Well {
  const { width, height, dark } = decodeMask(bytes, file, path);
  const sx = width / (extent.max[0] - extent.min[0]);
  const sy = height / (extent.max[1] - extent.min[1]);
  const tolX = WALL_TOLERANCE * sx;
  const tolY = WALL_TOLERANCE * sy;
  const insidePixel = (col: number, row: number) =>
    col >= 0 && col < width && row >= 0 && row < height && (dark[row * width + col] === 1) !== invert;
  return makeWell(
    (x, y): PointClass => {
      const [c0, c1] = touched((x - extent.min[0]) * sx, tolX);
      const [r0, r1] = touched((extent.max[1] - y) * sy, tolY);
      let any = false;
      let all = true;
      for (const col of c0 === c1 ? [c0] : [c0, c1]) {
        for (const row of r0 === r1 ? [r0] : [r0, r1]) {
          const inside = insidePixel(col, row);
          any ||= inside;
          all &&= inside;
        }
      }
      if (all) return 1;
      return any ? 0 : -1;
    },
    { min: [extent.min[0], extent.min[1]], max: [extent.max[0], extent.max[1]] },
  );
}
