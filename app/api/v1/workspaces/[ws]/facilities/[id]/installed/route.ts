import { route } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { installedQuery, saveInstalledSchema } from "@/features/stocking-check/schema";
import { installedDto, saveInstalled } from "@/features/stocking-check/queries";

/** The installed plant the stocking checks compare with, and a proposal from the design. */
export const GET = route({
  params: facilityParams,
  query: installedQuery,
  action: "facility.read",
  handler: async ({ access, params, query }) => installedDto(access!.workspace.id, params.id, query.margin),
});

/** Records the installed plant in the model (a new version). */
export const PUT = route({
  params: facilityParams,
  body: saveInstalledSchema,
  action: "model.edit",
  handler: async ({ access, user, params, body }) =>
    saveInstalled({ workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, userEmail: user.email, baseVersion: body.baseVersion, installed: body.installed }),
});
