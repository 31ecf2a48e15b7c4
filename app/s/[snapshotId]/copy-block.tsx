// A read-only text block (citation, BibTeX, LaTeX) with a copy button that says when it copied.
// Falls back to asking the reader to copy by hand when the clipboard is not available.
'use client';

import { useState } from 'react';
import { Button } from '../../_components/button';

export function CopyBlock({ label, text, testId }: { label: string; text: string; testId?: string }) {
  const [copied, setCopied] = useState<'yes' | 'no' | null>(null);
  const copy = async () => {
    try {
      await navigator.clipboard.writeText(text);
      setCopied('yes');
    } catch {
      setCopied('no');
    }
    setTimeout(() => setCopied(null), 2000);
  };
  return (
    <div className="space-y-1.5">
      <div className="flex items-center justify-between gap-2">
        <p className="text-sm font-medium text-slate-800">{label}</p>
        <span className="flex items-center gap-2">
          <span role="status" className="text-xs text-slate-500">
            {copied === 'yes' ? 'Copied' : copied === 'no' ? 'Select the text and copy it' : ''}
          </span>
          <Button size="sm" variant="secondary" onClick={copy} aria-label={`Copy ${label}`}>
            Copy
          </Button>
        </span>
      </div>
      <pre className="overflow-x-auto rounded-md bg-slate-50 p-3 font-mono text-xs whitespace-pre-wrap text-slate-800 ring-1 ring-slate-200" data-testid={testId}>
        {text}
      </pre>
    </div>
  );
}
