// The kind-specific part of each figure kind's parameter form (one component per kind of the registry): sweep range,
// moving tube and its loop, path or region, levels, level pair, refinements, an uploaded table. Units beside every field.
'use client';

import type { ComponentType } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import type { FigureKind } from '@/lib/figure-kinds/registry';
import { CheckboxField, JsonField, NumberField, PointField, PointsField } from './field-kit';

function Levels({ name = 'levels', label = 'Levels' }: { name?: string; label?: string }) {
  return <NumberField name={name} label={label} step="1" hint="How many of the lowest levels (1–64)." />;
}

function MovingTube() {
  return <NumberField name="moving.alpha" label="Flux of the moving tube α" unit="h/e" hint="½ makes the problem real (signs ±1)." />;
}

function RegionFields({ name, legend }: { name: string; legend: string }) {
  return (
    <fieldset className="grid gap-3 sm:grid-cols-2">
      <legend className="mb-1 text-xs font-semibold text-slate-700">{legend}</legend>
      <PointField name={`${name}.min`} label="Lower-left corner" />
      <PointField name={`${name}.max`} label="Upper-right corner" />
    </fieldset>
  );
}

/** A choice between two mutually exclusive sub-objects (path or region; circle or polygon). */
function Choice({
  name,
  options,
  value,
  onChange,
}: {
  name: string;
  options: { key: string; label: string }[];
  value: string;
  onChange: (key: string) => void;
}) {
  return (
    <div role="radiogroup" aria-label={name} className="flex flex-wrap gap-4 text-sm">
      {options.map((o) => (
        <label key={o.key} className="flex items-center gap-1.5">
          <input type="radio" name={name} checked={value === o.key} onChange={() => onChange(o.key)} className="text-flux-700 focus:ring-flux-600" />
          {o.label}
        </label>
      ))}
    </div>
  );
}

/** The form's values and a setter that marks the form dirty and validates (for choices that swap sub-objects). */
function useTaskValues() {
  const { control, setValue, getValues } = useFormContext();
  const values = useWatch({ control });
  const set = (name: string, value: unknown) => setValue(name, value, { shouldDirty: true, shouldValidate: true });
  return { values, set, getValues };
}

function SpectrumFields() {
  return (
    <fieldset className="grid gap-3 sm:grid-cols-2">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Spectrum</legend>
      <Levels />
      <CheckboxField name="states" label="Also store the states" hint="Densities and phases, for density plots." />
    </fieldset>
  );
}

function FluxSweepFields() {
  const { values } = useTaskValues();
  const tubes = (values.tubes as unknown[] | undefined) ?? [];
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Flux sweep</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <NumberField name="sweep.tube" label="Swept tube (index)" step="1" hint={tubes.length ? `0 … ${tubes.length - 1}` : 'Add a tube first.'} />
        <Levels />
        <NumberField name="sweep.from" label="From α" unit="h/e" />
        <NumberField name="sweep.to" label="To α" unit="h/e" />
        <NumberField name="sweep.steps" label="Steps" step="1" hint="Number of α values (2–2001)." />
      </div>
    </fieldset>
  );
}

function PositionSweepFields() {
  const { values, set } = useTaskValues();
  const mode = values.region ? 'region' : 'path';
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Moving tube</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <MovingTube />
        <Levels />
      </div>
      <Choice
        name="position-mode"
        value={mode}
        options={[
          { key: 'path', label: 'Along a path' },
          { key: 'region', label: 'Over a region (energy landscape)' },
        ]}
        onChange={(key) => {
          if (key === 'path') {
            set('region', undefined);
            set('path', { points: [[-0.8, 0], [0.8, 0]] });
          } else {
            set('path', undefined);
            set('region', { min: [-0.6, -0.6], max: [0.6, 0.6] });
          }
        }}
      />
      {mode === 'path' ? (
        <>
          <PointsField name="path.points" label="Path" hint="At least 2 points; the tube moves through them in order." />
          <CheckboxField name="path.closed" label="Closed path (back to the first point)" />
        </>
      ) : (
        <RegionFields name="region" legend="Region scanned" />
      )}
    </fieldset>
  );
}

function HolonomyFields() {
  const { values, set } = useTaskValues();
  const loop = (values.loop ?? {}) as Record<string, unknown>;
  const mode = 'polygon' in loop ? 'polygon' : 'circle';
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Loop of the moving tube</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <MovingTube />
        <NumberField name="level" label="Level followed" step="1" hint="0 is the ground level." />
      </div>
      <Choice
        name="loop-mode"
        value={mode}
        options={[
          { key: 'circle', label: 'Circle (counter-clockwise)' },
          { key: 'polygon', label: 'Polygon (in the order given)' },
        ]}
        onChange={(key) =>
          set('loop', key === 'circle' ? { circle: { center: [0, 0], radius: 0.5 } } : { polygon: [[-0.5, -0.5], [0.5, -0.5], [0.5, 0.5], [-0.5, 0.5]] })
        }
      />
      {mode === 'circle' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <PointField name="loop.circle.center" label="Centre" />
          <NumberField name="loop.circle.radius" label="Radius" unit="L" />
        </div>
      ) : (
        <PointsField name="loop.polygon" label="Corners" hint="Counter-clockwise order gives the positive orientation." />
      )}
    </fieldset>
  );
}

function DegeneracyFields() {
  const { values, set, getValues } = useTaskValues();
  const limited = values.region !== undefined;
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Degeneracy scan</legend>
      <div className="grid gap-3 sm:grid-cols-2">
        <MovingTube />
      </div>
      <label className="flex items-center gap-2 text-sm text-slate-700">
        <input
          type="checkbox"
          checked={limited}
          onChange={(e) => set('region', e.target.checked ? { min: [-0.5, -0.5], max: [0.5, 0.5] } : undefined)}
          className="size-4 rounded border-slate-300 text-flux-700"
        />
        Scan only a region (default: the whole well)
      </label>
      {limited ? <RegionFields name="region" legend="Region scanned" /> : null}
      <p className="text-xs text-slate-500">
        Levels {String((getValues('pair') as number[] | undefined)?.[0] ?? 0)} and {String((getValues('pair') as number[] | undefined)?.[1] ?? 1)};
        every tube needs an integer or half-integer α.
      </p>
    </fieldset>
  );
}

function NodalLinesFields() {
  return (
    <fieldset className="grid gap-3 sm:grid-cols-2">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Nodal lines</legend>
      <NumberField name="level" label="Level" step="1" hint="0 is the ground level. Needs a real problem (α integer or ½)." />
    </fieldset>
  );
}

function ConvergenceFields() {
  const { values, set } = useTaskValues();
  return (
    <fieldset className="grid gap-3 sm:grid-cols-3">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Refinement study</legend>
      <Levels name="of.levels" />
      <div>
        <label htmlFor="refinements" className="block text-xs font-medium text-slate-700">
          Grids
        </label>
        <select
          id="refinements"
          className="mt-1 h-9 w-full rounded-md border border-slate-300 bg-white px-2 text-sm"
          value={String(values.refinements ?? 3)}
          onChange={(e) => set('refinements', Number(e.target.value))}
        >
          <option value="2">h, h/2</option>
          <option value="3">h, h/2, h/4</option>
        </select>
      </div>
      <NumberField name="order" label="Theoretical order" optional hint="Blank: 1 for curved walls." />
    </fieldset>
  );
}

/** The columns and rows of an uploaded table, as JSON (each row as long as the list of columns). */
function UploadedTableFields() {
  return (
    <fieldset className="space-y-3">
      <legend className="mb-1 text-sm font-semibold text-slate-900">Table</legend>
      <JsonField name="columns" label="Columns" hint='Column names, e.g. ["alpha", "E0"]; the first numeric column is the x axis.' />
      <JsonField name="rows" label="Rows" hint="One list of cells per row (numbers, text or null), as many cells as columns." />
    </fieldset>
  );
}

/** The kind-specific form part of every figure kind (the registry's kinds; a new kind adds its part here). */
const KIND_FIELDS: Record<FigureKind, ComponentType> = {
  spectrum: SpectrumFields,
  'flux-sweep': FluxSweepFields,
  'position-sweep': PositionSweepFields,
  holonomy: HolonomyFields,
  degeneracy: DegeneracyFields,
  'nodal-lines': NodalLinesFields,
  convergence: ConvergenceFields,
  'uploaded-data': UploadedTableFields,
};

/** Fields of the kind itself (beyond the well, grid and tubes) for a figure kind. */
export function TaskFields({ kind }: { kind: FigureKind }) {
  const Fields = KIND_FIELDS[kind];
  return <Fields />;
}
