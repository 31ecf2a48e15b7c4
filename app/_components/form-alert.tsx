// A message box above or below a form: errors (role=alert, read out at once) or notices (role=status), and the
// one-line inline error shown beside a form's buttons. Both render nothing when there is no message.
import type { ReactNode } from 'react';
import { cn } from './cn';

export function FormAlert({ tone = 'error', children, className }: { tone?: 'error' | 'notice'; children: ReactNode; className?: string }) {
  if (!children) return null;
  return (
    <div
      role={tone === 'error' ? 'alert' : 'status'}
      className={cn(
        'rounded-lg px-3 py-2 text-sm',
        tone === 'error' ? 'bg-red-50 text-red-800 ring-1 ring-inset ring-red-200' : 'bg-flux-50 text-flux-900 ring-1 ring-inset ring-flux-200',
        className,
      )}
    >
      {children}
    </div>
  );
}

/** A one-line error beside a form's buttons (role=alert), in plain red text; nothing when there is no message. */
export function InlineAlert({ children }: { children: ReactNode }) {
  if (!children) return null;
  return (
    <p role="alert" className="text-sm text-red-700">
      {children}
    </p>
  );
}
