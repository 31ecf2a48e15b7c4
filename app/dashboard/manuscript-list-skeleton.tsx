// Placeholder cards while the manuscript list loads (used by the list itself and by the route's loading.tsx).
// A server-safe component (no client hooks), so loading.tsx can render it.
export function ManuscriptListSkeleton() {
  return (
    <ul className="grid gap-4 md:grid-cols-2" aria-busy="true" aria-label="Loading manuscripts">
      {[0, 1].map((index) => (
        <li key={index} className="h-36 animate-pulse rounded-xl bg-white p-5 ring-1 ring-slate-200">
          <div className="h-4 w-2/3 rounded bg-slate-200" />
          <div className="mt-3 h-3 w-1/4 rounded bg-slate-100" />
          <div className="mt-5 h-3 w-5/6 rounded bg-slate-100" />
        </li>
      ))}
    </ul>
  );
}
