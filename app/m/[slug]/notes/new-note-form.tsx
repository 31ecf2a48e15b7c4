// The "new note" form: a title (the slug is made from it), POST to the manuscript's notes, then on to the editor.
// The note starts with a short example of text and math that the author replaces.
'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { ApiError, sendJson } from '@/lib/fetcher';
import { createNoteSchema } from '@/lib/validations/note';
import { Button } from '../../../_components/button';
import { TextField } from '../../../_components/field';

const STARTER = `# Notes on the figure

Write the discussion here. Math works inline, $E_0(\\alpha)$, and on its own line:

$$
E_{m,n} = j_{|m-\\alpha|,n}^2 / R^2
$$
`;

export function NewNoteForm({ manuscriptId, manuscriptSlug }: { manuscriptId: string; manuscriptSlug: string }) {
  const router = useRouter();
  const [title, setTitle] = useState('');
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const parsed = createNoteSchema.safeParse({ title, source: STARTER });
    if (!parsed.success) {
      setErrors({ title: parsed.error.issues.map((i) => i.message) });
      return;
    }
    setBusy(true);
    try {
      const { note } = await sendJson<{ note: { slug: string } }>(`/api/manuscripts/${manuscriptId}/notes`, { method: 'POST', body: parsed.data });
      router.push(`/m/${manuscriptSlug}/notes/${note.slug}/edit`);
    } catch (error) {
      setErrors(error instanceof ApiError ? { title: [error.message, ...(error.fields.title ?? [])] } : { title: [String(error)] });
      setBusy(false);
    }
  };

  return (
    <form onSubmit={submit} className="space-y-3" noValidate>
      <TextField label="Title" name="title" value={title} onChange={(e) => setTitle(e.target.value)} errors={errors.title} maxLength={200} required />
      <Button type="submit" busy={busy}>
        Create and edit
      </Button>
    </form>
  );
}
