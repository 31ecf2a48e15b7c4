// The figure schema shared by forms, routes, worker and seed: kinds are the solver's task names, parameters are
// validated by the solver's schema with per-field paths, and kind must match params.task.
import { describe, expect, it } from 'vitest';
import { TASK_NAMES } from '@/lib/physics/run-task';
import { createFigureSchema, FIGURE_KINDS, updateFigureSchema } from '@/lib/validations/figure';
import { SMALL_SPECTRUM } from './fixtures';
import { refusalOf } from '../helpers/refusal';

describe('figure validation', () => {
  it('offers one kind per solver task', () => {
    expect([...FIGURE_KINDS].sort()).toEqual([...TASK_NAMES].sort());
  });

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
    const paths = refusalOf(result).issues.map((issue) => issue.path.join('.'));
    expect(paths).toContain('label');
    expect(paths).toContain('params.well.disk.radius');
  });

  it('refuses a kind that does not match the parameters', () => {
    const result = createFigureSchema.safeParse({ label: 'a', kind: 'holonomy', params: SMALL_SPECTRUM });
    expect(refusalOf(result).issues.map((i) => i.path.join('.'))).toContain('params.task');
  });

  it('accepts partial updates and refuses empty ones', () => {
    expect(updateFigureSchema.safeParse({ caption: 'New caption' }).success).toBe(true);
    expect(updateFigureSchema.safeParse({}).success).toBe(false);
    expect(updateFigureSchema.safeParse({ kind: 'holonomy' }).success).toBe(false);
    expect(updateFigureSchema.safeParse({ viewSpec: null }).success).toBe(true);
    expect(updateFigureSchema.safeParse({ caption: 'x'.repeat(2001) }).success).toBe(false);
  });
});
