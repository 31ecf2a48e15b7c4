// The SnapshotRef of figure notes: an inline citation "Fig. label v2" linking to the snapshot's stable page,
// or a visible warning when the note names a snapshot that does not exist (yet). Plain <a>: also rendered to static HTML.
import type { NoteFigureData } from '@/lib/api-types';

export interface SnapshotRefProps {
  label: string;
  version: number;
  data: NoteFigureData;
}

/** An inline link to a frozen snapshot of a figure of the same manuscript. */
export function SnapshotRef({ label, version, data }: SnapshotRefProps) {
  const snapshot = data.figures[label]?.snapshots.find((s) => s.version === version);
  if (!snapshot) {
    return (
      <span className="rounded bg-red-50 px-1 text-red-800" title="No such snapshot in this manuscript">
        [missing snapshot {label} v{version}]
      </span>
    );
  }
  return (
    <a href={`/s/${snapshot.id}`} className="font-medium text-flux-700 underline decoration-flux-300 underline-offset-2 hover:text-flux-900">
      Fig. {label} v{version}
    </a>
  );
}
