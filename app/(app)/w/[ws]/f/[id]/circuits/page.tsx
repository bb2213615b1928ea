import Link from "next/link";
import { pageAccess } from "@/lib/page-access";
import { Forbidden } from "@/components/layout/forbidden";
import { ResultsUnavailable } from "@/components/layout/results-unavailable";
import { serverResults } from "@/features/ledger/queries";
import { circuitCards } from "@/features/circuits/queries";
import { CircuitsView } from "@/features/circuits";

export const metadata = { title: "Circuits" };

export default async function CircuitsPage({ params }: { params: Promise<{ ws: string; id: string }> }) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const r = await serverResults(a.access.workspace.id, id);
  if (!r.ok) return <ResultsUnavailable what="The circuits" version={r.version} message={r.message} layoutHref={`/w/${ws}/f/${id}/layout`} />;
  if (r.result.plant.circuits.length === 0)
    return (
      <main className="max-w-2xl p-4 text-sm">
        <p>Each circuit gets a card here: its refrigerant, temperatures, COP beside the Carnot COP, power and its cycle on a pressure–enthalpy chart.</p>
        <p className="mt-2">
          <Link className="text-accent hover:underline" href={`/w/${ws}/f/${id}/layout`}>
            Add a circuit on the Layout
          </Link>
          , feed it from an evaporator and connect it to a condenser.
        </p>
      </main>
    );
  const cards = await circuitCards(r.result);
  return <CircuitsView cards={cards} s={a.user.unitSystem} codesNotice={r.result.plant.codesNotice} meta={{ version: r.version, inputHash: r.inputHash, engineVersion: r.engineVersion }} />;
}
