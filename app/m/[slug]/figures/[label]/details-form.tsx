// A figure's title and caption (authors): the caption goes into snapshots, the LaTeX figure block and notes.
// Checked with the shared figure schemas before the PATCH; server messages are shown per field.
'use client';

import { useState } from 'react';
import { updateFigure } from '@/app/_hooks/use-figure';
import { figureCaptionSchema, figureTitleSchema } from '@/lib/validations/figure';
import { Button } from '../../../../_components/button';
import { TextAreaField, TextField } from '../../../../_components/field';
import { InlineAlert } from '../../../../_components/form-alert';
import { errorFields } from '../../../../_components/form-fields';

export function FigureDetailsForm({
  figureId,
  title: initialTitle,
  caption: initialCaption,
  onSaved,
}: {
  figureId: string;
  title: string;
  caption: string;
  onSaved?: (details: { title: string; caption: string }) => void;
}) {
  const [title, setTitle] = useState(initialTitle);
  const [caption, setCaption] = useState(initialCaption);
  const [saved, setSaved] = useState({ title: initialTitle, caption: initialCaption });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);
  const [status, setStatus] = useState<string | null>(null);
  const dirty = title !== saved.title || caption !== saved.caption;

  const save = async () => {
    const t = figureTitleSchema.safeParse(title);
    const c = figureCaptionSchema.safeParse(caption);
    const local: Record<string, string[]> = {};
    if (!t.success) local.title = t.error.issues.map((i) => i.message);
    if (!c.success) local.caption = c.error.issues.map((i) => i.message);
    setErrors(local);
    if (!t.success || !c.success) return;
    setBusy(true);
    try {
      await updateFigure(figureId, { title: t.data, caption: c.data });
      setSaved({ title: t.data, caption: c.data });
      setStatus('Saved.');
      onSaved?.({ title: t.data, caption: c.data });
    } catch (error) {
      setErrors(errorFields(error));
    } finally {
      setBusy(false);
    }
  };

  return (
    <div className="space-y-3">
      <TextField label="Title" value={title} onChange={(e) => setTitle(e.target.value)} errors={errors.title} maxLength={200} />
      <TextAreaField
        label="Caption"
        hint="Plain text; it goes with every snapshot and into the LaTeX figure block."
        value={caption}
        onChange={(e) => setCaption(e.target.value)}
        errors={errors.caption}
        maxLength={2000}
        className="min-h-24"
      />
      <div className="flex items-center gap-3">
        <Button size="sm" onClick={save} busy={busy} disabled={!dirty}>
          Save title and caption
        </Button>
        {status && !dirty ? <p className="text-sm text-emerald-800">{status}</p> : null}
        <InlineAlert>{errors._?.join(' ')}</InlineAlert>
      </div>
    </div>
  );
}
