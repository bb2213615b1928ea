import "server-only";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { facilityLayouts } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { sniffPlan } from "./image-type";
import { MAX_BACKGROUND_BYTES, type LayoutDto, type LayoutPut } from "./schema";

const DEFAULT_WIDTH_M = 120;

/** Node positions, viewport and whether a site plan is stored (the facility is checked by the caller). */
export async function getLayout(facilityId: string): Promise<LayoutDto> {
  const [row] = await db
    .select({
      positions: facilityLayouts.positions,
      viewport: facilityLayouts.viewport,
      mime: facilityLayouts.backgroundMime,
      widthM: facilityLayouts.backgroundWidthM,
      updatedAt: facilityLayouts.updatedAt,
    })
    .from(facilityLayouts)
    .where(eq(facilityLayouts.facilityId, facilityId));
  if (!row) return { positions: {}, viewport: null, background: null };
  return {
    positions: row.positions ?? {},
    viewport: row.viewport ?? null,
    background: row.mime ? { mime: row.mime, widthM: row.widthM ?? DEFAULT_WIDTH_M, updatedAt: row.updatedAt.toISOString() } : null,
  };
}

/** Positions replace the stored ones whole (the canvas always sends every node it shows). */
export async function putLayout(facilityId: string, body: LayoutPut): Promise<LayoutDto> {
  const set = {
    positions: body.positions,
    ...(body.viewport !== undefined ? { viewport: body.viewport } : {}),
    ...(body.backgroundWidthM !== undefined ? { backgroundWidthM: body.backgroundWidthM } : {}),
    updatedAt: new Date(),
  };
  await db
    .insert(facilityLayouts)
    .values({ facilityId, ...set })
    .onConflictDoUpdate({ target: facilityLayouts.facilityId, set });
  return getLayout(facilityId);
}

/**
 * Stores a site plan checked by its bytes: PNG or JPEG up to 5 MB. A PDF is recognised and
 * refused with what to do instead (the canvas draws images; a PDF page would need a renderer).
 */
export async function putBackground(facilityId: string, bytes: Uint8Array): Promise<LayoutDto> {
  if (bytes.byteLength === 0) throw new AppError("validation", "The site plan is empty: choose a PNG or JPEG file.", "file");
  if (bytes.byteLength > MAX_BACKGROUND_BYTES)
    throw new AppError("validation", `The site plan is ${(bytes.byteLength / 1048576).toFixed(1)} MB; the limit is 5 MB. Export it at a lower resolution.`, "file");
  const kind = sniffPlan(bytes);
  if (kind === "application/pdf")
    throw new AppError("validation", "PDF site plans are not drawn on the canvas: export the page as PNG or JPEG (any PDF viewer can) and upload that.", "file");
  if (!kind) throw new AppError("validation", "The site plan must be a PNG or JPEG image (checked by its content, not its name).", "file");
  const set = { backgroundImage: Buffer.from(bytes), backgroundMime: kind, updatedAt: new Date() };
  await db
    .insert(facilityLayouts)
    .values({ facilityId, ...set, backgroundWidthM: DEFAULT_WIDTH_M })
    .onConflictDoUpdate({ target: facilityLayouts.facilityId, set });
  return getLayout(facilityId);
}

export async function getBackground(facilityId: string): Promise<{ bytes: Buffer; mime: string } | null> {
  const [row] = await db
    .select({ bytes: facilityLayouts.backgroundImage, mime: facilityLayouts.backgroundMime })
    .from(facilityLayouts)
    .where(eq(facilityLayouts.facilityId, facilityId));
  return row?.bytes && row.mime ? { bytes: row.bytes, mime: row.mime } : null;
}

export async function deleteBackground(facilityId: string): Promise<LayoutDto> {
  await db
    .update(facilityLayouts)
    .set({ backgroundImage: null, backgroundMime: null, updatedAt: new Date() })
    .where(eq(facilityLayouts.facilityId, facilityId));
  return getLayout(facilityId);
}
