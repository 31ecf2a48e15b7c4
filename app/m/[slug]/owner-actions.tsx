// Owners' zone: archive or restore the manuscript, and delete it while no snapshot has been frozen
// (the button is disabled with the reason otherwise; the server refuses with 409 in any case).
'use client';

import { useRouter } from 'next/navigation';
import { useSWRConfig } from 'swr';
import { manuscriptsKey } from '@/app/_hooks/use-manuscripts';
import type { ManuscriptJson } from '@/lib/api-types';
import { ApiError, sendJson } from '@/lib/fetcher';
import { Card } from '../../_components/card';
import { ConfirmButton } from '../../_components/confirm-button';
import { useToast } from '../../_components/toaster';

export function OwnerActions({
  manuscript,
  snapshotCount,
  canDelete,
}: {
  manuscript: ManuscriptJson;
  snapshotCount: number;
  canDelete: boolean;
}) {
  const router = useRouter();
  const toast = useToast();
  const { mutate } = useSWRConfig();
  const archived = manuscript.archivedAt !== null;
  const deleteBlocked = snapshotCount > 0;

  async function setArchived(next: boolean) {
    try {
      await sendJson(`/api/manuscripts/${manuscript.id}/archive`, { method: 'POST', body: { archived: next } });
      toast(next ? 'Manuscript archived' : 'Manuscript restored');
      await mutate(manuscriptsKey('mine'));
      router.refresh();
    } catch (error) {
      toast(error instanceof ApiError ? error.message : 'That did not work', 'error');
    }
  }

  async function remove() {
    try {
      await sendJson(`/api/manuscripts/${manuscript.id}`, { method: 'DELETE' });
      toast('Manuscript deleted');
      await mutate(manuscriptsKey('mine'));
      router.push('/dashboard');
    } catch (error) {
      toast(error instanceof ApiError ? error.message : 'The manuscript could not be deleted', 'error');
    }
  }

  return (
    <Card title="Owner actions" tone="danger" id="owner-actions">
      <div className="space-y-5">
        <div className="flex flex-wrap items-center justify-between gap-3">
          <div className="max-w-md">
            <p className="text-sm font-medium text-slate-900">{archived ? 'Restore' : 'Archive'}</p>
            <p className="text-sm text-slate-600">
              {archived
                ? 'Make the manuscript editable again.'
                : 'Freeze all editing; members can still read it. You can restore it later.'}
            </p>
          </div>
          {archived ? (
            <ConfirmButton question="Restore?" confirmLabel="Restore" variant="secondary" onConfirm={() => setArchived(false)} testId="restore">
              Restore
            </ConfirmButton>
          ) : (
            <ConfirmButton question="Archive?" confirmLabel="Archive" variant="secondary" onConfirm={() => setArchived(true)} testId="archive">
              Archive
            </ConfirmButton>
          )}
        </div>
        <div className="flex flex-wrap items-center justify-between gap-3 border-t border-slate-100 pt-5">
          <div className="max-w-md">
            <p className="text-sm font-medium text-slate-900">Delete</p>
            <p className="text-sm text-slate-600" id="delete-reason">
              {deleteBlocked
                ? `Cannot be deleted: it has ${snapshotCount} frozen ${snapshotCount === 1 ? 'snapshot' : 'snapshots'}, which others may cite. Archive it instead.`
                : 'Removes the manuscript, its notes and figures for every member. This cannot be undone.'}
            </p>
          </div>
          <ConfirmButton
            question="Delete for everyone?"
            confirmLabel="Delete"
            onConfirm={remove}
            disabled={deleteBlocked || !canDelete}
            testId="delete-manuscript"
            describedBy="delete-reason"
          >
            Delete manuscript
          </ConfirmButton>
        </div>
      </div>
    </Card>
  );
}
