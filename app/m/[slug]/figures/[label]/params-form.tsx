// The parameter form of a figure (react-hook-form + the kind's schema from the figure-kind registry): well, lattice and
// tubes where the kind has them, the kind's own fields, a live to-scale drawing, and save (PATCH) with server errors.
'use client';

import { zodResolver } from '@hookform/resolvers/zod';
import { forwardRef, useEffect, useImperativeHandle, useState } from 'react';
import { FormProvider, useForm, useWatch, type FieldValues, type Resolver } from 'react-hook-form';
import type { z } from 'zod';
import { updateFigure } from '@/app/_hooks/use-figure';
import type { FigureView } from '@/lib/api-types';
import { ApiError } from '@/lib/fetcher';
import { figureKind, type FigureKind } from '@/lib/figure-kinds/registry';
import { Button } from '../../../../_components/button';
import { WellDrawing } from '../../../../_components/figures/well-drawing';
import { TaskFields } from './task-fields';
import { GridFields, TubeFields, WellFields } from './well-fields';

const blank = (v: unknown) => v === undefined || v === null || (typeof v === 'number' && Number.isNaN(v));

/**
 * Form values -> spec input: drops an offset left blank, an empty potential, an empty optional order and keys
 * switched off (undefined), so that the schema sees what a person meant.
 */
export function normalizeSpec(values: FieldValues): FieldValues {
  const spec = JSON.parse(JSON.stringify(values, (_k, v) => (typeof v === 'number' && Number.isNaN(v) ? '__NaN__' : v)), (_k, v) =>
    v === '__NaN__' ? NaN : v,
  ) as FieldValues;
  const problem = spec.task === 'convergence' ? spec.of : spec;
  if (problem?.grid && Array.isArray(problem.grid.offset) && problem.grid.offset.every(blank)) delete problem.grid.offset;
  if (problem && typeof problem.potential === 'string' && problem.potential.trim() === '') delete problem.potential;
  if (blank(spec.order)) delete spec.order;
  return spec;
}

function resolverFor(kind: FigureKind): Resolver<FieldValues> {
  // The kind's parameter schema from the registry: the same one the API, worker and CLI use.
  const inner = zodResolver(figureKind(kind).paramsSchema as never) as unknown as Resolver<FieldValues>;
  return (values, context, options) => inner(normalizeSpec(values), context, options);
}

export interface ParamsFormHandle {
  /** Saves the form when it has unsaved changes; false when it is invalid or the save failed. */
  saveIfDirty: () => Promise<boolean>;
}

export interface ParamsFormProps {
  figureId: string;
  kind: FigureKind;
  initial: FieldValues;
  /** L in nm when the page shows physical units (the drawing's scale bar). */
  lengthNm?: number | null;
  onSaved?: (params: FigureView['params']) => void;
}

/** The editable parameters of one figure. */
export const ParamsForm = forwardRef<ParamsFormHandle, ParamsFormProps>(function ParamsForm(
  { figureId, kind, initial, lengthNm, onSaved },
  ref,
) {
  const methods = useForm<FieldValues>({ defaultValues: initial, resolver: resolverFor(kind), mode: 'onChange' });
  const { handleSubmit, formState, setError, reset, control, getValues } = methods;
  useEffect(() => {
    // Registering optional fields (offset, potential, check boxes) adds keys the stored spec leaves out; take the
    // registered shape as the baseline so that an untouched form is not "dirty".
    reset(getValues(), { keepValues: true });
  }, [reset, getValues]);
  const watched = useWatch({ control });
  const [status, setStatus] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);

  const save = async (values: FieldValues): Promise<boolean> => {
    setStatus(null);
    try {
      const { figure } = await updateFigure(figureId, { params: values });
      reset(getValues(), { keepValues: true });
      setStatus({ tone: 'ok', text: 'Parameters saved.' });
      onSaved?.(figure.params);
      return true;
    } catch (error) {
      if (error instanceof ApiError) {
        let placed = 0;
        for (const [path, messages] of Object.entries(error.fields)) {
          if (path.startsWith('params.')) {
            setError(path.slice('params.'.length), { type: 'server', message: messages[0] });
            placed++;
          }
        }
        setStatus({ tone: 'error', text: placed ? 'Some parameters are not valid: see the marked fields.' : error.message });
      } else {
        setStatus({ tone: 'error', text: String(error) });
      }
      return false;
    }
  };

  const submit = (event?: React.BaseSyntheticEvent) =>
    new Promise<boolean>((resolve) => {
      void handleSubmit(
        async (values) => resolve(await save(values)),
        () => {
          setStatus({ tone: 'error', text: 'Some parameters are not valid: see the marked fields.' });
          resolve(false);
        },
      )(event);
    });

  useImperativeHandle(ref, () => ({
    saveIfDirty: async () => (formState.isDirty ? submit() : true),
  }));

  const prefix = figureKind(kind).problemAt;
  const sweptIndex = kind === 'flux-sweep' ? Number((watched as FieldValues).sweep?.tube) : null;
  return (
    <FormProvider {...methods}>
      <form
        onSubmit={(e) => {
          e.preventDefault();
          void submit(e);
        }}
        noValidate
        className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]"
        data-testid="params-form"
      >
        <div className="space-y-6">
          {prefix === null ? null : (
            <>
              <WellFields prefix={prefix} />
              <GridFields prefix={prefix} />
              <TubeFields prefix={prefix} sweptIndex={sweptIndex} />
            </>
          )}
          <TaskFields kind={kind} />
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" busy={formState.isSubmitting} disabled={!formState.isDirty} data-testid="save-params">
              Save parameters
            </Button>
            <Button variant="quiet" onClick={() => reset()} disabled={!formState.isDirty}>
              Undo changes
            </Button>
            {status ? (
              <p role={status.tone === 'error' ? 'alert' : 'status'} className={`text-sm ${status.tone === 'error' ? 'text-red-700' : 'text-emerald-800'}`}>
                {status.text}
              </p>
            ) : formState.isDirty ? (
              <p className="text-sm text-phase-700">Unsaved changes (saved automatically when you run).</p>
            ) : null}
          </div>
        </div>
        {prefix === null ? null : (
          <div className="lg:sticky lg:top-4 lg:self-start">
            <p className="mb-2 text-xs font-medium text-slate-600">To scale, as you type</p>
            <WellDrawing params={normalizeSpec(watched as FieldValues)} idPrefix={`form-${figureId}`} lengthNm={lengthNm} />
          </div>
        )}
      </form>
    </FormProvider>
  );
});
