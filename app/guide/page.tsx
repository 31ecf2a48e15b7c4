// The guides for authors: a short index of the static MDX guides.
// Linked from the figure notes pages.
import type { Metadata } from 'next';
import Link from 'next/link';
import { GUIDES } from './guides';

export const metadata: Metadata = { title: 'Guides' };

export default function GuidesPage() {
  return (
    <div className="mx-auto max-w-3xl">
      <h1 className="mb-6 text-3xl font-semibold tracking-tight text-slate-900">Guides for authors</h1>
      <ul className="space-y-4">
        {GUIDES.map((guide) => (
          <li key={guide.slug} className="rounded-xl bg-white p-5 shadow-sm ring-1 ring-slate-200">
            <Link href={`/guide/${guide.slug}`} className="text-lg font-semibold text-flux-800 hover:underline">
              {guide.title}
            </Link>
            <p className="mt-1 text-sm text-slate-600">{guide.summary}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
