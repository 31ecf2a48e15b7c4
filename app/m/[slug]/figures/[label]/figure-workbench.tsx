// The working area of a figure page: the latest result drawn in the chosen display units, run / cancel / freeze,
// the snapshot list, and (for authors) the parameter form, title and caption, and the editable view spec.
'use client';

import { useRouter } from 'next/navigation';
import { useCallback, useMemo, useRef, useState } from 'react';
import type { FieldValues } from 'react-hook-form';
import { useFigure } from '@/app/_hooks/use-figure';
import { defaultViewSpec } from '@/lib/charts';
import { CHART_VIEWS, type FigureKind } from '@/lib/figure-kinds/registry';
import { Card } from '../../../../_components/card';
import { DisplayUnitsSwitch, useDisplayUnits } from '../../../../_components/figures/display-units';
import { FigureChart } from '../../../../_components/figures/figure-chart';
import { RunPanel } from '../../../../_components/figures/run-panel';
import { WellDrawing } from '../../../../_components/figures/well-drawing';
import type { FigureResponse, FigureView, RunResponse, RunView } from '@/lib/api-types';
import { FigureDetailsForm } from './details-form';
import { ParamsForm, type ParamsFormHandle } from './params-form';
import { SnapshotList, type SnapshotRow } from './snapshot-list';
import { ViewSpecEditor } from './view-spec-editor';

export interface FigureWorkbenchProps {
  figure: FigureView;
  manuscriptSlug: string;
  latestRun: RunView | null;
  latestResult: { run: RunView; data: unknown; params: unknown } | null;
  /** The figure, its snapshots and newest run as the page loaded them (GET /api/figures/[id]'s answer; the hook's fallback). */
  initial: FigureResponse;
  /** Names of the people who may have frozen snapshots (user id -> name), for the snapshot list. */
  people: Record<string, string>;
  can: { edit: boolean; run: boolean };
}

/** Strips inline data values from a spec (for showing the default view as text). */
function withoutData(spec: unknown): unknown {
  return JSON.parse(JSON.stringify(spec, (key, value) => (key === 'values' && Array.isArray(value) ? `[${value.length} rows]` : value)));
}

export function FigureWorkbench({ figure, manuscriptSlug, latestRun, latestResult, initial, people, can }: FigureWorkbenchProps) {
  const router = useRouter();
  // The figure as the API has it now (first the page's rows): its snapshot list refreshes after each freeze without reloading.
  const live = useFigure(figure.id, initial);
  const snapshots: SnapshotRow[] = (live.data ?? initial).snapshots.map((s) => ({
    id: s.id,
    version: s.version,
    frozenAt: s.frozenAt,
    frozenBy: s.frozenById ? (people[s.frozenById] ?? null) : null,
    resultHash: s.resultHash,
  }));
  const { units } = useDisplayUnits();
  const [shown, setShown] = useState(latestResult);
  const [viewSpec, setViewSpec] = useState(figure.viewSpec);
  const [params, setParams] = useState(figure.params);
  const form = useRef<ParamsFormHandle>(null);
  const kind = figure.kind as FigureKind;

  const onResult = useCallback((response: RunResponse) => {
    if (response.result) setShown({ run: response.run, data: response.result.data, params: response.run.params });
  }, []);

  const defaultView = useMemo(() => {
    if (!shown) return null;
    try {
      return withoutData(defaultViewSpec(kind, shown.data as never, { units, params: shown.params }));
    } catch {
      return null;
    }
  }, [kind, shown, units]);

  const lengthNm = units.system === 'physical' ? units.lengthNm : null;
  return (
    <div className="space-y-6">
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <Card
          title="Latest result"
          description={shown ? `Run of ${new Date(shown.run.createdAt).toUTCString()}${shown.run.fromCache ? ', served from the stored result' : ''}` : undefined}
          actions={<DisplayUnitsSwitch />}
        >
          {shown ? (
            <FigureChart kind={kind} data={shown.data} params={shown.params ?? params} viewSpec={viewSpec} label={`${figure.title || figure.label}, latest run`} />
          ) : (
            <p className="rounded-md bg-slate-50 p-8 text-center text-sm text-slate-500">No finished run yet.</p>
          )}
          <div className="mt-4 border-t border-slate-100 pt-4">
            <RunPanel
              figureId={figure.id}
              initialRun={latestRun}
              canRun={can.run}
              canFreeze={can.run}
              onResult={onResult}
              onFrozen={() => void live.mutate()}
              beforeRun={async () => (form.current ? form.current.saveIfDirty() : true)}
            />
          </div>
        </Card>
        <Card title="Snapshots" description="Frozen, numbered versions that others cite.">
          <SnapshotList snapshots={snapshots} compareHref={`/m/${manuscriptSlug}/figures/${figure.label}/compare`} />
        </Card>
      </div>

      <Card title="Parameters" description="Lengths in L, flux in flux quanta h/e, energies in ħ²/2mL².">
        {can.edit ? (
          <ParamsForm ref={form} figureId={figure.id} kind={kind} initial={figure.params as FieldValues} lengthNm={lengthNm} onSaved={setParams} />
        ) : (
          <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
            <pre className="max-h-96 overflow-auto rounded-md bg-slate-50 p-3 font-mono text-xs text-slate-800" data-testid="params-readonly">
              {JSON.stringify(params, null, 2)}
            </pre>
            <WellDrawing params={params} idPrefix={`ro-${figure.id}`} lengthNm={lengthNm} />
          </div>
        )}
      </Card>

      {can.edit ? (
        <div className="grid gap-6 lg:grid-cols-2">
          <Card title="Title and caption">
            <FigureDetailsForm figureId={figure.id} title={figure.title} caption={figure.caption} onSaved={() => router.refresh()} />
          </Card>
          <Card title="View" description="How the chart is drawn (Vega-Lite).">
            <ViewSpecEditor figureId={figure.id} viewSpec={viewSpec} defaultView={defaultView} views={CHART_VIEWS[kind] ?? []} onSaved={setViewSpec} />
          </Card>
        </div>
      ) : null}
    </div>
  );
}
