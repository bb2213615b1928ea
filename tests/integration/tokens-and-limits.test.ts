import { describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { emailTokens } from "@/db/schema";
import { consumeEmailToken, issueEmailToken } from "@/lib/email-tokens";
import { hashToken } from "@/lib/tokens";
import { makeUser } from "../factories";

describe("e-mail tokens", () => {
  it("are stored hashed, work once, and only for their purpose", async () => {
    const u = await makeUser();
    const token = await issueEmailToken(u.id, "signin_link");
    const rows = await db.select().from(emailTokens).where(eq(emailTokens.userId, u.id));
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(hashToken(token));
    expect(rows[0].tokenHash).not.toContain(token);
    expect(await consumeEmailToken(token, "password_reset")).toBeNull();
    expect(await consumeEmailToken(token, "signin_link")).toBe(u.id);
    expect(await consumeEmailToken(token, "signin_link")).toBeNull();
  });

  it("expire", async () => {
    const u = await makeUser();
    // issued 2 hours ago: past both the 15-minute link and the 60-minute reset lifetimes
    const token = await issueEmailToken(u.id, "password_reset", new Date(Date.now() - 2 * 3_600_000));
    expect(await consumeEmailToken(token, "password_reset")).toBeNull();
  });

  it("two concurrent uses of one token: exactly one succeeds", async () => {
    const u = await makeUser();
    const token = await issueEmailToken(u.id, "signin_link");
    const r = await Promise.all([consumeEmailToken(token, "signin_link"), consumeEmailToken(token, "signin_link")]);
    expect(r.filter((x) => x === u.id)).toHaveLength(1);
  });
});
