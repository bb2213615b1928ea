import { z } from "zod";
import { eq } from "drizzle-orm";
import { route } from "@/lib/api";
import { db } from "@/db/client";
import { users } from "@/db/schema";
import { myWorkspaces } from "@/features/team/queries";

export const GET = route({
  handler: async ({ user }) => ({
    user: { id: user.id, email: user.email, name: user.name, unitSystem: user.unitSystem, theme: user.theme },
    workspaces: await myWorkspaces(user.id),
  }),
});

const prefsSchema = z
  .object({
    unitSystem: z.enum(["SI", "IP"], { error: "unitSystem must be SI or IP" }).optional(),
    theme: z.enum(["system", "light", "dark"], { error: "theme must be system, light or dark" }).optional(),
    name: z.string().trim().min(1, "Name is required (1 to 80 characters)").max(80, "Name must be at most 80 characters").optional(),
  })
  .refine((v) => Object.keys(v).length > 0, { message: "Nothing to change" });

export const PATCH = route({
  body: prefsSchema,
  handler: async ({ user, body }) => {
    const [u] = await db.update(users).set(body).where(eq(users.id, user.id)).returning();
    return { user: { id: u.id, email: u.email, name: u.name, unitSystem: u.unitSystem, theme: u.theme } };
  },
});
