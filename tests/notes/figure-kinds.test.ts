// The figure-kind registry: one kind per solver task and the uploaded-data kind; each kind's starting parameters pass
// its own schema, and its default chart builds from a real small solver result (coarse grids) or, for data, a small table.
import { beforeAll, describe, expect, it } from 'vitest';
import { defaultViewSpec } from '@/lib/charts';
import { CHART_VIEWS, COMPUTED_FIGURE_KINDS, defaultParams, FIGURE_KIND_REGISTRY, FIGURE_KINDS, figureKind, figureKindSchema, KIND_LABELS } from '@/lib/figure-kinds/registry';
import { runTask, TASK_NAMES } from '@/lib/physics/run-task';
import { parseTaskSpec, type TaskSpec } from '@/lib/physics/schemas';
import { SMALL_SPECS } from './solver-results';
import { vegaLiteWarnings as compileWarnings } from '../helpers/vega-lite-warnings';

/** A small spec of tests/notes/solver-results.ts (one per task on coarse grids, plus a region scan). */
function smallSpecOf(name: string): TaskSpec {
  return parseTaskSpec(SMALL_SPECS[name]);
}

/** The small spec a view is drawn from: the landscape of a position sweep needs a region scan, not a path. */
function specNameFor(task: string, view: string): string {
  return task === 'position-sweep' && view === 'landscape' ? 'position-sweep-region' : task;
}

const results = new Map<string, { spec: TaskSpec; result: unknown }>();

beforeAll(async () => {
  for (const task of TASK_NAMES) {
    for (const view of CHART_VIEWS[task]) {
      const name = specNameFor(task, view);
      if (results.has(name)) continue;
      const spec = smallSpecOf(name);
      results.set(name, { spec, result: await runTask(spec, {}) });
    }
  }
}, 600_000);


describe('figure-kind registry', () => {
  it('has exactly one kind per solver task, named like the task, plus uploaded data without a task', () => {
    for (const task of TASK_NAMES) {
      const kinds = FIGURE_KINDS.filter((kind) => figureKind(kind).task === task);
      expect(kinds).toEqual([task]);
    }
    expect(FIGURE_KINDS.filter((kind) => figureKind(kind).task === null)).toEqual(['uploaded-data']);
    expect(Object.keys(FIGURE_KIND_REGISTRY).sort()).toEqual([...FIGURE_KINDS].sort());
    expect(COMPUTED_FIGURE_KINDS).toEqual([...TASK_NAMES]);
  });

  it('starts a computed kind with a spec of its own task', () => {
    for (const task of TASK_NAMES) expect(parseTaskSpec(defaultParams(task)).task).toBe(task);
  });

  it('derives the kind schema, labels and views from the entries', () => {
    expect(figureKindSchema.options).toEqual([...FIGURE_KINDS]);
    expect(figureKindSchema.safeParse('upload').success).toBe(false);
    for (const kind of FIGURE_KINDS) {
      expect(KIND_LABELS[kind]).toBe(figureKind(kind).label);
      expect(KIND_LABELS[kind].length).toBeGreaterThan(5);
      expect(CHART_VIEWS[kind]).toEqual(figureKind(kind).views);
    }
  });

  for (const kind of FIGURE_KINDS) {
    it(`${kind}: the starting parameters pass the kind's own schema`, () => {
      const parsed = figureKind(kind).paramsSchema.safeParse(defaultParams(kind));
      expect(parsed.error?.issues ?? []).toEqual([]);
      expect(parsed.success).toBe(true);
    });
  }

  for (const task of TASK_NAMES) {
    it(`${task}: every view of the default chart builds from a real small result and compiles cleanly`, () => {
      for (const view of CHART_VIEWS[task]) {
        const { spec, result } = results.get(specNameFor(task, view))!;
        const chart = defaultViewSpec(task, result, { params: spec, view, level: 0 });
        expect(compileWarnings(chart)).toEqual([]);
      }
    });
  }

  it('uploaded-data: the default chart builds from the starting table and from a small table', () => {
    expect(compileWarnings(defaultViewSpec('uploaded-data', FIGURE_KIND_REGISTRY['uploaded-data'].paramsSchema.parse(defaultParams('uploaded-data'))))).toEqual([]);
    const chart = defaultViewSpec('uploaded-data', { columns: ['alpha', 'E0', 'E1'], rows: [[0, 5.8, 14.7], [0.5, 9.9, 9.9]] });
    expect(compileWarnings(chart)).toEqual([]);
    expect(JSON.stringify(chart)).toContain('"title":"alpha"');
  });
});
