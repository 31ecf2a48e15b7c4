// The component maps a figure note is rendered with: the allow-listed components (Figure, Callout, SnapshotRef, Units)
// bound to the manuscript's loaded figures, plus the note typography. One map for the live page, one for the preview.
import type { MDXComponents } from 'mdx/types';
import type { CalloutProps, FigureProps, SnapshotRefProps } from '@/lib/mdx/allowed-components';
import { describeUnits, DIMENSIONLESS } from '@/lib/units';
import { FigureBlock } from '../figures/figure-block';
import { Callout } from './callout';
import { FigurePlaceholder } from './figure-placeholder';
import type { NoteFigureData } from '@/lib/api-types';
import { noteElements } from './note-elements';
import { SnapshotRef } from './snapshot-ref';
import { UnitsLine } from './units-line';

/**
 * Components for the rendered note page: live figure blocks (client components that follow runs), citations
 * linking to snapshots, and the units line that follows the page's switch.
 *
 * @param canRun - whether the reader may start runs (authors and owners): shows run controls in the blocks
 */
export function liveNoteComponents(data: NoteFigureData, { canRun }: { canRun: boolean }): MDXComponents {
  return {
    ...noteElements,
    Figure: ({ label, version, height, caption }: FigureProps) => (
      <FigureBlock
        label={label}
        version={version}
        height={height}
        showCaption={caption !== false}
        entry={data.figures[label] ?? null}
        manuscriptSlug={data.manuscriptSlug}
        canRun={canRun}
      />
    ),
    Callout: (props: CalloutProps & { children?: React.ReactNode }) => <Callout {...props} />,
    SnapshotRef: ({ label, version }: SnapshotRefProps) => <SnapshotRef label={label} version={version} data={data} />,
    Units: () => <UnitsLine />,
  };
}

/** Components for the editor's live preview (static HTML, no client code): figure cards instead of live charts. */
export function previewNoteComponents(data: NoteFigureData): MDXComponents {
  return {
    ...noteElements,
    Figure: ({ label, version }: FigureProps) => <FigurePlaceholder label={label} version={version} data={data} />,
    Callout: (props: CalloutProps & { children?: React.ReactNode }) => <Callout {...props} />,
    SnapshotRef: ({ label, version }: SnapshotRefProps) => <SnapshotRef label={label} version={version} data={data} />,
    Units: () => <p className="my-3 text-sm italic text-slate-600">{describeUnits(DIMENSIONLESS)}</p>,
  };
}
