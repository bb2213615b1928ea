import { route } from "@/lib/api";
import { myWorkspaces } from "@/features/team/queries";

export const GET = route({ handler: async ({ user }) => ({ workspaces: await myWorkspaces(user.id) }) });
