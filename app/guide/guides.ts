// The static guides for authors (MDX in content/guides, compiled by @next/mdx with math): slug, title and summary.
// The guide pages read this list; adding a guide means one MDX file and one entry here.
import type { MDXContent } from 'mdx/types';
import FiguresAndSnapshots from '@/content/guides/figures-and-snapshots.mdx';
import WritingFigureNotes from '@/content/guides/writing-figure-notes.mdx';

export interface Guide {
  slug: string;
  title: string;
  summary: string;
  Content: MDXContent;
}

export const GUIDES: Guide[] = [
  {
    slug: 'writing-figure-notes',
    title: 'Writing figure notes',
    summary: 'Markdown and math, the four components, figure blocks that follow a run or pin a snapshot, and revisions.',
    Content: WritingFigureNotes,
  },
  {
    slug: 'figures-and-snapshots',
    title: 'Figures, runs and snapshots',
    summary: 'Figure kinds, units, parameters and runs, freezing, citing, comparing, reproducing and exporting.',
    Content: FiguresAndSnapshots,
  },
];
