import { z } from "zod";
import { route } from "@/lib/api";
import { can } from "@/lib/authz";
import { workspaceSettingsSchema } from "@/features/energy/schema";
import { getWorkspaceSettings, updateWorkspaceSettings } from "@/features/team/settings";

const params = z.object({ ws: z.string().min(1) });

/** The workspace's settings: every member reads them; the owner changes them. */
export const GET = route({
  params,
  action: "workspace.read",
  handler: async ({ access }) => ({ settings: await getWorkspaceSettings(access!.workspace.id), canEdit: can(access!.role, "workspace.settings") }),
});

export const PATCH = route({
  params,
  body: workspaceSettingsSchema,
  action: "workspace.settings",
  handler: async ({ access, user, body }) => ({ settings: await updateWorkspaceSettings(access!.workspace.id, user, body) }),
});
