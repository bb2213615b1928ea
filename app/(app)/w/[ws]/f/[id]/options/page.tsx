import { pageAccess } from "@/lib/page-access";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { Forbidden } from "@/components/layout/forbidden";
import { optionsDto } from "@/features/options/queries";
import { OptionsView } from "@/features/options/components/options-view";

export const metadata = { title: "Plant options" };

export default async function OptionsPage({ params }: PageProps<"/w/[ws]/f/[id]/options">) {
  const { ws, id } = await params;
  const a = await pageAccess(ws, "facility.read");
  if (!a.ok) return <Forbidden message={a.message} />;
  let dto;
  try {
    dto = await optionsDto(a.access.workspace.id, id);
  } catch (e) {
    if (!(e instanceof AppError) || e.code === "not_found") throw e;
    return (
      <main className="p-4">
        <p role="alert" className="text-sm text-danger">
          ⚠ The options cannot be compared: {e.message}
        </p>
        <p className="mt-1 text-sm text-muted">A designer fixes the model; the comparison follows from it.</p>
      </main>
    );
  }
  return <OptionsView ws={ws} facilityId={id} unitSystem={a.user.unitSystem} initial={dto} canEdit={can(a.access.role, "model.edit")} canExport={can(a.access.role, "schedule.export")} />;
}
