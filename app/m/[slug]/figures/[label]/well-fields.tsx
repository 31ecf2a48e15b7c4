// The well part of a parameter form: a shape menu and the fields of that shape with their units (L, degrees);
// wells built from unions, differences or masks are edited as JSON. Also the grid, tubes and potential fields.
'use client';

import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { Button } from '../../../../_components/button';
import { JsonField, NumberField, PointField, PointsField, TextInputField, useFieldError } from './field-kit';

const SHAPES = {
  disk: { label: 'Disk', make: () => ({ disk: { center: [0, 0], radius: 1 } }) },
  ellipse: { label: 'Ellipse', make: () => ({ ellipse: { center: [0, 0], radii: [1.2, 0.8], angle: 0 } }) },
  rectangle: { label: 'Rectangle', make: () => ({ rectangle: { min: [-1, -0.7], max: [1, 0.7] } }) },
  polygon: { label: 'Polygon', make: () => ({ polygon: { points: [[-1, -0.8], [1.1, -0.6], [0.7, 0.9], [-0.9, 0.7]] } }) },
  annulus: { label: 'Annulus (ring)', make: () => ({ annulus: { center: [0, 0], radii: [0.4, 1] } }) },
  stadium: { label: 'Stadium', make: () => ({ stadium: { center: [0, 0], length: 1, radius: 0.6, angle: 0 } }) },
  custom: {
    label: 'Union, difference or mask (JSON)',
    make: () => ({ difference: [{ disk: { center: [0, 0], radius: 1 } }, { disk: { center: [0.4, 0], radius: 0.3 } }] }),
  },
} as const;
type ShapeKey = keyof typeof SHAPES;

function shapeOf(well: unknown): ShapeKey {
  const key = well && typeof well === 'object' ? Object.keys(well)[0] : undefined;
  return key && key in SHAPES && key !== 'custom' ? (key as ShapeKey) : 'custom';
}

/** Fields of the well at `${prefix}well`. */
export function WellFields({ prefix }: { prefix: string }) {
  const { setValue, control } = useFormContext();
  const name = `${prefix}well`;
  const well = useWatch({ control, name });
  const shape = shapeOf(well);
  const error = useFieldError(name);
  const p = `${name}.${shape}`;
  return (
    <fieldset className="space-y-3" data-testid="well-fields">
      <legend className="text-sm font-semibold text-slate-900">Well</legend>
      <div>
        <label htmlFor={`${name}-shape`} className="block text-xs font-medium text-slate-700">
          Shape
        </label>
        <select
          id={`${name}-shape`}
          value={shape}
          onChange={(e) => setValue(name, SHAPES[e.target.value as ShapeKey].make(), { shouldDirty: true, shouldValidate: true })}
          className="mt-1 h-9 w-full rounded-md border border-slate-300 bg-white px-2 text-sm"
        >
          {(Object.keys(SHAPES) as ShapeKey[]).map((key) => (
            <option key={key} value={key}>
              {SHAPES[key].label}
            </option>
          ))}
        </select>
      </div>
      {shape === 'disk' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <PointField name={`${p}.center`} label="Centre" />
          <NumberField name={`${p}.radius`} label="Radius" unit="L" />
        </div>
      ) : null}
      {shape === 'ellipse' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <PointField name={`${p}.center`} label="Centre" />
          <NumberField name={`${p}.angle`} label="Rotation of the first axis" unit="° ccw" />
          <NumberField name={`${p}.radii.0`} label="Semi-axis a" unit="L" />
          <NumberField name={`${p}.radii.1`} label="Semi-axis b" unit="L" />
        </div>
      ) : null}
      {shape === 'rectangle' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <PointField name={`${p}.min`} label="Lower-left corner" />
          <PointField name={`${p}.max`} label="Upper-right corner" />
        </div>
      ) : null}
      {shape === 'polygon' ? <PointsField name={`${p}.points`} label="Corners" hint="At least 3 corners, in either orientation." /> : null}
      {shape === 'annulus' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <PointField name={`${p}.center`} label="Centre" />
          <div />
          <NumberField name={`${p}.radii.0`} label="Inner radius" unit="L" />
          <NumberField name={`${p}.radii.1`} label="Outer radius" unit="L" />
        </div>
      ) : null}
      {shape === 'stadium' ? (
        <div className="grid gap-3 sm:grid-cols-2">
          <PointField name={`${p}.center`} label="Centre" />
          <NumberField name={`${p}.angle`} label="Rotation" unit="° ccw" />
          <NumberField name={`${p}.length`} label="Straight part" unit="L" />
          <NumberField name={`${p}.radius`} label="Cap radius" unit="L" />
        </div>
      ) : null}
      {shape === 'custom' ? (
        <JsonField
          key={JSON.stringify(Object.keys(well ?? {}))}
          name={name}
          label="Well (JSON)"
          hint='e.g. {"union": [W, W]}, {"difference": [W, W to remove]} or {"mask": {"file", "extent": {"min", "max"}}}'
        />
      ) : null}
      {error && shape !== 'custom' ? <p className="text-xs font-medium text-red-700">{error}</p> : null}
    </fieldset>
  );
}

/** Grid spacing and offset at `${prefix}grid`. */
export function GridFields({ prefix }: { prefix: string }) {
  return (
    <fieldset className="space-y-3">
      <legend className="text-sm font-semibold text-slate-900">Lattice</legend>
      <div className="grid gap-3 sm:grid-cols-3">
        <NumberField name={`${prefix}grid.h`} label="Spacing h" unit="L" hint="Smaller is finer and slower." />
        <NumberField name={`${prefix}grid.offset.0`} label="Offset x" unit="h" optional hint="Blank: centres on multiples of h." />
        <NumberField name={`${prefix}grid.offset.1`} label="Offset y" unit="h" optional />
      </div>
      <TextInputField
        name={`${prefix}potential`}
        label="Potential V(x, y) (optional, in ħ²/2mL²)"
        placeholder="e.g. 5*(x^2 + y^2)"
        hint="A formula in x and y; leave blank for a flat floor."
      />
    </fieldset>
  );
}

/** Fixed flux tubes at `${prefix}tubes`. */
export function TubeFields({ prefix, sweptIndex }: { prefix: string; sweptIndex?: number | null }) {
  const { control } = useFormContext();
  const { fields, append, remove } = useFieldArray({ control, name: `${prefix}tubes` });
  const error = useFieldError(`${prefix}tubes`);
  return (
    <fieldset className="space-y-3" data-testid="tube-fields">
      <legend className="text-sm font-semibold text-slate-900">Fixed flux tubes</legend>
      {fields.length === 0 ? <p className="text-xs text-slate-500">No fixed tubes.</p> : null}
      {fields.map((field, k) => (
        <div key={field.id} className="grid items-end gap-2 rounded-md bg-slate-50 p-2 sm:grid-cols-[1fr_1fr_1fr_auto]">
          <NumberField name={`${prefix}tubes.${k}.at.0`} label={`Tube ${k} x`} unit="L" />
          <NumberField name={`${prefix}tubes.${k}.at.1`} label={`Tube ${k} y`} unit="L" />
          <NumberField
            name={`${prefix}tubes.${k}.alpha`}
            label={sweptIndex === k ? `Flux α (swept)` : 'Flux α'}
            unit="h/e"
            hint={sweptIndex === k ? 'Replaced by the sweep' : undefined}
          />
          <Button size="sm" variant="quiet" onClick={() => remove(k)} aria-label={`Remove tube ${k}`}>
            Remove
          </Button>
        </div>
      ))}
      <Button size="sm" variant="secondary" onClick={() => append({ at: [0, 0], alpha: 0.5 })}>
        Add a tube
      </Button>
      {error ? <p className="text-xs font-medium text-red-700">{error}</p> : null}
    </fieldset>
  );
}
