/** Skeleton of the equipment schedule: header, controls and table rows. */
export default function Loading() {
  return (
    <div aria-busy="true" aria-label="Loading the equipment schedule" className="flex flex-col gap-3 p-4">
      <div className="h-6 w-56 animate-pulse rounded bg-surface-3" />
      <div className="flex gap-3">
        <div className="h-8 w-48 animate-pulse rounded bg-surface-2" />
        <div className="h-8 w-24 animate-pulse rounded bg-surface-2" />
      </div>
      <div className="flex flex-col gap-1 rounded border border-line p-2">
        {Array.from({ length: 10 }, (_, i) => (
          <div key={i} className="h-7 animate-pulse rounded bg-surface-2" />
        ))}
      </div>
    </div>
  );
}
