import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { memberships, sessions } from "@/db/schema";
import { changeRole, createInvite, findOpenInvite, removeMember, revokeInvite } from "@/features/team/queries";
import { authorize } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { addMember, makeUser, makeWorkspace } from "../factories";

describe("workspace membership rules", () => {
  it("refuses to demote or remove the last owner, and allows it once there is another", async () => {
    const ws = await makeWorkspace();
    const a = await makeUser("A");
    const b = await makeUser("B");
    await addMember(ws.id, a.id, "owner");
    await addMember(ws.id, b.id, "designer");
    await expect(changeRole(ws.id, a.id, "designer")).rejects.toMatchObject({ code: "last_owner" });
    await expect(removeMember(ws.id, a.id)).rejects.toMatchObject({ code: "last_owner" });
    expect((await authorize(a.id, ws.slug, "members.invite")).role).toBe("owner");
    await changeRole(ws.id, b.id, "owner");
    await changeRole(ws.id, a.id, "viewer");
    const rows = await db.select().from(memberships).where(eq(memberships.workspaceId, ws.id));
    expect(rows.find((r) => r.userId === a.id)?.role).toBe("viewer");
  });

  it("concurrent demotions of two owners leave one owner (serialised per workspace)", async () => {
    const ws = await makeWorkspace();
    const a = await makeUser();
    const b = await makeUser();
    await addMember(ws.id, a.id, "owner");
    await addMember(ws.id, b.id, "owner");
    const results = await Promise.allSettled([changeRole(ws.id, a.id, "viewer"), changeRole(ws.id, b.id, "viewer")]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const owners = (await db.select().from(memberships).where(eq(memberships.workspaceId, ws.id))).filter((m) => m.role === "owner");
    expect(owners).toHaveLength(1);
  });

  it("removing a member ends their sessions at once and their access with it", async () => {
    const ws = await makeWorkspace();
    const owner = await makeUser();
    const m = await makeUser();
    await addMember(ws.id, owner.id, "owner");
    await addMember(ws.id, m.id, "designer");
    await db.insert(sessions).values({ userId: m.id, expiresAt: new Date(Date.now() + 86_400_000) });
    await removeMember(ws.id, m.id);
    expect(await db.select().from(sessions).where(eq(sessions.userId, m.id))).toHaveLength(0);
    await expect(authorize(m.id, ws.slug, "facility.read")).rejects.toBeInstanceOf(AppError);
  });

  it("authorize scopes by workspace: a member of one workspace is not found in another", async () => {
    const ws1 = await makeWorkspace();
    const ws2 = await makeWorkspace();
    const u = await makeUser();
    await addMember(ws1.id, u.id, "owner");
    await expect(authorize(u.id, ws2.slug, "facility.read")).rejects.toMatchObject({ code: "not_found" });
  });

  it("a revoked invitation's link stops working, and it cannot be revoked twice", async () => {
    const ws = await makeWorkspace();
    const owner = await makeUser();
    await addMember(ws.id, owner.id, "owner");
    const { invite, token } = await createInvite(ws.id, owner.id, `inv-${Date.now()}@example.test`, "viewer");
    expect((await findOpenInvite(token))?.invite.id).toBe(invite.id);
    await revokeInvite(ws.id, invite.id);
    expect(await findOpenInvite(token)).toBeNull();
    await expect(revokeInvite(ws.id, invite.id)).rejects.toMatchObject({ code: "not_found" });
  });
});
