import { route } from "@/lib/api";
import { makeDesign } from "@/lib/engine/options";
import { optionParams } from "@/features/options/schema";
import { editOptions } from "@/features/options/queries";

/** Makes an option the design (the former design takes its place): a new version and revision. */
export const POST = route({
  params: optionParams,
  action: "model.edit",
  handler: async ({ access, user, params }) =>
    editOptions({
      workspaceId: access!.workspace.id,
      facilityId: params.id,
      user,
      summary: `Plant option ${params.oid} made the design`,
      edit: (doc) => makeDesign(doc, params.oid),
    }),
});
