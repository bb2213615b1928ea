import { z } from "zod";

export const emailSchema = z.string().trim().toLowerCase().email("E-mail must be a valid address");
export const passwordSchema = z
  .string()
  .min(10, "Password must be at least 10 characters")
  .max(200, "Password must be at most 200 characters");
export const emailOnlySchema = z.object({ email: emailSchema });
export const resetSchema = z.object({ token: z.string().min(20, "The reset link is incomplete").max(200), password: passwordSchema });
