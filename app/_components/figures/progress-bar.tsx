// An accessible progress bar for a solver run: fraction done, the solver's last message, and a status colour.
// Pure markup (no hooks), used by figure blocks and the figure page.

export interface ProgressBarProps {
  /** Fraction done in [0, 1]. */
  value: number;
  label: string;
  message?: string;
  tone?: 'active' | 'done' | 'failed' | 'cancelled';
}

const TONES: Record<NonNullable<ProgressBarProps['tone']>, string> = {
  active: 'bg-flux-600',
  done: 'bg-emerald-600',
  failed: 'bg-red-600',
  cancelled: 'bg-slate-400',
};

/** A determinate progress bar with its percentage and message. */
export function ProgressBar({ value, label, message, tone = 'active' }: ProgressBarProps) {
  const pct = Math.round(Math.min(1, Math.max(0, Number.isFinite(value) ? value : 0)) * 100);
  return (
    <div className="w-full" data-testid="run-progress">
      <div className="mb-1 flex justify-between text-xs text-slate-600">
        <span>{label}</span>
        <span aria-hidden="true">{pct}%</span>
      </div>
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={pct}
        aria-valuetext={message ? `${pct}% — ${message}` : `${pct}%`}
        className="h-2 w-full overflow-hidden rounded-full bg-slate-200"
      >
        <div className={`h-full transition-[width] duration-300 ${TONES[tone]}`} style={{ width: `${pct}%` }} />
      </div>
      {message ? <p className="mt-1 truncate text-xs text-slate-500">{message}</p> : null}
    </div>
  );
}
