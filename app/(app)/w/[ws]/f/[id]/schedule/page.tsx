import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { Forbidden } from "@/components/layout/forbidden";
import { scheduleDto } from "@/features/schedule/queries";
import { ScheduleTable } from "@/features/schedule/components/schedule-table";

export const metadata = { title: "Equipment schedule" };

export default async function SchedulePage({ params }: PageProps<"/w/[ws]/f/[id]/schedule">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  let dto;
  try {
    dto = await scheduleDto(a.access.workspace.id, id);
  } catch (e) {
    if (!(e instanceof AppError) || e.code === "not_found") throw e;
    return (
      <main className="p-4">
        <p role="alert" className="text-sm text-danger">
          ⚠ The schedule cannot be computed from the model: {e.message}
        </p>
        <p className="mt-1 text-sm text-muted">A designer fixes the model; the schedule follows from it.</p>
      </main>
    );
  }
  if (dto.rows.length === 0)
    return (
      <main className="p-4">
        <p className="text-sm text-muted">The equipment schedule lists every evaporator, compressor set and condenser of the plant. This model has no plant items yet; a designer adds them in the model.</p>
      </main>
    );
  return (
    <ScheduleTable ws={ws} facilityId={id} unitSystem={a.user.unitSystem} initial={dto} canExport={can(a.access.role, "schedule.export")} />
  );
}
