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
