import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, request as pwRequest } from "@playwright/test";
import { stateOf, WS } from "./roles";

/** The facility the stocking and schedule specs use: their own, so other specs' edits cannot reach it. */
const FACILITY_NAME = process.env.E2E_FACILITY_NAME ?? "Stocking checks e2e (invented)";
// The invented demo site (PRODUCT.md): 32 °C dry bulb, 23 °C wet bulb, 150 m.
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };

const fixture = (p: string) => {
  const { $comment, ...rest } = JSON.parse(readFileSync(path.resolve(p), "utf8"));
  void $comment;
  return rest;
};

/**
 * Finds or creates the facility with the invented demo model (seeds/data) and, as the designer,
 * records the invented installed plant (lib/engine/stocking/fixtures) if it has none.
 */
export async function facilityWithInstalledPlant(baseURL: string): Promise<string> {
  const designer = await pwRequest.newContext({ baseURL, storageState: stateOf("designer") });
  const list = await (await designer.get(`/api/v1/workspaces/${WS}/facilities`)).json();
  let id = (list.facilities as { id: string; name: string }[]).find((x) => x.name === FACILITY_NAME)?.id;
  if (!id) {
    const r = await designer.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name: FACILITY_NAME, site: SITE } });
    expect(r.status(), await r.text()).toBe(201);
    id = (await r.json()).facility.id as string;
  }
  const m = await (await designer.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
  if (!m.doc.plant?.installed) {
    const base = m.doc.rooms.length ? m.doc : fixture("seeds/data/harrowfield-model.json");
    const installed = fixture("lib/engine/stocking/fixtures/harrowfield-installed.json");
    const doc = { ...base, plant: { ...(base.plant ?? {}), installed } };
    const r = await designer.put(`/api/v1/workspaces/${WS}/facilities/${id}/model`, { data: { baseVersion: m.version, doc, summary: "installed plant recorded" } });
    expect(r.status(), await r.text()).toBe(200);
  }
  await designer.dispose();
  return id!;
}
