// A destructive action in two steps: the first press asks, the second (a different button) does it.
// Keeps keyboard focus on the confirming button so that Enter twice is a deliberate choice.
'use client';

import { useEffect, useRef, useState, type ReactNode } from 'react';
import { Button, type ButtonSize, type ButtonVariant } from './button';

export function ConfirmButton({
  children,
  confirmLabel,
  question,
  onConfirm,
  variant = 'danger',
  size = 'sm',
  disabled,
  testId,
  describedBy,
}: {
  children: ReactNode;
  confirmLabel: string;
  question: string;
  onConfirm: () => Promise<void> | void;
  variant?: ButtonVariant;
  size?: ButtonSize;
  disabled?: boolean;
  testId?: string;
  /** Id of the text that explains the action (or why it is disabled). */
  describedBy?: string;
}) {
  const [asking, setAsking] = useState(false);
  const [busy, setBusy] = useState(false);
  const confirmRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (asking) confirmRef.current?.focus();
  }, [asking]);

  if (!asking) {
    return (
      <Button variant={variant} size={size} disabled={disabled} onClick={() => setAsking(true)} data-testid={testId} aria-describedby={describedBy}>
        {children}
      </Button>
    );
  }
  return (
    <span className="inline-flex flex-wrap items-center gap-2" role="group" aria-label={question}>
      <span className="text-sm text-slate-700">{question}</span>
      <Button
        ref={confirmRef}
        variant="danger"
        size={size}
        busy={busy}
        data-testid={testId ? `${testId}-confirm` : undefined}
        onClick={async () => {
          setBusy(true);
          try {
            await onConfirm();
          } finally {
            setBusy(false);
            setAsking(false);
          }
        }}
      >
        {confirmLabel}
      </Button>
      <Button variant="quiet" size={size} onClick={() => setAsking(false)} disabled={busy}>
        Cancel
      </Button>
    </span>
  );
}
