import Link from "next/link";
import { pageAccess } from "@/lib/page-access";
import { Forbidden } from "@/components/layout/forbidden";
import { ResultsUnavailable } from "@/components/layout/results-unavailable";
import { serverResults } from "@/features/ledger/queries";
import { LedgerView } from "@/features/ledger";

export const metadata = { title: "Heat ledger" };

export default async function LedgerPage({ params }: { params: Promise<{ ws: string; id: string }> }) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const r = await serverResults(a.access.workspace.id, id);
  if (!r.ok) return <ResultsUnavailable what="The heat ledger" version={r.version} message={r.message} layoutHref={`/w/${ws}/f/${id}/layout`} />;
  if (r.empty)
    return (
      <main className="max-w-2xl p-4 text-sm">
        <p>The heat ledger lists every room&apos;s loads, component by component, with the method behind each number.</p>
        <p className="mt-2">
          <Link className="text-accent hover:underline" href={`/w/${ws}/f/${id}/layout`}>
            Add a room on the Layout
          </Link>{" "}
          to start.
        </p>
      </main>
    );
  return <LedgerView ledger={r.result.ledger} s={a.user.unitSystem} meta={{ version: r.version, inputHash: r.inputHash, engineVersion: r.engineVersion }} />;
}
