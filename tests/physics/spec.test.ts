// Tests of the task spec schemas: defaults, per-field messages for invalid input, branch-aware union errors.
// Messages are the ones written in lib/physics/schemas/*.ts.
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { SpecError } from '@/lib/physics/errors';
import { parseTaskSpec } from '@/lib/physics/schemas';
import { thrownBy } from '../helpers/thrown';

const disk = { disk: { center: [0, 0], radius: 1 } };

function issues(input: unknown): { path: string; message: string }[] {
  const error = thrownBy(() => parseTaskSpec(input));
  expect(error).toBeInstanceOf(SpecError);
  return (error as SpecError).issues;
}

describe('parseTaskSpec', () => {
  it('applies defaults', () => {
    const s = parseTaskSpec({ task: 'spectrum', well: disk, grid: { h: 0.05 } });
    expect(s).toMatchObject({ task: 'spectrum', levels: 6, tubes: [] });
    const c = parseTaskSpec({ task: 'convergence', of: { well: disk, grid: { h: 0.1 } } });
    expect(c).toMatchObject({ refinements: 3 });
  });

  it('accepts every well kind', () => {
    const wells = [
      disk,
      { ellipse: { center: [0, 0], radii: [2, 1], angle: 30 } },
      { rectangle: { min: [0, 0], max: [1, 2] } },
      { polygon: { points: [[0, 0], [1, 0], [0, 1]] } },
      { annulus: { center: [0, 0], radii: [0.5, 1] } },
      { stadium: { center: [0, 0], length: 1, radius: 0.5, angle: 0 } },
      { mask: { file: 'm.png', extent: { min: [0, 0], max: [1, 1] }, invert: true } },
      { union: [disk, { difference: [disk, { disk: { center: [0, 0], radius: 0.5 } }] }] },
    ];
    for (const well of wells) expect(() => parseTaskSpec({ task: 'spectrum', well, grid: { h: 0.1 } })).not.toThrow();
  });

  it('reports every problem with its path', () => {
    const found = issues({
      task: 'spectrum',
      well: { union: [disk, { annulus: { center: [0, 0], radii: [2, 1] } }] },
      grid: { h: -1 },
      tubes: [{ at: [0], alpha: 0.5 }],
      levels: 100,
    });
    expect(found).toContainEqual({ path: 'well.union[1].annulus.radii', message: 'inner radius must be smaller than outer radius' });
    expect(found).toContainEqual({ path: 'grid.h', message: 'grid spacing h must be positive' });
    expect(found).toContainEqual({ path: 'levels', message: 'levels must be at most 64' });
    expect(found.some((i) => i.path.startsWith('tubes[0].at'))).toBe(true);
  });

  it('explains wells, loops and tasks it does not know', () => {
    expect(issues({ task: 'spectrum', well: { blob: {} }, grid: { h: 0.1 } })[0].message).toMatch(/"shape": one of disk, ellipse/);
    expect(issues({ task: 'spectrum', well: { shape: 'blob' }, grid: { h: 0.1 } })[0].message).toMatch(/"shape": one of disk, ellipse/);
    expect(issues({ task: 'spectrum', well: { disk: { center: [0, 0], radius: 0 } }, grid: { h: 0.1 } })).toEqual([
      { path: 'well.disk.radius', message: 'radius must be positive' },
    ]);
    expect(issues({ task: 'nope' })[0]).toEqual({
      path: 'task',
      message: 'task must be one of spectrum, flux-sweep, position-sweep, holonomy, degeneracy, nodal-lines, convergence',
    });
    const loop = issues({ task: 'holonomy', well: disk, grid: { h: 0.1 }, moving: { alpha: 0.5 }, loop: { circle: { center: [0, 0], radius: -1 } } });
    expect(loop).toContainEqual({ path: 'loop.circle.radius', message: 'radius must be positive' });
  });

  it('accepts the flat well form {"shape": ...} as the same well as the keyed form', () => {
    const flat = parseTaskSpec({
      task: 'spectrum',
      well: { union: [{ shape: 'disk', center: [0, 0], radius: 1 }, { shape: 'rectangle', min: [0, -0.5], max: [2, 0.5] }] },
      grid: { h: 0.1 },
    });
    const keyed = parseTaskSpec({
      task: 'spectrum',
      well: { union: [{ disk: { center: [0, 0], radius: 1 } }, { rectangle: { min: [0, -0.5], max: [2, 0.5] } }] },
      grid: { h: 0.1 },
    });
    expect(flat).toEqual(keyed);
    expect(issues({ task: 'spectrum', well: { shape: 'disk', center: [0, 0], radius: 0 }, grid: { h: 0.1 } })).toEqual([
      { path: 'well.disk.radius', message: 'radius must be positive' },
    ]);
  });

  it('refuses unknown fields and bad shapes', () => {
    expect(issues({ task: 'spectrum', well: disk, grid: { h: 0.1 }, levls: 3 })[0].path).toBe('');
    expect(issues({ task: 'spectrum', well: { polygon: { points: [[0, 0], [1, 1]] } }, grid: { h: 0.1 } })[0]).toEqual({
      path: 'well.polygon.points',
      message: 'a polygon needs at least 3 points',
    });
    expect(issues({ task: 'spectrum', well: { rectangle: { min: [1, 0], max: [0, 1] } }, grid: { h: 0.1 } })[0]).toEqual({
      path: 'well.rectangle.max',
      message: 'min must be smaller than max on both axes',
    });
    expect(issues({ task: 'spectrum', well: disk, grid: { h: 0.1 }, potential: '' })[0].path).toBe('potential');
  });
});

describe('worked examples in content/specs', () => {
  const dir = path.resolve(__dirname, '../../content/specs');
  const files = readdirSync(dir).filter((f) => f.endsWith('.json'));
  it('every example is a valid spec', () => {
    expect(files.length).toBeGreaterThanOrEqual(6);
    for (const file of files) expect(() => parseTaskSpec(JSON.parse(readFileSync(path.join(dir, file), 'utf8'))), file).not.toThrow();
  });
});

describe('limits', () => {
  it('refuses too many unknowns, configurations or bytes with advice', async () => {
    const { checkBudget } = await import('@/lib/physics/limits');
    expect(() => checkBudget({ unknowns: 3_140_000, h: 0.001 })).toThrow(
      'grid h = 0.001 gives about 3,140,000 unknowns; the limit is 250,000: use h >= 0.0036 or a smaller well',
    );
    expect(() => checkBudget({ unknowns: 100_000, h: 0.01, configurations: 10_000 })).toThrow(/use at most 4,000 configurations/);
    expect(() => checkBudget({ unknowns: 200_000, h: 0.01, levels: 64, complex: true })).toThrow(/ask for fewer levels/);
    expect(() => checkBudget({ unknowns: 80_000, h: 1 / 160, levels: 4 })).not.toThrow();
  });
});
