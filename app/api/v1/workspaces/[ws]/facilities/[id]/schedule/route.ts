import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { scheduleDto } from "@/features/schedule/queries";

/** The equipment schedule with marks for what changed since the last export. */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => scheduleDto(access!.workspace.id, params.id),
});
