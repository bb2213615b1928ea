/** Shaped like the comparison: a header, a table of figures by plant, three charts. */
export default function Loading() {
  return (
    <main className="flex flex-col gap-4 p-4" aria-busy="true" aria-label="Loading the plant options">
      <div className="h-5 w-48 animate-pulse rounded bg-surface-3" />
      <div className="h-3 w-96 animate-pulse rounded bg-surface-3" />
      <div className="flex flex-col gap-2 rounded border border-line p-2">
        {Array.from({ length: 12 }, (_, i) => (
          <div key={i} className="flex gap-4">
            <div className="h-4 w-48 animate-pulse rounded bg-surface-3" />
            <div className="h-4 w-40 animate-pulse rounded bg-surface-3" />
            <div className="h-4 w-40 animate-pulse rounded bg-surface-3" />
          </div>
        ))}
      </div>
      <div className="grid gap-3 lg:grid-cols-3">
        {[0, 1, 2].map((i) => (
          <div key={i} className="h-64 animate-pulse rounded bg-surface-3" />
        ))}
      </div>
    </main>
  );
}
