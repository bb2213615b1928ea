import { test, expect } from "@playwright/test";
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import { stateOf } from "./roles";

test.use({ storageState: stateOf("viewer") });

test("POST /api/v1/calculate and `npm run calc` return the same numbers for the same model", async ({ request }) => {
  const file = "seeds/data/harrowfield-facility.json";
  const model = JSON.parse(readFileSync(file, "utf8"));
  const r = await request.post("/api/v1/calculate", { data: model });
  expect(r.status()).toBe(200);
  const api = await r.json();
  const cli = JSON.parse(execFileSync("node_modules/.bin/tsx", ["scripts/calc.ts", file, "--compact"], { encoding: "utf8" }));
  expect(api.inputHash).toBe(cli.inputHash);
  expect(api.result.ledger.totals.requiredCapacityW).toBe(cli.result.ledger.totals.requiredCapacityW);
  expect(api.result.plant.circuits.map((c: { cop: number }) => c.cop)).toEqual(cli.result.plant.circuits.map((c: { cop: number }) => c.cop));
  // every circuit stays below its Carnot bound
  for (const c of api.result.plant.circuits) expect(c.cop).toBeLessThan(c.copCarnot);
});

test("calculate names the bad field", async ({ request }) => {
  const model = JSON.parse(readFileSync("seeds/data/harrowfield-facility.json", "utf8"));
  model.rooms[0].rhPct = 140;
  const r = await request.post("/api/v1/calculate", { data: model });
  expect(r.status()).toBe(400);
  const body = await r.json();
  expect(body.error.field).toBe("rooms.0.rhPct");
});

test("fluids API: list with metadata, a state, and a field-named range error", async ({ request }) => {
  const list = await (await request.get("/api/v1/fluids")).json();
  const ids = list.fluids.map((f: { id: string }) => f.id).sort();
  expect(ids).toEqual(["R1234zeE", "R134a", "R290", "R404A", "R448A", "R449A", "R454C", "R455A", "R507A", "R513A", "R717", "R744"].sort());
  // ISO 817 / ASHRAE 34 safety groups
  const group = Object.fromEntries(list.fluids.map((f: { id: string; safetyGroup: string }) => [f.id, f.safetyGroup]));
  expect(group).toMatchObject({ R717: "B2L", R744: "A1", R290: "A3", R1234zeE: "A2L" });
  const sat = await (await request.get("/api/v1/fluids/R717/state?by=satT&tK=273.15")).json();
  // Ammonia at 0 °C: 429.4 kPa (ASHRAE Handbook Fundamentals, R717 saturation table; from memory)
  expect(sat.saturation.pDewPa / 1000).toBeCloseTo(429.4, 0);
  const bad = await request.get("/api/v1/fluids/R717/state?by=satT&tK=100");
  expect(bad.status()).toBe(400);
  expect((await bad.json()).error.field).toBe("tK");
  const unknown = await request.get("/api/v1/fluids/R22/state?by=satT&tK=250");
  expect(unknown.status()).toBe(400);
});

test("the OpenAPI document is served and carries the model schema", async ({ request }) => {
  const doc = await (await request.get("/api/v1/openapi.json")).json();
  expect(doc.openapi).toBe("3.1.0");
  expect(doc.components.schemas.FacilityModel).toBeTruthy();
  expect(doc.paths["/api/v1/calculate"].post).toBeTruthy();
});
