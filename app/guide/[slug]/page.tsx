// One guide for authors, rendered from content/guides/<slug>.mdx with @next/mdx (KaTeX math, the note Callout).
// The MDX is compiled at build time by @next/mdx; only the page around it renders per request.
import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { Callout } from '../../_components/notes/callout';
import { GUIDES } from '../guides';

type Props = { params: Promise<{ slug: string }> };

export function generateStaticParams() {
  return GUIDES.map((guide) => ({ slug: guide.slug }));
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  return { title: GUIDES.find((g) => g.slug === slug)?.title ?? 'Guide' };
}

export default async function GuidePage({ params }: Props) {
  const { slug } = await params;
  const guide = GUIDES.find((g) => g.slug === slug);
  if (!guide) notFound();
  const { Content } = guide;
  return (
    <div className="mx-auto max-w-3xl">
      <p className="mb-4 text-sm text-slate-500">
        <Link href="/guide" className="hover:underline">
          Guides
        </Link>
      </p>
      <article className="rounded-xl bg-white px-5 py-6 shadow-sm ring-1 ring-slate-200 sm:px-8 [&_table]:my-4 [&_table]:w-full [&_table]:text-sm [&_td]:border-b [&_td]:border-slate-200 [&_td]:px-2 [&_td]:py-1 [&_th]:border-b [&_th]:border-slate-300 [&_th]:px-2 [&_th]:py-1 [&_th]:text-left">
        <Content components={{ Callout }} />
      </article>
    </div>
  );
}
