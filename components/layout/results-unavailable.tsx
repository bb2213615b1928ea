import Link from "next/link";

/** A view that cannot be computed for the current version: the reason, and where to fix it. */
export function ResultsUnavailable({ what, version, message, layoutHref }: { what: string; version: number; message: string; layoutHref: string }) {
  return (
    <main className="max-w-2xl p-4 text-sm">
      <p role="alert" className="text-danger">
        ⚠ {what} cannot be computed for version {version}: {message}
      </p>
      <p className="mt-2">
        <Link className="text-accent hover:underline" href={layoutHref}>
          Open the Layout
        </Link>{" "}
        to fix it (the problem is listed there against its item).
      </p>
    </main>
  );
}
