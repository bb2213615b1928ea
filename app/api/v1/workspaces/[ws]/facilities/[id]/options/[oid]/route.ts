import { route } from "@/lib/api";
import { deleteOption, renameOption, setAssessment } from "@/lib/engine/options";
import { optionParams, updateOptionSchema } from "@/features/options/schema";
import { editOptions } from "@/features/options/queries";

/** Rename a plant ("design" or an option) and/or change its leak rate, recovery or practical limit. */
export const PATCH = route({
  params: optionParams,
  body: updateOptionSchema,
  action: "model.edit",
  handler: async ({ access, user, params, body }) => {
    const { name, ...assessment } = body;
    return editOptions({
      workspaceId: access!.workspace.id,
      facilityId: params.id,
      user,
      summary: name !== undefined ? `Plant option renamed to "${name}"` : "Plant option assessment changed",
      edit: (doc) => {
        let d = name !== undefined ? renameOption(doc, params.oid, name) : doc;
        if (Object.keys(assessment).length) {
          // null clears a value back to its default: the key is dropped from the stored document.
          const patch = Object.fromEntries(Object.entries(assessment).map(([k, v]) => [k, v === null ? undefined : v]));
          d = setAssessment(d, params.oid, patch);
        }
        return JSON.parse(JSON.stringify(d));
      },
    });
  },
});

export const DELETE = route({
  params: optionParams,
  action: "model.edit",
  handler: async ({ access, user, params }) =>
    editOptions({
      workspaceId: access!.workspace.id,
      facilityId: params.id,
      user,
      summary: `Plant option ${params.oid} deleted`,
      edit: (doc) => deleteOption(doc, params.oid),
    }),
});
