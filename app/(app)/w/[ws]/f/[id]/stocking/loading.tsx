/** Skeleton of the stocking checks view: the list on the left, a verdict and its item table on the right. */
export default function Loading() {
  return (
    <div aria-busy="true" aria-label="Loading stocking checks" className="grid flex-1 grid-cols-1 gap-4 p-4 lg:grid-cols-[20rem_1fr]">
      <div className="flex flex-col gap-2">
        <div className="h-5 w-32 animate-pulse rounded bg-surface-3" />
        {[0, 1, 2].map((i) => (
          <div key={i} className="h-16 animate-pulse rounded border border-line bg-surface-2" />
        ))}
      </div>
      <div className="flex flex-col gap-3">
        <div className="h-6 w-64 animate-pulse rounded bg-surface-3" />
        <div className="h-9 w-96 animate-pulse rounded bg-surface-3" />
        {[0, 1, 2, 3, 4, 5].map((i) => (
          <div key={i} className="h-6 animate-pulse rounded bg-surface-2" />
        ))}
      </div>
    </div>
  );
}
