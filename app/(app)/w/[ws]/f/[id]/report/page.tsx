import { pageAccess } from "@/lib/page-access";
import { AppError } from "@/lib/errors";
import { Forbidden } from "@/components/layout/forbidden";
import { reportQuery } from "@/features/report";
import { loadReport } from "@/features/report/queries";
import { CalculationReport } from "@/features/report/components/calculation-report";
import { PrintButton } from "@/features/report/components/print-button";

export const metadata = { title: "Calculation report" };

// Printing shows the report alone, black on white, with sections kept together where they fit.
const PRINT_CSS = `
@media print {
  @page { size: A4; margin: 14mm; }
  body * { visibility: hidden; }
  #calc-report, #calc-report * { visibility: visible; }
  #calc-report { position: absolute; left: 0; top: 0; width: 100%; max-width: none; padding: 0; background: #fff; color: #000; font-size: 9.5pt; }
  #calc-report .text-muted { color: #444; }
  #calc-report .report-block { break-inside: avoid; }
  #calc-report h2 { break-after: avoid; }
}`;

export default async function ReportPage({ params, searchParams }: PageProps<"/w/[ws]/f/[id]/report">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const q = reportQuery.safeParse(await searchParams);
  if (!q.success)
    return (
      <main className="p-4">
        <p role="alert" className="text-sm text-danger">
          ⚠ {q.error.issues[0].message}
        </p>
      </main>
    );
  let d;
  try {
    d = await loadReport(a.access.workspace.id, id, q.data.rev);
  } catch (e) {
    if (!(e instanceof AppError) || (e.code === "not_found" && !q.data.rev)) throw e;
    return (
      <main className="p-4">
        <p role="alert" className="text-sm text-danger">
          ⚠ The report cannot be produced: {e.message}
        </p>
      </main>
    );
  }
  return (
    <main className="flex flex-col gap-3 p-4">
      <style>{PRINT_CSS}</style>
      <div className="no-print flex items-center gap-3">
        <PrintButton />
        <p className="text-xs text-muted">Prints the report alone (A4); choose “Save as PDF” in the print dialog for a file.</p>
      </div>
      <CalculationReport d={d} unitSystem={a.user.unitSystem} generatedAt={new Date()} generatedBy={a.user.name} />
    </main>
  );
}
