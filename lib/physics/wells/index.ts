// compileWell: turns a validated well spec into a Well (strict-inside test and bounding box).
// Mask files are read through the caller's resolveFile; a missing or unreadable file is a SpecError naming it.
import { SpecError } from '../errors';
import type { WellSpec } from '../schemas/common';
import { compileAnnulus } from './annulus';
import { compileDisk } from './disk';
import { compileEllipse } from './ellipse';
import { compileMask } from './mask';
import { compilePolygon } from './polygon';
import { compileRectangle } from './rectangle';
import { compileDifference, compileUnion } from './set-operations';
import { compileStadium } from './stadium';
import type { Well } from './well';

export type { Well, PointClass } from './well';
export { WALL_TOLERANCE } from './well';

export interface CompileWellOptions {
  /** Returns the bytes of a mask file by key; throw or return nothing when it does not exist. */
  resolveFile?: (key: string) => Uint8Array;
}

/**
 * Compiles a well spec (already validated by `wellSchema`).
 *
 * @param spec - a shape, or `{union: [...]}` / `{difference: [a, b]}`
 * @param options - `resolveFile` for mask images
 * @param path - spec path used in error messages (default "well")
 * @returns a Well whose `contains(x, y)` is true strictly inside (more than 1e-9 L from every wall)
 * @throws SpecError for an unreadable mask file or a non-simple polygon
 * @example
 * const well = compileWell({ disk: { center: [0, 0], radius: 1 } });
 * well.contains(0, 0.999); // true
 * well.contains(1, 0); // false (on the wall)
 */
export function compileWell(spec: WellSpec, options: CompileWellOptions = {}, path = 'well'): Well {
  if ('disk' in spec) return compileDisk(spec.disk.center, spec.disk.radius);
  if ('ellipse' in spec) return compileEllipse(spec.ellipse.center, spec.ellipse.radii, spec.ellipse.angle ?? 0);
  if ('rectangle' in spec) return compileRectangle(spec.rectangle.min, spec.rectangle.max);
  if ('polygon' in spec) return compilePolygon(spec.polygon.points, `${path}.polygon.points`);
  if ('annulus' in spec) return compileAnnulus(spec.annulus.center, spec.annulus.radii);
  if ('stadium' in spec) return compileStadium(spec.stadium.center, spec.stadium.length, spec.stadium.radius, spec.stadium.angle ?? 0);
  if ('mask' in spec) {
    const { file, extent, invert } = spec.mask;
    const filePath = `${path}.mask.file`;
    if (!options.resolveFile) throw new SpecError(`mask file "${file}" cannot be read here (no file store is available)`, filePath);
    let bytes: Uint8Array | undefined;
    try {
      bytes = options.resolveFile(file);
    } catch (error) {
      throw new SpecError(`mask file "${file}" cannot be read (${(error as Error).message})`, filePath);
    }
    if (!bytes) throw new SpecError(`mask file "${file}" was not found`, filePath);
    return compileMask(bytes, extent, invert ?? false, file, filePath);
  }
  if ('union' in spec) return compileUnion(spec.union.map((w, i) => compileWell(w, options, `${path}.union[${i}]`)));
  if ('difference' in spec) {
    return compileDifference(
      compileWell(spec.difference[0], options, `${path}.difference[0]`),
      compileWell(spec.difference[1], options, `${path}.difference[1]`),
    );
  }
  throw new SpecError('unknown well kind', path);
}
