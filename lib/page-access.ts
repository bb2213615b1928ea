import "server-only";
import { notFound } from "next/navigation";
import { authorize, type Action, type WorkspaceAccess } from "./authz";
import { AppError } from "./errors";
import { requireUser, type CurrentUser } from "./session";

export type PageAccess =
  | { ok: true; user: CurrentUser; access: WorkspaceAccess }
  | { ok: false; user: CurrentUser; message: string };

/** For pages: the same server-side check as the API; non-members get a 404, others a message. */
export async function pageAccess(ws: string, action: Action): Promise<PageAccess> {
  const user = await requireUser();
  try {
    return { ok: true, user, access: await authorize(user.id, ws, action) };
  } catch (e) {
    if (e instanceof AppError && e.code === "forbidden") return { ok: false, user, message: e.message };
    if (e instanceof AppError && e.code === "not_found") notFound();
    throw e;
  }
}
