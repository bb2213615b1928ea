import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { facilityParams } from "@/features/facilities/schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { MAX_BACKGROUND_BYTES } from "@/features/layout-canvas/schema";
import { deleteBackground, getBackground, putBackground } from "@/features/layout-canvas/queries";

/** The site plan drawn behind the canvas. */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    const bg = await getBackground(f.id);
    if (!bg) throw new AppError("not_found", "This facility has no site plan.");
    return new Response(new Uint8Array(bg.bytes), {
      headers: { "content-type": bg.mime, "cache-control": "private, max-age=60", "x-content-type-options": "nosniff" },
    });
  },
});

/** Upload: the raw file as the request body (PNG or JPEG, at most 5 MB, checked by its bytes). */
export const PUT = route({
  params: facilityParams,
  action: "model.edit",
  upload: { maxBytes: MAX_BACKGROUND_BYTES, what: "The site plan" },
  handler: async ({ upload, access, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    return { layout: await putBackground(f.id, new Uint8Array(upload!)) };
  },
});

export const DELETE = route({
  params: facilityParams,
  action: "model.edit",
  handler: async ({ access, params }) => {
    const f = await getFacilityRow(access!.workspace.id, params.id);
    return { layout: await deleteBackground(f.id) };
  },
});
