import { pageAccess } from "@/lib/page-access";
import { Forbidden } from "@/components/layout/forbidden";
import { listAudit } from "@/features/audit/queries";

export const metadata = { title: "Audit log" };

export default async function AuditPage({ params }: PageProps<"/w/[ws]/audit">) {
  const { ws } = await params;
  const a = await pageAccess(ws, "audit.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  const rows = await listAudit(a.access.workspace.id, { limit: 200 });
  return (
    <main className="p-4">
      <p className="mb-2 text-xs text-muted">Append-only record of sign-ins, role changes, model edits, scenario applications and exports. Latest 200.</p>
      <table className="w-full text-sm">
        <thead>
          <tr className="border-b border-line text-left text-xs text-muted">
            <th className="py-1.5 font-medium">When (UTC)</th>
            <th className="py-1.5 font-medium">Who</th>
            <th className="py-1.5 font-medium">What</th>
            <th className="py-1.5 font-medium">Detail</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-line/60 align-top">
              <td className="py-1 pr-3 font-mono text-xs">{r.at.toISOString().replace("T", " ").slice(0, 19)}</td>
              <td className="py-1 pr-3">{r.actorEmail ?? "—"}</td>
              <td className="py-1 pr-3 font-mono text-xs">{r.action}</td>
              <td className="py-1 font-mono text-xs text-muted">{JSON.stringify(r.detail)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </main>
  );
}
