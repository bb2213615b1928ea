import { route, created } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { addOption, setStudy } from "@/lib/engine/options";
import { createOptionSchema, updateStudySchema } from "@/features/options/schema";
import { editOptions, newOptionId, optionsDto } from "@/features/options/queries";

/** The comparison of the design and every option (computed on the server). */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => optionsDto(access!.workspace.id, params.id),
});

/** A new option, copying the design plant (or the option named by `from`): a new version. */
export const POST = route({
  params: facilityParams,
  body: createOptionSchema,
  action: "model.edit",
  handler: async ({ access, user, params, body }) => {
    let id = "";
    const r = await editOptions({
      workspaceId: access!.workspace.id,
      facilityId: params.id,
      user,
      summary: `Plant option "${body.name}" created`,
      edit: (doc) => {
        id = newOptionId(doc);
        return addOption(doc, { id, name: body.name, from: body.from });
      },
    });
    return created({ option: { id, name: body.name }, version: r.version });
  },
});

/** What the options share: operating years and the grid emission factor. */
export const PATCH = route({
  params: facilityParams,
  body: updateStudySchema,
  action: "model.edit",
  handler: async ({ access, user, params, body }) =>
    editOptions({
      workspaceId: access!.workspace.id,
      facilityId: params.id,
      user,
      summary: "Plant options: study inputs changed",
      edit: (doc) => setStudy(doc, body),
    }),
});
