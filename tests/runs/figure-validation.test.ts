// The figure schema shared by forms, routes, worker and seed: kinds come from the figure-kind registry, parameters are
// validated by the kind's schema with per-field paths, and kind must match params.task.
import { describe, expect, it } from 'vitest';
import { createFigureSchema, updateFigureSchema } from '@/lib/validations/figure';
import { SMALL_SPECTRUM } from './fixtures';

/** The dotted paths of a failed parse (throws if the parse succeeded, so a pass cannot hide here). */
function issuePaths(result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }): string[] {
  expect(result.success).toBe(false);
  return result.error!.issues.map((issue) => issue.path.map(String).join('.'));
}

describe('figure validation', () => {
  it('fills in the solver defaults', () => {
    const parsed = createFigureSchema.parse({
      label: 'spectrum-a',
      kind: 'spectrum',
      params: { task: 'spectrum', well: { disk: { center: [0, 0], radius: 1 } }, grid: { h: 0.1 } },
    });
    expect(parsed.params).toMatchObject({ task: 'spectrum', levels: 6, tubes: [] });
    expect(parsed.caption).toBe('');
  });

  it('reports per-field paths inside the parameters', () => {
    const result = createFigureSchema.safeParse({
      label: 'Bad Label',
      kind: 'spectrum',
      params: { ...SMALL_SPECTRUM, well: { disk: { center: [0, 0], radius: -1 } } },
    });
    const paths = issuePaths(result);
    expect(paths).toContain('label');
    expect(paths).toContain('params.well.disk.radius');
  });

  it('refuses a kind that does not match the parameters', () => {
    const result = createFigureSchema.safeParse({ label: 'a', kind: 'holonomy', params: SMALL_SPECTRUM });
    expect(issuePaths(result)).toContain('params.task');
    expect(result.error!.issues[0].message).toBe('The parameters are for task "spectrum" but the figure kind is "holonomy"');
  });

  it('names the tasks when the parameters ask for an unknown one', () => {
    const result = updateFigureSchema.safeParse({ params: { ...SMALL_SPECTRUM, task: 'bogus' } });
    expect(issuePaths(result)).toContain('params.task');
    expect(result.error!.issues.map((i) => i.message).join(' ')).toMatch(/task must be one of spectrum, flux-sweep/);
  });

  it('accepts an uploaded table in every shape the chart reads and stores it as columns and rows', () => {
    const table = { columns: ['alpha', 'E0'], rows: [[0, 5.8], [0.5, 9.9]] };
    for (const params of [table, [{ alpha: 0, E0: 5.8 }, { alpha: 0.5, E0: 9.9 }], { data: [{ alpha: 0, E0: 5.8 }, { alpha: 0.5, E0: 9.9 }] }]) {
      const parsed = createFigureSchema.parse({ label: 'table', kind: 'uploaded-data', params });
      expect(parsed.params).toEqual(table);
    }
  });

  it('refuses a malformed uploaded table with per-field messages', () => {
    const ragged = createFigureSchema.safeParse({ label: 'table', kind: 'uploaded-data', params: { columns: ['a', 'b'], rows: [[1, 2], [3]] } });
    expect(issuePaths(ragged)).toContain('params.rows.1');
    const doubled = createFigureSchema.safeParse({ label: 'table', kind: 'uploaded-data', params: { columns: ['a', 'a'], rows: [[1, 2]] } });
    expect(issuePaths(doubled)).toContain('params.columns.1');
    const solverSpec = createFigureSchema.safeParse({ label: 'table', kind: 'uploaded-data', params: SMALL_SPECTRUM });
    expect(issuePaths(solverSpec)).toContain('params.task');
  });

  it('takes the kind of new parameters from their task, or uploaded data for a table', () => {
    expect(updateFigureSchema.parse({ params: SMALL_SPECTRUM }).kind).toBe('spectrum');
    expect(updateFigureSchema.parse({ params: { columns: ['x', 'y'], rows: [[0, 1]] } }).kind).toBe('uploaded-data');
    expect(updateFigureSchema.parse({ caption: 'only this' }).kind).toBeUndefined();
  });

  it('accepts partial updates and refuses empty ones', () => {
    expect(updateFigureSchema.safeParse({ caption: 'New caption' }).success).toBe(true);
    expect(updateFigureSchema.safeParse({}).success).toBe(false);
    expect(updateFigureSchema.safeParse({ kind: 'holonomy' }).success).toBe(false);
    expect(updateFigureSchema.safeParse({ viewSpec: null }).success).toBe(true);
    expect(updateFigureSchema.safeParse({ caption: 'x'.repeat(2001) }).success).toBe(false);
  });

  it('checks the view spec at write time with the one view-spec schema (an allow-list)', () => {
    const parsed = updateFigureSchema.parse({ viewSpec: { width: 300, fluxfolio: { view: 'levels' } } });
    expect(parsed.viewSpec).toEqual({ width: 300, fluxfolio: { view: 'levels' } });
    const refused = issuePaths(updateFigureSchema.safeParse({ viewSpec: { width: 300, data: { url: 'https://example.org/x.csv' }, usermeta: { view: 'levels' } } }));
    expect(refused).toContain('viewSpec.data');
    expect(refused).toContain('viewSpec.usermeta');
    expect(issuePaths(updateFigureSchema.safeParse({ viewSpec: { big: 'x'.repeat(100_001) } }))).toContain('viewSpec');
  });
});
