// The stable page of a frozen snapshot: the chart, caption, parameters, solver version, git commit, SHA-256, who froze
// it and when; the citation, BibTeX and LaTeX figure block with copy buttons; downloads; the figure's other versions.
import type { Metadata } from 'next';
import Link from 'next/link';
import { Card } from '../../_components/card';
import { RelativeTime } from '../../_components/relative-time';
import { DisplayUnitsProvider, DisplayUnitsSwitch } from '../../_components/figures/display-units';
import { FigureChart } from '../../_components/figures/figure-chart';
import { WellDrawing } from '../../_components/figures/well-drawing';
import { CopyBlock } from './copy-block';
import { SnapshotDownloads } from './downloads';
import { loadSnapshotPage } from './load-snapshot';

type Props = { params: Promise<{ snapshotId: string }> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { snapshotId } = await params;
  const data = await loadSnapshotPage({ snapshotId });
  return { title: `${data.snapshot.label} v${data.snapshot.version}` };
}

export default async function SnapshotPage({ params }: Props) {
  const { snapshotId } = await params;
  const data = await loadSnapshotPage({ snapshotId });
  const { snapshot, manuscript } = data;
  const others = data.siblings.filter((s) => s.version !== snapshot.version);
  const compareWith = others.at(-1);
  return (
    <DisplayUnitsProvider>
      <header className="mb-6 space-y-2">
        <p className="text-sm text-slate-500">
          <Link href={`/m/${manuscript.slug}`} className="hover:underline">
            {manuscript.title}
          </Link>{' '}
          ·{' '}
          <Link href={`/m/${manuscript.slug}/figures/${snapshot.label}`} className="hover:underline">
            figure {snapshot.label}
          </Link>
        </p>
        <div className="flex flex-wrap items-center gap-3">
          <h1 className="text-2xl font-semibold tracking-tight text-slate-900" data-testid="snapshot-title">
            {data.figureTitle || snapshot.label} <span className="text-phase-700">v{snapshot.version}</span>
          </h1>
          <span className="rounded-full bg-phase-100 px-2 py-0.5 text-xs font-semibold text-phase-700 ring-1 ring-phase-300">frozen · immutable</span>
        </div>
        <p className="text-sm text-slate-600">
          Frozen <RelativeTime iso={snapshot.frozenAt} />
          {data.frozenBy ? ` by ${data.frozenBy}` : ''} · stable address{' '}
          <code className="rounded bg-slate-100 px-1 font-mono text-xs">{data.url}</code>
        </p>
      </header>

      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="space-y-6">
          <Card title="Figure" actions={<DisplayUnitsSwitch />}>
            <FigureChart
              kind={snapshot.kind}
              data={data.data}
              params={snapshot.params}
              viewSpec={snapshot.viewSpec}
              label={`${snapshot.label} snapshot v${snapshot.version}`}
            />
            {snapshot.caption ? <p className="mt-3 text-sm leading-6 text-slate-700">{snapshot.caption}</p> : null}
          </Card>
          <Card title="Cite this snapshot">
            <div className="space-y-4">
              <CopyBlock label="Citation" text={data.citation} testId="citation" />
              <CopyBlock label="BibTeX" text={data.bibtex} testId="bibtex" />
              <CopyBlock label="LaTeX figure (one column)" text={data.latex.one} testId="latex" />
              <CopyBlock label="LaTeX figure (two columns)" text={data.latex.two} />
            </div>
          </Card>
        </div>
        <div className="space-y-6">
          <Card title="Provenance">
            <dl className="grid grid-cols-[8rem_minmax(0,1fr)] gap-x-3 gap-y-2 text-sm" data-testid="provenance">
              <dt className="text-slate-500">Kind</dt>
              <dd>{snapshot.kind}</dd>
              <dt className="text-slate-500">Solver</dt>
              <dd className="font-mono text-xs">{snapshot.solverVersion}</dd>
              <dt className="text-slate-500">Git commit</dt>
              <dd className="font-mono text-xs break-all">{snapshot.gitCommit ?? 'not recorded'}</dd>
              <dt className="text-slate-500">Result SHA-256</dt>
              <dd className="font-mono text-xs break-all" data-testid="result-hash">
                {snapshot.resultHash}
              </dd>
              <dt className="text-slate-500">Frozen</dt>
              <dd>
                {new Date(snapshot.frozenAt).toUTCString()}
                {data.frozenBy ? ` by ${data.frozenBy}` : ''}
              </dd>
            </dl>
          </Card>
          <Card title="Parameters">
            <WellDrawing params={snapshot.params} idPrefix={`snap-${snapshot.id}`} />
            <details className="mt-3">
              <summary className="cursor-pointer text-sm text-slate-700">Solver spec (JSON)</summary>
              <pre className="mt-2 max-h-80 overflow-auto rounded-md bg-slate-50 p-3 font-mono text-xs text-slate-800" data-testid="snapshot-params">
                {JSON.stringify(snapshot.params, null, 2)}
              </pre>
            </details>
          </Card>
          <Card title="Downloads">
            <SnapshotDownloads snapshotId={snapshot.id} />
          </Card>
          <Card title="Other versions">
            {others.length === 0 ? (
              <p className="text-sm text-slate-500">This is the only version.</p>
            ) : (
              <ul className="space-y-1 text-sm">
                {others.map((s) => (
                  <li key={s.id}>
                    <Link href={`/s/${s.id}`} className="text-flux-700 hover:underline">
                      v{s.version}
                    </Link>
                  </li>
                ))}
              </ul>
            )}
            {compareWith ? (
              <Link
                href={`/m/${manuscript.slug}/figures/${snapshot.label}/compare?a=${Math.min(compareWith.version, snapshot.version)}&b=${Math.max(compareWith.version, snapshot.version)}`}
                className="mt-3 inline-block text-sm text-flux-700 underline"
              >
                Compare v{Math.min(compareWith.version, snapshot.version)} with v{Math.max(compareWith.version, snapshot.version)}
              </Link>
            ) : null}
          </Card>
        </div>
      </div>
    </DisplayUnitsProvider>
  );
}
