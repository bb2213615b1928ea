import { readFileSync } from "node:fs";
import path from "node:path";
import { expect, request as pwRequest } from "@playwright/test";
import { stateOf, WS } from "./roles";

/** The demo facility (seeds/demo.ts) or another one named by E2E_FACILITY_NAME. */
const FACILITY_NAME = process.env.E2E_FACILITY_NAME ?? "Harrowfield Cold Store — main building (invented)";

/**
 * Finds the facility and, as the designer, records the invented installed plant
 * (lib/engine/stocking/fixtures) in its model if it has none, so there is something to check against.
 */
export async function facilityWithInstalledPlant(baseURL: string): Promise<string> {
  const designer = await pwRequest.newContext({ baseURL, storageState: stateOf("designer") });
  const list = await (await designer.get(`/api/v1/workspaces/${WS}/facilities`)).json();
  const f = (list.facilities as { id: string; name: string }[]).find((x) => x.name === FACILITY_NAME);
  expect(f, `facility "${FACILITY_NAME}"`).toBeTruthy();
  const m = await (await designer.get(`/api/v1/workspaces/${WS}/facilities/${f!.id}/model`)).json();
  if (!m.doc.plant?.installed) {
    const { $comment, ...installed } = JSON.parse(readFileSync(path.resolve("lib/engine/stocking/fixtures/harrowfield-installed.json"), "utf8"));
    void $comment;
    const doc = { ...m.doc, plant: { ...(m.doc.plant ?? {}), installed } };
    const r = await designer.put(`/api/v1/workspaces/${WS}/facilities/${f!.id}/model`, { data: { baseVersion: m.version, doc, summary: "installed plant recorded" } });
    expect(r.status(), await r.text()).toBe(200);
  }
  await designer.dispose();
  return f!.id;
}
