import { readFileSync } from "node:fs";
import path from "node:path";
import { test, expect } from "@playwright/test";
import { emailOf, stateOf, WS } from "./roles";
import { waitForMailLink } from "./mail";
import { facilityWithInstalledPlant } from "./stocking-fixture";

let facilityId: string;

test.beforeAll(async ({ baseURL }) => {
  facilityId = await facilityWithInstalledPlant(baseURL!);
});

test.describe("operations", () => {
  test.use({ storageState: stateOf("operations") });

  test("runs a stocking check, sees the verdict and e-mails it", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/stocking`);
    const form = page.getByRole("form", { name: "New stocking check" });
    if (!(await form.isVisible())) await page.getByRole("button", { name: "New check" }).click();
    const name = `Autumn apples ${Date.now()}`;
    await page.getByLabel("Name").fill(name);
    await page.getByLabel("Room", { exact: true }).selectOption("apples");
    await page.getByLabel("Intake").fill("40");
    await page.getByRole("button", { name: "Run the check" }).click();
    const verdict = page.getByRole("status", { name: "Verdict" });
    // 40 t/day is well over what the invented installed coil takes (the engine tests solve ~21.6 t/day).
    await expect(verdict).toContainText("Shortfall");
    await expect(verdict).toContainText("limiting item");
    await expect(page.getByText("What still fits")).toBeVisible();
    await page.getByRole("button", { name: "E-mail…" }).click();
    await page.getByLabel("Send the summary to").fill(emailOf("designer"));
    await page.getByRole("button", { name: "Send", exact: true }).click();
    await expect(page.getByText("Sent to 1 recipient.")).toBeVisible();
    const link = await waitForMailLink(emailOf("designer"), name);
    expect(link).toContain(`/w/${WS}/f/${facilityId}/stocking?s=`);
  });
});

test.describe("viewer", () => {
  test.use({ storageState: stateOf("viewer") });

  test("reads stocking checks but cannot create one", async ({ page }) => {
    await page.goto(`/w/${WS}/f/${facilityId}/stocking`);
    await expect(page.getByRole("heading", { name: "Stocking checks", exact: true })).toBeVisible();
    await expect(page.getByRole("button", { name: "New check" })).toHaveCount(0);
    const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities/${facilityId}/scenarios`, {
      data: { name: "not allowed", changes: { rooms: [{ roomId: "apples", tonnesPerDay: 10 }] } },
    });
    expect(r.status()).toBe(403);
    expect((await r.json()).error.message).toMatch(/may not create stocking checks/);
  });
});

test.describe("designer records installed coils and compressor stages", () => {
  test.use({ storageState: stateOf("designer") });

  test("sets a coil's feed on site and frost loss, and the two-stage circuit's compressor stage", async ({ page }) => {
    const read = (p: string) => {
      const { $comment, ...rest } = JSON.parse(readFileSync(path.resolve(p), "utf8"));
      void $comment;
      return rest;
    };
    const site = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };
    const r = await page.request.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name: `Installed stages ${Date.now()}`, site } });
    expect(r.status()).toBe(201);
    const id = (await r.json()).facility.id as string;
    const base = read("seeds/data/harrowfield-model.json");
    const m0 = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    const put = await page.request.put(`/api/v1/workspaces/${WS}/facilities/${id}/model`, {
      data: { baseVersion: m0.version, doc: { ...base, plant: { ...base.plant, installed: read("lib/engine/stocking/fixtures/harrowfield-installed.json") } } },
    });
    expect(put.status(), await put.text()).toBe(200);

    await page.goto(`/w/${WS}/f/${id}/stocking`);
    await page.getByRole("button", { name: "Edit ratings" }).click();
    // Only the two-stage circuit's set offers a stage; the single-stage one says so.
    await expect(page.getByLabel("CP-C-2 stage")).toHaveCount(0);
    await page.getByLabel("CP-C-1 stage").selectOption("high");
    await page.getByLabel("EV-3 feed on site").selectOption("pumped");
    const frost = page.getByLabel("EV-1 frost loss, %");
    await frost.fill("15");
    await frost.blur();
    await page.screenshot({ path: ".run/test/screenshots/installed-stage-feed-frost.png", fullPage: true });
    await page.getByRole("button", { name: "Save installed plant" }).click();
    await expect(page.getByText(/Installed plant recorded as model version/)).toBeVisible();
    const m = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    const inst = m.doc.plant.installed;
    expect(inst.compressors.find((c: { tag: string }) => c.tag === "CP-C-1").stage).toBe("high");
    expect(inst.evaporators.find((e: { tag: string }) => e.tag === "EV-3").siteFeed).toBe("pumped");
    expect(inst.evaporators.find((e: { tag: string }) => e.tag === "EV-1").frostCapacityLoss).toBeCloseTo(0.15, 9);
  });
});
