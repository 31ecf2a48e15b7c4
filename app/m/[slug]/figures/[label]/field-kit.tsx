// Small react-hook-form field components for the parameter forms: numbers with their unit beside them, optional
// numbers, check boxes, text, lists of points typed as "x, y" lines, and JSON; each shows its inline error.
'use client';

import { useEffect, useId, useState, type ReactNode } from 'react';
import { Controller, get, useFormContext } from 'react-hook-form';

const INPUT =
  'block w-full rounded-md border-0 bg-white px-2 py-1.5 text-sm text-slate-900 shadow-sm ring-1 ring-inset ring-slate-300 ' +
  'focus:ring-2 focus:ring-inset focus:ring-flux-600 focus:outline-none aria-[invalid=true]:ring-red-400';

/** The error message at a field path (or one of its children's first message). */
export function useFieldError(name: string): string | undefined {
  const { formState } = useFormContext();
  const error = get(formState.errors, name) as { message?: unknown } | undefined;
  if (!error) return undefined;
  if (typeof error.message === 'string' && error.message) return error.message;
  if (typeof error === 'object') {
    for (const child of Object.values(error as Record<string, { message?: string }>)) {
      if (child && typeof child.message === 'string') return child.message;
    }
  }
  return undefined;
}

export function FieldError({ id, message }: { id: string; message?: string }) {
  if (!message) return null;
  return (
    <p id={id} className="mt-1 text-xs font-medium text-red-700">
      {message}
    </p>
  );
}

/** A labelled control with its hint (while it has no error) or its error underneath. */
function LabelledField({ id, label, hint, error, children }: { id: string; label: ReactNode; hint?: string; error?: string; children: ReactNode }) {
  return (
    <div>
      <label htmlFor={id} className="block text-xs font-medium text-slate-700">
        {label}
      </label>
      {children}
      {hint && !error ? <p className="mt-1 text-xs text-slate-500">{hint}</p> : null}
      <FieldError id={`${id}-e`} message={error} />
    </div>
  );
}

/** A number with its unit. Empty means NaN (required) or undefined (`optional`). */
export function NumberField({
  name,
  label,
  unit,
  hint,
  optional,
  step = 'any',
  className,
}: {
  name: string;
  label: ReactNode;
  unit?: string;
  hint?: string;
  optional?: boolean;
  step?: string;
  className?: string;
}) {
  const { register } = useFormContext();
  const id = useId();
  const error = useFieldError(name);
  return (
    <div className={className}>
      <label htmlFor={id} className="block text-xs font-medium text-slate-700">
        {label}
      </label>
      <div className="mt-1 flex items-center gap-1.5">
        <input
          id={id}
          type="number"
          step={step}
          inputMode="decimal"
          className={INPUT}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-e` : hint ? `${id}-h` : undefined}
          {...register(name, { setValueAs: (v) => (v === '' || v === null || v === undefined ? (optional ? undefined : NaN) : Number(v)) })}
        />
        {unit ? <span className="shrink-0 text-xs text-slate-500">{unit}</span> : null}
      </div>
      {hint && !error ? (
        <p id={`${id}-h`} className="mt-1 text-xs text-slate-500">
          {hint}
        </p>
      ) : null}
      <FieldError id={`${id}-e`} message={error} />
    </div>
  );
}

/** A point [x, y] as two number fields side by side. */
export function PointField({ name, label, unit = 'L' }: { name: string; label: string; unit?: string }) {
  const error = useFieldError(name);
  return (
    <fieldset>
      <legend className="text-xs font-medium text-slate-700">{label}</legend>
      <div className="mt-1 grid grid-cols-2 gap-2">
        <NumberField name={`${name}.0`} label={<span className="sr-only">{label} x</span>} unit={`x (${unit})`} />
        <NumberField name={`${name}.1`} label={<span className="sr-only">{label} y</span>} unit={`y (${unit})`} />
      </div>
      {typeof error === 'string' ? <p className="mt-1 text-xs font-medium text-red-700">{error}</p> : null}
    </fieldset>
  );
}

export function CheckboxField({ name, label, hint }: { name: string; label: ReactNode; hint?: string }) {
  const { register } = useFormContext();
  const id = useId();
  return (
    <div className="flex items-start gap-2">
      <input id={id} type="checkbox" className="mt-0.5 size-4 rounded border-slate-300 text-flux-700 focus:ring-flux-600" {...register(name)} />
      <label htmlFor={id} className="text-sm text-slate-700">
        {label}
        {hint ? <span className="block text-xs text-slate-500">{hint}</span> : null}
      </label>
    </div>
  );
}

/** Optional text (empty -> undefined). */
export function TextInputField({ name, label, hint, placeholder }: { name: string; label: ReactNode; hint?: string; placeholder?: string }) {
  const { register } = useFormContext();
  const id = useId();
  const error = useFieldError(name);
  return (
    <LabelledField id={id} label={label} hint={hint} error={error}>
      <input
        id={id}
        className={`${INPUT} mt-1 font-mono`}
        placeholder={placeholder}
        aria-invalid={error ? true : undefined}
        {...register(name, { setValueAs: (v) => (typeof v === 'string' && v.trim() === '' ? undefined : v) })}
      />
    </LabelledField>
  );
}

function pointsToText(points: unknown): string {
  return Array.isArray(points) ? points.map((p) => (Array.isArray(p) ? p.join(', ') : '')).join('\n') : '';
}

/** Parses "x, y" lines; returns null and the first bad line when one does not parse. */
export function parsePoints(text: string): { points: [number, number][] } | { error: string } {
  const points: [number, number][] = [];
  const lines = text.split('\n');
  for (let i = 0; i < lines.length; i++) {
    const line = lines[i].trim();
    if (!line) continue;
    const parts = line.split(/[\s,;]+/).filter(Boolean).map(Number);
    if (parts.length !== 2 || parts.some((n) => !Number.isFinite(n))) return { error: `line ${i + 1}: write two numbers "x, y"` };
    points.push([parts[0], parts[1]]);
  }
  return { points };
}

/** A list of points, one "x, y" per line (polygon corners, paths, loops). */
export function PointsField({ name, label, hint, unit = 'L' }: { name: string; label: string; hint?: string; unit?: string }) {
  const { control } = useFormContext();
  const id = useId();
  const schemaError = useFieldError(name);
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => <PointsText id={id} label={label} unit={unit} hint={hint} value={field.value} onChange={field.onChange} schemaError={schemaError} />}
    />
  );
}

function PointsText({
  id,
  label,
  unit,
  hint,
  value,
  onChange,
  schemaError,
}: {
  id: string;
  label: string;
  unit: string;
  hint?: string;
  value: unknown;
  onChange: (v: unknown) => void;
  schemaError?: string;
}) {
  const [text, setText] = useState(() => pointsToText(value));
  const [parseError, setParseError] = useState<string | null>(null);
  useEffect(() => {
    // Follow outside changes (a reset after saving) without fighting the user's typing.
    const parsed = parsePoints(text);
    if ('points' in parsed && JSON.stringify(parsed.points) === JSON.stringify(value)) return;
    if (Array.isArray(value)) setText(pointsToText(value));
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only when the form value changes
  }, [value]);
  const error = parseError ?? schemaError;
  return (
    <LabelledField
      id={id}
      label={
        <>
          {label} <span className="font-normal text-slate-500">(one “x, y” per line, in {unit})</span>
        </>
      }
      hint={hint}
      error={error}
    >
      <textarea
        id={id}
        rows={Math.min(8, Math.max(3, text.split('\n').length))}
        className={`${INPUT} mt-1 font-mono`}
        value={text}
        aria-invalid={error ? true : undefined}
        onChange={(e) => {
          setText(e.target.value);
          const parsed = parsePoints(e.target.value);
          if ('error' in parsed) {
            setParseError(parsed.error);
            onChange([]);
          } else {
            setParseError(null);
            onChange(parsed.points);
          }
        }}
      />
    </LabelledField>
  );
}

/** Any JSON value edited as text (for wells built from unions, differences or masks). */
export function JsonField({ name, label, hint }: { name: string; label: string; hint?: string }) {
  const { control } = useFormContext();
  const id = useId();
  const schemaError = useFieldError(name);
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => <JsonText id={id} label={label} hint={hint} value={field.value} onChange={field.onChange} schemaError={schemaError} />}
    />
  );
}

function JsonText({
  id,
  label,
  hint,
  value,
  onChange,
  schemaError,
}: {
  id: string;
  label: string;
  hint?: string;
  value: unknown;
  onChange: (v: unknown) => void;
  schemaError?: string;
}) {
  const [text, setText] = useState(() => JSON.stringify(value ?? null, null, 2));
  const [parseError, setParseError] = useState<string | null>(null);
  const error = parseError ?? schemaError;
  return (
    <LabelledField id={id} label={label} hint={hint} error={error}>
      <textarea
        id={id}
        rows={8}
        spellCheck={false}
        className={`${INPUT} mt-1 font-mono text-xs`}
        value={text}
        aria-invalid={error ? true : undefined}
        onChange={(e) => {
          setText(e.target.value);
          try {
            onChange(JSON.parse(e.target.value));
            setParseError(null);
          } catch (err) {
            setParseError(`Not valid JSON: ${err instanceof Error ? err.message : String(err)}`);
          }
        }}
      />
    </LabelledField>
  );
}
