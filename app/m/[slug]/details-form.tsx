// Authors' and owners' form for the manuscript's title, abstract and status (PATCH /api/manuscripts/[id]).
// Shown only when the server grants `edit`; the route handler checks again.
'use client';

import { useRouter } from 'next/navigation';
import { useSWRConfig } from 'swr';
import { manuscriptsKey } from '@/app/_hooks/use-manuscripts';
import type { ManuscriptJson } from '@/lib/api-types';
import { sendJson } from '@/lib/fetcher';
import { MAX_ABSTRACT, MAX_TITLE } from '@/lib/validations/common';
import { updateManuscriptSchema } from '@/lib/validations/manuscript';
import { STATUS_LABELS } from '../../_components/badges';
import { Button } from '../../_components/button';
import { SelectField, TextAreaField, TextField } from '../../_components/field';
import { FormAlert } from '../../_components/form-alert';
import { useToast } from '../../_components/toaster';
import { useJsonForm } from '../../_components/use-json-form';

export function DetailsForm({ manuscript }: { manuscript: ManuscriptJson }) {
  const router = useRouter();
  const toast = useToast();
  const { mutate } = useSWRConfig();
  const { fields, message, busy, onSubmit } = useJsonForm(updateManuscriptSchema, async (data) => {
    await sendJson(`/api/manuscripts/${manuscript.id}`, { method: 'PATCH', body: data });
    await mutate(manuscriptsKey('mine'));
    toast('Details saved');
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-4" data-testid="details-form">
      {message && <FormAlert>{message}</FormAlert>}
      <TextField label="Title" name="title" defaultValue={manuscript.title} maxLength={MAX_TITLE} required errors={fields.title} />
      <TextAreaField
        label="Abstract"
        name="abstract"
        defaultValue={manuscript.abstract}
        maxLength={MAX_ABSTRACT}
        rows={5}
        errors={fields.abstract}
      />
      <SelectField label="Status" name="status" defaultValue={manuscript.status} errors={fields.status} containerClassName="max-w-xs">
        {Object.entries(STATUS_LABELS).map(([value, label]) => (
          <option key={value} value={value}>
            {label}
          </option>
        ))}
      </SelectField>
      <div className="flex justify-end">
        <Button type="submit" busy={busy}>
          Save details
        </Button>
      </div>
    </form>
  );
}
