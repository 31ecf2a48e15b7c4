// Labelled form fields (text input, text area, select) with hint and per-field error messages wired to
// aria-describedby / aria-invalid, so screen readers announce what is wrong.
import { useId, type ComponentProps, type ReactNode } from 'react';
import { cn } from './cn';

const CONTROL =
  'block w-full rounded-lg border-0 bg-white px-3 py-2 text-sm text-slate-900 shadow-sm ring-1 ring-inset ring-slate-300 ' +
  'placeholder:text-slate-400 focus:ring-2 focus:ring-inset focus:ring-flux-600 focus:outline-none ' +
  'aria-[invalid=true]:ring-red-400 disabled:bg-slate-50 disabled:text-slate-500';

interface FieldShellProps {
  id: string;
  label: ReactNode;
  hint?: ReactNode;
  errors?: string[];
  children: ReactNode;
  className?: string;
}

function FieldShell({ id, label, hint, errors, children, className }: FieldShellProps) {
  return (
    <div className={cn('space-y-1.5', className)}>
      <label htmlFor={id} className="block text-sm font-medium text-slate-800">
        {label}
      </label>
      {children}
      {hint && !errors?.length && (
        <p id={`${id}-hint`} className="text-xs text-slate-500">
          {hint}
        </p>
      )}
      {errors?.length ? (
        <ul id={`${id}-errors`} className="space-y-0.5 text-xs font-medium text-red-700">
          {errors.map((message) => (
            <li key={message}>{message}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

function describedBy(id: string, hint: unknown, errors?: string[]): string | undefined {
  if (errors?.length) return `${id}-errors`;
  return hint ? `${id}-hint` : undefined;
}

interface CommonProps {
  label: ReactNode;
  hint?: ReactNode;
  errors?: string[];
  containerClassName?: string;
}

export function TextField({ label, hint, errors, containerClassName, className, id, ...props }: CommonProps & ComponentProps<'input'>) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  return (
    <FieldShell id={fieldId} label={label} hint={hint} errors={errors} className={containerClassName}>
      <input
        id={fieldId}
        className={cn(CONTROL, 'h-10', className)}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, errors)}
        {...props}
      />
    </FieldShell>
  );
}

export function TextAreaField({ label, hint, errors, containerClassName, className, id, ...props }: CommonProps & ComponentProps<'textarea'>) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  return (
    <FieldShell id={fieldId} label={label} hint={hint} errors={errors} className={containerClassName}>
      <textarea
        id={fieldId}
        className={cn(CONTROL, 'min-h-32 leading-relaxed', className)}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, errors)}
        {...props}
      />
    </FieldShell>
  );
}

export function SelectField({ label, hint, errors, containerClassName, className, id, children, ...props }: CommonProps & ComponentProps<'select'>) {
  const autoId = useId();
  const fieldId = id ?? autoId;
  return (
    <FieldShell id={fieldId} label={label} hint={hint} errors={errors} className={containerClassName}>
      <select
        id={fieldId}
        className={cn(CONTROL, 'h-10 pr-8', className)}
        aria-invalid={errors?.length ? true : undefined}
        aria-describedby={describedBy(fieldId, hint, errors)}
        {...props}
      >
        {children}
      </select>
    </FieldShell>
  );
}
