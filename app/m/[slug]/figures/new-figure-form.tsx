// The "new figure" form: label, computed kind and title; the figure starts with the kind's default parameters from the
// figure-kind registry (POST /api/manuscripts/[id]/figures), then opens on its own page to be tuned and run.
'use client';

import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { sendJson } from '@/lib/fetcher';
import { COMPUTED_FIGURE_KINDS, defaultParams, KIND_LABELS, type FigureKind } from '@/lib/figure-kinds/registry';
import { figureLabelSchema } from '@/lib/validations/figure';
import { Button } from '../../../_components/button';
import { SelectField, TextField } from '../../../_components/field';
import { InlineAlert } from '../../../_components/form-alert';
import { errorFields } from '../../../_components/form-fields';

export function NewFigureForm({ manuscriptId, manuscriptSlug }: { manuscriptId: string; manuscriptSlug: string }) {
  const router = useRouter();
  const [label, setLabel] = useState('');
  const [kind, setKind] = useState<FigureKind>('flux-sweep');
  const [title, setTitle] = useState('');
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [busy, setBusy] = useState(false);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const checked = figureLabelSchema.safeParse(label);
    if (!checked.success) {
      setErrors({ label: checked.error.issues.map((i) => i.message) });
      return;
    }
    setBusy(true);
    setErrors({});
    try {
      const { figure } = await sendJson<{ figure: { label: string } }>(`/api/manuscripts/${manuscriptId}/figures`, {
        method: 'POST',
        body: { label: checked.data, kind, title, params: defaultParams(kind) },
      });
      router.push(`/m/${manuscriptSlug}/figures/${figure.label}`);
    } catch (error) {
      setErrors(errorFields(error));
      setBusy(false);
    }
  };

  return (
    <form onSubmit={submit} className="space-y-3" noValidate>
      <TextField
        label="Label"
        hint="Used in notes: <Figure label=&quot;…&quot; />. Lower case, digits, hyphens."
        value={label}
        onChange={(e) => setLabel(e.target.value)}
        errors={errors.label}
        placeholder="spectral-flow"
        data-testid="new-figure-label"
      />
      <SelectField label="Kind" value={kind} onChange={(e) => setKind(e.target.value as FigureKind)} errors={errors.kind} data-testid="new-figure-kind">
        {COMPUTED_FIGURE_KINDS.map((k) => (
          <option key={k} value={k}>
            {KIND_LABELS[k]}
          </option>
        ))}
      </SelectField>
      <TextField label="Title" value={title} onChange={(e) => setTitle(e.target.value)} errors={errors.title} maxLength={200} />
      <InlineAlert>{errors._?.join(' ')}</InlineAlert>
      <Button type="submit" busy={busy} data-testid="create-figure">
        Create figure
      </Button>
    </form>
  );
}
