import type { NextRequest } from "next/server";
import { handlers } from "@/lib/auth";
import { refuseForeignOrigin } from "@/lib/api";

export const { GET } = handlers;

/** Sign-in and sign-out posts from another site are refused like every other change. */
export async function POST(req: NextRequest): Promise<Response> {
  return refuseForeignOrigin(req) ?? handlers.POST(req);
}
