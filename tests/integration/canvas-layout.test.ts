import { describe, expect, it } from "vitest";
import { createFacility } from "@/features/facilities/queries";
import { deleteBackground, getBackground, getLayout, putBackground, putLayout } from "@/features/layout-canvas/queries";
import { layoutPutSchema, MAX_BACKGROUND_BYTES } from "@/features/layout-canvas/schema";
import { makeUser, makeWorkspace, SITE } from "../factories";

// File signatures: PNG (ISO/IEC 15948 §5.2), JPEG SOI marker (ITU-T T.81 Annex B), PDF header (ISO 32000-1 §7.5.2).
const PNG = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
const PDF = new TextEncoder().encode("%PDF-1.7\n%âãÏÓ\n");
const GIF = new TextEncoder().encode("GIF89a\x01\x00\x01\x00");

async function facility() {
  const ws = await makeWorkspace();
  const u = await makeUser();
  return createFacility(ws.id, u.id, { name: "Layout test", site: SITE });
}

describe("canvas layout", () => {
  it("keeps node positions and viewport apart from the model, replacing them whole", async () => {
    const f = await facility();
    expect(await getLayout(f.id)).toEqual({ positions: {}, viewport: null, background: null });
    await putLayout(f.id, { positions: { "room:a": { x: 10, y: 20 }, outdoors: { x: -200, y: 0 } }, viewport: { x: 5, y: 6, zoom: 0.8 } });
    const l = await putLayout(f.id, { positions: { "room:a": { x: 40, y: 60 } } });
    expect(l.positions).toEqual({ "room:a": { x: 40, y: 60 } });
    expect(l.viewport).toEqual({ x: 5, y: 6, zoom: 0.8 });
  });

  it("refuses node ids and coordinates the canvas never makes, naming the field", () => {
    const r = layoutPutSchema.safeParse({ positions: { "pump:1": { x: 0, y: 0 }, "room:b": { x: Number.POSITIVE_INFINITY, y: 0 } } });
    expect(r.success).toBe(false);
    const fields = r.error!.issues.map((i) => i.path.join("."));
    expect(fields).toContain("positions.pump:1");
    expect(fields).toContain("positions.room:b.x");
  });

  it("stores a PNG site plan checked by its bytes; refuses PDF, other types and oversize with what to do", async () => {
    const f = await facility();
    const l = await putBackground(f.id, PNG);
    expect(l.background).toMatchObject({ mime: "image/png", widthM: 120 });
    const bg = await getBackground(f.id);
    expect(bg?.mime).toBe("image/png");
    expect(new Uint8Array(bg!.bytes)).toEqual(PNG);
    await expect(putBackground(f.id, PDF)).rejects.toMatchObject({ code: "validation", field: "file", message: expect.stringContaining("export the page as PNG or JPEG") });
    await expect(putBackground(f.id, GIF)).rejects.toMatchObject({ code: "validation", message: expect.stringContaining("PNG or JPEG") });
    const big = new Uint8Array(MAX_BACKGROUND_BYTES + 1);
    big.set(PNG);
    await expect(putBackground(f.id, big)).rejects.toMatchObject({ code: "validation", message: expect.stringContaining("limit is 5 MB") });
    // The refused uploads left the stored plan alone.
    expect((await getBackground(f.id))?.mime).toBe("image/png");
    expect((await deleteBackground(f.id)).background).toBeNull();
    expect(await getBackground(f.id)).toBeNull();
  });
});
