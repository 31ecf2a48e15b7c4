// The editor's live preview: POST the source to /api/notes/preview at most every 500 ms after typing stops and keep
// the latest answer (rendered HTML, or the refusal with its lines). Stale answers of earlier keystrokes are dropped.
'use client';

import { useEffect, useRef, useState } from 'react';
import { ApiError, sendJson } from '@/lib/fetcher';
import type { NoteProblem } from '@/lib/mdx/check-note';

export const PREVIEW_DEBOUNCE_MS = 500;

export type PreviewState =
  | { status: 'idle' | 'loading' }
  | { status: 'ok'; html: string; warnings: NoteProblem[] }
  | { status: 'refused'; message: string; problems: NoteProblem[] }
  | { status: 'error'; message: string };

/** Debounced preview of `source` for a manuscript's figures. */
export function useNotePreview(manuscriptId: string, source: string): PreviewState {
  const [state, setState] = useState<PreviewState>({ status: 'idle' });
  const latest = useRef(0);
  useEffect(() => {
    const ticket = ++latest.current;
    const timer = setTimeout(async () => {
      setState((s) => (s.status === 'ok' || s.status === 'refused' ? s : { status: 'loading' }));
      try {
        const answer = await sendJson<{ html: string; warnings: NoteProblem[] }>('/api/notes/preview', {
          method: 'POST',
          body: { manuscriptId, source },
        });
        if (ticket === latest.current) setState({ status: 'ok', html: answer.html, warnings: answer.warnings ?? [] });
      } catch (error) {
        if (ticket !== latest.current) return;
        if (error instanceof ApiError && error.status === 400) {
          const lines = (error.fields.source ?? []).map((message) => {
            const match = /^line (\d+)/.exec(message);
            return { line: match ? Number(match[1]) : 1, column: 1, message };
          });
          setState({ status: 'refused', message: error.message, problems: lines });
        } else {
          setState({ status: 'error', message: error instanceof Error ? error.message : String(error) });
        }
      }
    }, PREVIEW_DEBOUNCE_MS);
    return () => clearTimeout(timer);
  }, [manuscriptId, source]);
  return state;
}
