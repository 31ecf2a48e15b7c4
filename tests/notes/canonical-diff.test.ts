// Comparison of two JSON values (snapshot parameters or results): differing paths, per-field summary and the largest
// relative difference, as used by the snapshot comparison page and the reproduce command.
import { describe, expect, it } from 'vitest';
import { diffJson, relativeDifference, summarizeDiff } from '@/lib/canonical-diff';

describe('diffJson', () => {
  it('equal values (key order, typed arrays, -0) are equal', () => {
    const a = { b: [1, 2, 3], a: { x: 0 } };
    const b = { a: { x: -0 }, b: Float64Array.from([1, 2, 3]) };
    expect(diffJson(a, b)).toMatchObject({ equal: true, count: 0, differences: [], largest: null });
  });

  it('lists changed, added, removed and type differences with paths', () => {
    const a = { grid: { h: 0.05 }, tubes: [{ at: [0, 0], alpha: 0.5 }], levels: 6, well: 'disk' };
    const b = { grid: { h: 0.025 }, tubes: [{ at: [0, 0], alpha: 0.5 }, { at: [1, 0], alpha: 0.5 }], well: { disk: 1 }, potential: 'x^2' };
    const d = diffJson(a, b);
    expect(d.equal).toBe(false);
    expect(d.differences).toEqual([
      { path: 'grid.h', kind: 'changed', a: 0.05, b: 0.025, relativeDifference: 0.5 },
      { path: 'levels', kind: 'removed', a: 6 },
      { path: 'potential', kind: 'added', b: 'x^2' },
      { path: 'tubes[1]', kind: 'added', b: { at: [1, 0], alpha: 0.5 } },
      { path: 'well', kind: 'type', a: 'disk', b: { disk: 1 } },
    ]);
    expect(d.largest).toEqual({ path: 'grid.h', a: 0.05, b: 0.025, relativeDifference: 0.5 });
  });

  it('finds the largest relative difference among many numbers and summarises per field', () => {
    const a = { levels: [[1, 2, 3], [4, 5, 6]], diagnostics: { wallMs: 10 } };
    const b = { levels: [[1, 2.000002, 3], [4, 5, 6.6]], diagnostics: { wallMs: 99 } };
    const d = diffJson(a, b, { ignore: ['diagnostics'] });
    expect(d.count).toBe(2);
    expect(d.largest?.path).toBe('levels[1][2]');
    expect(d.largest?.relativeDifference).toBeCloseTo(0.6 / 6.6, 12);
    expect(d.fields).toEqual([{ field: 'levels[][]', count: 2, largestRelativeDifference: d.largest?.relativeDifference, example: 'levels[0][1]' }]);
    const text = summarizeDiff(d);
    expect(text).toContain('levels[][]: 2 differences');
    expect(text).toContain('at levels[1][2]');
    expect(summarizeDiff(diffJson(1, 1))).toBe('no differences');
  });

  it('tolerance, listing cap and awkward keys', () => {
    expect(diffJson({ e: 1 }, { e: 1 + 1e-14 }, { relativeTolerance: 1e-12 }).equal).toBe(true);
    const many = diffJson(Array.from({ length: 500 }, (_, i) => i), Array.from({ length: 500 }, (_, i) => i + 1), { maxListed: 10 });
    expect(many.count).toBe(500);
    expect(many.differences).toHaveLength(10);
    expect(diffJson({ 'a b': 1 }, { 'a b': 2 }).differences[0].path).toBe('["a b"]');
  });

  it('relativeDifference handles zeros, NaN and infinities', () => {
    expect(relativeDifference(0, 0)).toBe(0);
    expect(relativeDifference(Number.NaN, Number.NaN)).toBe(0);
    expect(relativeDifference(1, Number.NaN)).toBe(Infinity);
    expect(relativeDifference(0, 1e-300)).toBe(1);
    expect(relativeDifference(2, 1)).toBe(0.5);
  });
});
