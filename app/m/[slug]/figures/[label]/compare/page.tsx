// Comparing two snapshots of a figure: which parameters differ (path, old and new value), how far the results differ
// (largest relative difference per field), solver versions and hashes, and both results drawn together in one chart.
import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { getFigureByLabel } from '@/db/queries/figures';
import { getResultById } from '@/db/queries/results';
import { listSnapshotsByFigure } from '@/db/queries/snapshots';
import { diffJson } from '@/lib/canonical-diff';
import { Card } from '../../../../../_components/card';
import { DisplayUnitsProvider, DisplayUnitsSwitch } from '../../../../../_components/figures/display-units';
import { requireManuscriptPage } from '../../../../../_components/figures/page-access';
import { SectionHeader } from '../../../../../_components/figures/section-header';
import { CompareChart } from './compare-chart';

type Props = {
  params: Promise<{ slug: string; label: string }>;
  searchParams: Promise<{ a?: string; b?: string }>;
};

export const metadata: Metadata = { title: 'Compare snapshots' };

function show(value: unknown): string {
  if (value === undefined) return '—';
  const text = JSON.stringify(value);
  return text.length > 80 ? `${text.slice(0, 77)}…` : text;
}

export default async function ComparePage({ params, searchParams }: Props) {
  const { slug, label } = await params;
  const query = await searchParams;
  const { manuscript } = await requireManuscriptPage({ slug, need: 'read', next: `/m/${slug}/figures/${label}/compare` });
  const figure = await getFigureByLabel({ manuscriptId: manuscript.id, label });
  if (!figure) notFound();
  const snapshots = await listSnapshotsByFigure({ figureId: figure.id });
  const va = Number(query.a);
  const vb = Number(query.b);
  const a = snapshots.find((s) => s.version === va);
  const b = snapshots.find((s) => s.version === vb);

  const header = <SectionHeader manuscript={manuscript} section="figures" title={`Compare snapshots of ${figure.title || figure.label}`} />;
  if (!a || !b) {
    return (
      <div>
        {header}
        <Card title="Choose two versions">
          <p className="mb-3 text-sm text-slate-600">
            {snapshots.length < 2 ? 'This figure needs at least two snapshots to compare.' : 'Pick the versions to compare:'}
          </p>
          <ul className="flex flex-wrap gap-2 text-sm">
            {snapshots.slice(1).map((s) => (
              <li key={s.id}>
                <Link className="text-flux-700 underline" href={`?a=${s.version - 1}&b=${s.version}`}>
                  v{s.version - 1} with v{s.version}
                </Link>
              </li>
            ))}
          </ul>
        </Card>
      </div>
    );
  }
  const [ra, rb] = await Promise.all([getResultById({ id: a.resultId }), getResultById({ id: b.resultId })]);
  if (!ra || !rb) notFound();
  const paramDiff = diffJson(a.params, b.params, { maxListed: 200 });
  const resultDiff = diffJson(ra.data, rb.data, { maxListed: 0 });

  return (
    <DisplayUnitsProvider>
      {header}
      <div className="space-y-6">
        <Card title={`v${a.version} and v${b.version} together`} actions={<DisplayUnitsSwitch />}>
          <CompareChart
            a={{ version: a.version, kind: a.kind, data: ra.data, params: a.params, viewSpec: (a.viewSpec as Record<string, unknown> | null) ?? null }}
            b={{ version: b.version, kind: b.kind, data: rb.data, params: b.params, viewSpec: (b.viewSpec as Record<string, unknown> | null) ?? null }}
          />
        </Card>
        <div className="grid gap-6 lg:grid-cols-2">
          <Card title="Parameter differences" description={paramDiff.equal ? 'The parameters are identical.' : `${paramDiff.count} difference${paramDiff.count === 1 ? '' : 's'}.`}>
            {paramDiff.equal ? null : (
              <table className="w-full text-sm" data-testid="param-diff">
                <thead>
                  <tr className="text-left text-xs text-slate-500">
                    <th className="py-1 pr-2 font-medium">Parameter</th>
                    <th className="py-1 pr-2 font-medium">
                      <Link href={`/s/${a.id}`} className="underline">
                        v{a.version}
                      </Link>
                    </th>
                    <th className="py-1 font-medium">
                      <Link href={`/s/${b.id}`} className="underline">
                        v{b.version}
                      </Link>
                    </th>
                  </tr>
                </thead>
                <tbody>
                  {paramDiff.differences.map((d) => (
                    <tr key={d.path} className="border-t border-slate-100 align-top">
                      <td className="py-1 pr-2 font-mono text-xs">{d.path || '(all)'}</td>
                      <td className="py-1 pr-2 font-mono text-xs text-red-800">{show(d.a)}</td>
                      <td className="py-1 font-mono text-xs text-emerald-800">{show(d.b)}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            )}
          </Card>
          <Card title="Result differences">
            <dl className="grid grid-cols-[9rem_minmax(0,1fr)] gap-x-3 gap-y-2 text-sm" data-testid="result-diff">
              <dt className="text-slate-500">Result hashes</dt>
              <dd className="font-mono text-xs break-all">
                v{a.version} {a.resultHash.slice(0, 16)}… {a.resultHash === b.resultHash ? '= ' : '≠ '}v{b.version} {b.resultHash.slice(0, 16)}…
              </dd>
              <dt className="text-slate-500">Solver</dt>
              <dd className="font-mono text-xs">
                {a.solverVersion}
                {a.solverVersion === b.solverVersion ? ' (both)' : ` → ${b.solverVersion}`}
              </dd>
              <dt className="text-slate-500">Differing values</dt>
              <dd>{resultDiff.count}</dd>
              <dt className="text-slate-500">Largest relative</dt>
              <dd>{resultDiff.largest ? `${resultDiff.largest.relativeDifference.toExponential(2)} at ${resultDiff.largest.path}` : 'none'}</dd>
            </dl>
            {resultDiff.fields.length ? (
              <ul className="mt-3 space-y-0.5 text-xs text-slate-600">
                {resultDiff.fields.slice(0, 12).map((f) => (
                  <li key={f.field}>
                    <code className="font-mono">{f.field}</code>: {f.count} value{f.count === 1 ? '' : 's'}
                    {f.largestRelativeDifference !== null ? `, up to ${f.largestRelativeDifference.toExponential(2)} relative` : ''}
                  </li>
                ))}
              </ul>
            ) : null}
          </Card>
        </div>
      </div>
    </DisplayUnitsProvider>
  );
}
