import { describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { createFacility, duplicateFacility, getFacilityRow, listFacilities, setArchived, updateFacility } from "@/features/facilities/queries";
import { createFacilitySchema, updateFacilitySchema } from "@/features/facilities/schema";
import { parseOrThrow } from "@/lib/validation";
import { makeUser, makeWorkspace, SITE } from "../factories";

describe("facilities", () => {
  it("create, rename, duplicate, archive and restore, scoped to the workspace", async () => {
    const ws = await makeWorkspace();
    const other = await makeWorkspace();
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "North store", site: SITE });
    const renamed = await updateFacility(ws.id, f.id, { name: "North store A", baseVersion: 1 });
    expect(renamed.version).toBe(2);
    const copy = await duplicateFacility(ws.id, u.id, f.id);
    expect(copy.name).toBe("North store A (copy)");
    expect(copy.site).toEqual(renamed.site);
    await setArchived(ws.id, f.id, true);
    expect((await listFacilities(ws.id, false)).map((x) => x.id)).toEqual([copy.id]);
    expect((await listFacilities(ws.id, true)).map((x) => x.id)).toEqual([f.id]);
    await setArchived(ws.id, f.id, false);
    expect(await listFacilities(ws.id, false)).toHaveLength(2);
    await expect(getFacilityRow(other.id, f.id)).rejects.toMatchObject({ code: "not_found" });
  });

  it("a stale edit is refused with a conflict and changes nothing", async () => {
    const ws = await makeWorkspace();
    const u = await makeUser();
    const f = await createFacility(ws.id, u.id, { name: "Dock", site: SITE });
    await updateFacility(ws.id, f.id, { name: "Dock 1", baseVersion: 1 });
    await expect(updateFacility(ws.id, f.id, { name: "Dock B", baseVersion: 1 })).rejects.toMatchObject({ code: "conflict" });
    expect((await getFacilityRow(ws.id, f.id)).name).toBe("Dock 1");
  });

  it("validation names the field and the allowed range; nothing is stored", async () => {
    const before = await db.execute(sql`select count(*)::int as n from facilities`);
    const bad = { name: "", site: { ...SITE, designDryBulbC: 70, elevationM: -1000 } };
    let caught: { fieldErrors?: { field: string; message: string }[] } = {};
    try {
      parseOrThrow(createFacilitySchema, bad);
    } catch (e) {
      caught = e as typeof caught;
    }
    const fields = Object.fromEntries((caught.fieldErrors ?? []).map((f) => [f.field, f.message]));
    expect(fields["name"]).toMatch(/1 to 120/);
    expect(fields["site.designDryBulbC"]).toBe("Design dry bulb must be between -50 and 55 °C");
    expect(fields["site.elevationM"]).toBe("Elevation must be between -450 and 5000 m");
    expect(() => parseOrThrow(updateFacilitySchema, { site: { ...SITE, coincidentWetBulbC: 40 } })).toThrow(/must not exceed the design dry bulb/);
    expect(() => parseOrThrow(createFacilitySchema, { name: "x", site: { ...SITE, designDryBulbC: "abc" } })).toThrow(/Design dry bulb must be a number/);
    const after = await db.execute(sql`select count(*)::int as n from facilities`);
    expect(after.rows[0]).toEqual(before.rows[0]);
  });
});
