// Tests of well shapes (strict inside with the 1e-9 wall tolerance), set operations, PNG masks and potential formulas.
// Points are chosen by hand; expected answers follow from elementary geometry.
import { PNG } from 'pngjs';
import { describe, expect, it } from 'vitest';
import { SpecError } from '@/lib/physics/errors';
import { compilePotential } from '@/lib/physics/potential';
import { compileWell } from '@/lib/physics/wells';
import { thrownBy } from '../helpers/thrown';

describe('shapes', () => {
  it('disk: strict inside, wall tolerance 1e-9', () => {
    const w = compileWell({ disk: { center: [1, 2], radius: 1 } });
    expect(w.contains(1, 2)).toBe(true);
    expect(w.contains(1.999, 2)).toBe(true);
    expect(w.contains(2, 2)).toBe(false);
    expect(w.contains(2 - 5e-10, 2)).toBe(false); // within the tolerance: wall
    expect(w.contains(2 - 5e-9, 2)).toBe(true);
    expect(w.contains(2.5, 2)).toBe(false);
    expect(w.bbox).toEqual({ min: [0, 1], max: [2, 3] });
  });

  it('ellipse: semi-axes and counter-clockwise angle in degrees', () => {
    const w = compileWell({ ellipse: { center: [0, 0], radii: [2, 1], angle: 90 } });
    expect(w.contains(0, 1.9)).toBe(true);
    expect(w.contains(1.5, 0)).toBe(false);
    expect(w.contains(0, 2)).toBe(false);
    expect(w.bbox.max[0]).toBeCloseTo(1, 12);
    expect(w.bbox.max[1]).toBeCloseTo(2, 12);
    const tilted = compileWell({ ellipse: { center: [0, 0], radii: [2, 0.5], angle: 45 } });
    expect(tilted.contains(1, 1)).toBe(true);
    expect(tilted.contains(1, -1)).toBe(false);
  });

  it('rectangle: sides are wall', () => {
    const w = compileWell({ rectangle: { min: [0, 0], max: [2, 1] } });
    expect(w.contains(1, 0.5)).toBe(true);
    expect(w.contains(0, 0.5)).toBe(false);
    expect(w.contains(1, 1)).toBe(false);
    expect(w.contains(1e-8, 0.5)).toBe(true);
  });

  it('polygon: either orientation, concave shapes, refuses self-intersection', () => {
    const ccw = compileWell({ polygon: { points: [[0, 0], [2, 0], [2, 1], [1, 1], [1, 2], [0, 2]] } });
    const cw = compileWell({ polygon: { points: [[0, 2], [1, 2], [1, 1], [2, 1], [2, 0], [0, 0]] } });
    for (const w of [ccw, cw]) {
      expect(w.contains(0.5, 0.5)).toBe(true);
      expect(w.contains(1.5, 0.5)).toBe(true);
      expect(w.contains(0.5, 1.5)).toBe(true);
      expect(w.contains(1.5, 1.5)).toBe(false); // the notch
      expect(w.contains(1, 1.5)).toBe(false); // on an edge
    }
    expect(() => compileWell({ polygon: { points: [[0, 0], [1, 1], [1, 0], [0, 1]] } })).toThrow(SpecError);
    expect(() => compileWell({ polygon: { points: [[0, 0], [1, 1], [2, 2]] } })).toThrow(/zero area/);
  });

  it('annulus: the hole is outside', () => {
    const w = compileWell({ annulus: { center: [0, 0], radii: [0.5, 1] } });
    expect(w.contains(0, 0)).toBe(false);
    expect(w.contains(0.75, 0)).toBe(true);
    expect(w.contains(0.5, 0)).toBe(false);
  });

  it('stadium: straight part plus round caps, rotated', () => {
    const w = compileWell({ stadium: { center: [0, 0], length: 2, radius: 1, angle: 0 } });
    expect(w.contains(1.9, 0)).toBe(true);
    expect(w.contains(0, 0.99)).toBe(true);
    expect(w.contains(1.5, 0.9)).toBe(false); // hypot(0.5, 0.9) > 1 from the cap centre (1, 0)
    expect(w.contains(2, 0)).toBe(false);
    const up = compileWell({ stadium: { center: [0, 0], length: 2, radius: 1, angle: 90 } });
    expect(up.contains(0, 1.9)).toBe(true);
    expect(up.contains(1.9, 0)).toBe(false);
    expect(up.bbox.max[1]).toBeCloseTo(2, 12);
  });

  it('union and difference', () => {
    const u = compileWell({ union: [{ disk: { center: [0, 0], radius: 1 } }, { disk: { center: [1.5, 0], radius: 1 } }] });
    expect(u.contains(0.75, 0)).toBe(true);
    expect(u.contains(2.4, 0)).toBe(true);
    expect(u.contains(0.75, 0.9)).toBe(false);
    expect(u.bbox).toEqual({ min: [-1, -1], max: [2.5, 1] });
    const d = compileWell({ difference: [{ disk: { center: [0, 0], radius: 1 } }, { rectangle: { min: [0, -2], max: [2, 2] } }] });
    expect(d.contains(-0.5, 0)).toBe(true);
    expect(d.contains(0.5, 0)).toBe(false);
    expect(d.contains(0, 0.5)).toBe(false); // on the removed rectangle's wall
  });
});

/** A width x height PNG; `dark(col, row)` picks black pixels (row 0 = top). */
function png(width: number, height: number, dark: (c: number, r: number) => boolean, alpha = 255): Uint8Array {
  const image = new PNG({ width, height });
  for (let r = 0; r < height; r++) {
    for (let c = 0; c < width; c++) {
      const p = 4 * (r * width + c);
      const v = dark(c, r) ? 0 : 255;
      image.data[p] = v;
      image.data[p + 1] = v;
      image.data[p + 2] = v;
      image.data[p + 3] = alpha;
    }
  }
  return new Uint8Array(PNG.sync.write(image));
}

describe('mask wells', () => {
  const extent = { min: [0, 0] as [number, number], max: [4, 4] as [number, number] };
  it('dark pixels are inside, the top image row is the largest y', () => {
    const files: Record<string, Uint8Array> = { 'top.png': png(4, 4, (_c, r) => r === 0) };
    const w = compileWell({ mask: { file: 'top.png', extent } }, { resolveFile: (k) => files[k] });
    expect(w.contains(1.5, 3.5)).toBe(true);
    expect(w.contains(1.5, 0.5)).toBe(false);
    expect(w.contains(1.5, 3)).toBe(false); // on the edge between a dark and a light pixel
    expect(w.contains(-0.5, 3.5)).toBe(false);
    const inv = compileWell({ mask: { file: 'top.png', extent, invert: true } }, { resolveFile: (k) => files[k] });
    expect(inv.contains(1.5, 3.5)).toBe(false);
    expect(inv.contains(1.5, 0.5)).toBe(true);
  });

  it('transparent pixels count as light; edges between two dark pixels are inside', () => {
    const files: Record<string, Uint8Array> = {
      'clear.png': png(4, 4, () => true, 0),
      'left.png': png(4, 4, (c) => c < 2),
    };
    const clear = compileWell({ mask: { file: 'clear.png', extent } }, { resolveFile: (k) => files[k] });
    expect(clear.contains(1.5, 1.5)).toBe(false);
    const left = compileWell({ mask: { file: 'left.png', extent } }, { resolveFile: (k) => files[k] });
    expect(left.contains(1, 1.5)).toBe(true);
    expect(left.contains(2, 1.5)).toBe(false);
  });

  it('an unreadable or missing file is a SpecError naming it', () => {
    const bad = () => compileWell({ mask: { file: 'junk.png', extent } }, { resolveFile: () => new Uint8Array([1, 2, 3]) });
    expect(bad).toThrow(SpecError);
    expect(bad).toThrow(/junk\.png/);
    const missing = () =>
      compileWell({ mask: { file: 'gone.png', extent } }, {
        resolveFile: () => {
          throw new Error('ENOENT');
        },
      });
    expect(missing).toThrow(/gone\.png/);
    expect((thrownBy(missing) as SpecError).issues[0].path).toBe('well.mask.file');
  });
});

describe('potential formulas', () => {
  it('evaluates arithmetic in x and y', () => {
    expect(compilePotential('x^2 + y^2')(1, 2)).toBe(5);
    expect(compilePotential('10 * (x > 0 ? 1 : 0)')(0.5, 0)).toBe(10);
    expect(compilePotential('2x + sin(pi * y)')(1, 0)).toBe(2);
  });

  it('refuses functions and symbols outside the allowed set (mathjs security guide)', () => {
    for (const formula of ['import({}, {})', 'evaluate("1")', 'parse("x")', 'createUnit("foo")', 'z + 1', '5 cm', 'a = 2', 'f(x) = x', 'cos.constructor', '"text"', '[1, 2]']) {
      expect(() => compilePotential(formula), formula).toThrow(SpecError);
    }
    expect(() => compilePotential('x +')).toThrow(/cannot read the formula/);
  });

  it('refuses a value that is not a finite real number, naming the point', () => {
    const v = compilePotential('sqrt(x)');
    expect(v(4, 0)).toBe(2);
    expect(() => v(-1, 0.5)).toThrow(/\(-1, 0\.5\)/);
    expect(() => compilePotential('1 / x')(0, 0)).toThrow(SpecError);
  });
});
