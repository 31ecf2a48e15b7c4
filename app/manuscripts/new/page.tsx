// Start a manuscript: title and abstract; the creator becomes its owner.
// Any signed-in person may start a manuscript.
import type { Metadata } from 'next';
import { requireUser } from '../../_components/require-user';
import { NewManuscriptForm } from './new-manuscript-form';

export const metadata: Metadata = { title: 'New manuscript' };

export default async function NewManuscriptPage() {
  await requireUser('/manuscripts/new');
  return (
    <div className="mx-auto max-w-2xl">
      <h1 className="text-2xl font-semibold tracking-tight text-slate-900">New manuscript</h1>
      <p className="mt-1 text-sm text-slate-600">
        You will be its owner. Invite coauthors from the manuscript page once it exists.
      </p>
      <NewManuscriptForm />
    </div>
  );
}
