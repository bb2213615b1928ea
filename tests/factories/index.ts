import { randomUUID } from "node:crypto";
import { db } from "@/db/client";
import { memberships, users, workspaces } from "@/db/schema";

type Role = "owner" | "designer" | "operations" | "purchaser" | "viewer";

export async function makeWorkspace(name = "Test workspace") {
  const [ws] = await db.insert(workspaces).values({ slug: `t-${randomUUID().slice(0, 8)}`, name }).returning();
  return ws;
}

export async function makeUser(name = "Test person") {
  const [u] = await db.insert(users).values({ email: `${randomUUID().slice(0, 8)}@example.test`, name }).returning();
  return u;
}

export async function addMember(workspaceId: string, userId: string, role: Role) {
  await db.insert(memberships).values({ workspaceId, userId, role });
}

export const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 10, elevationM: 150 };
