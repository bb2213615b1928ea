import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { workspaces } from "@/db/schema";
import { audit } from "@/lib/audit";
import type { WorkspaceSettings } from "@/features/energy/schema";

/** A workspace's settings (the currency running costs are shown in). */
export async function getWorkspaceSettings(workspaceId: string): Promise<WorkspaceSettings> {
  const [w] = await db.select({ currency: workspaces.currency }).from(workspaces).where(eq(workspaces.id, workspaceId)).limit(1);
  return { currency: w?.currency ?? "EUR" };
}

export async function updateWorkspaceSettings(workspaceId: string, actor: { id: string; email: string }, s: WorkspaceSettings): Promise<WorkspaceSettings> {
  const before = await getWorkspaceSettings(workspaceId);
  await db.update(workspaces).set({ currency: s.currency }).where(eq(workspaces.id, workspaceId));
  if (before.currency !== s.currency)
    await audit({ workspaceId, actorId: actor.id, actorEmail: actor.email, action: "workspace.updated", targetType: "workspace", targetId: workspaceId, detail: { currency: { from: before.currency, to: s.currency } } });
  return getWorkspaceSettings(workspaceId);
}
