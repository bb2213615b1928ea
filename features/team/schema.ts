import { z } from "zod";
import { ROLE_NAMES } from "./roles";

export const roleSchema = z.enum(ROLE_NAMES, { error: `Role must be one of: ${ROLE_NAMES.join(", ")}` });
export const inviteSchema = z.object({
  email: z.string().trim().toLowerCase().email("E-mail must be a valid address"),
  role: roleSchema,
});
export const changeRoleSchema = z.object({ role: roleSchema });
export const memberParams = z.object({ ws: z.string().min(1), userId: z.string().uuid("Member id must be a UUID") });
export const acceptInviteSchema = z.object({
  token: z.string().min(20, "The invite link is incomplete").max(200),
  name: z.string().trim().min(1, "Name is required (1 to 80 characters)").max(80, "Name must be at most 80 characters").optional(),
  password: z.string().min(10, "Password must be at least 10 characters").max(200, "Password must be at most 200 characters").optional(),
});

export interface MemberDto {
  userId: string;
  email: string;
  name: string;
  role: (typeof ROLE_NAMES)[number];
  joinedAt: string;
}
export interface InviteDto {
  id: string;
  email: string;
  role: (typeof ROLE_NAMES)[number];
  expiresAt: string;
}
