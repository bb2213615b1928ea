import { test, expect, type Page, type APIRequestContext } from "@playwright/test";
import { stateOf, WS } from "./roles";

const shot = (page: Page, name: string) => page.screenshot({ path: `.run/test/screenshots/${name}.png` });
const SITE = { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 };

async function newFacility(request: APIRequestContext, name: string, doc?: object): Promise<string> {
  const r = await request.post(`/api/v1/workspaces/${WS}/facilities`, { data: { name, site: SITE } });
  expect(r.status()).toBe(201);
  const id = (await r.json()).facility.id as string;
  if (doc) {
    const m = await (await request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    const put = await request.put(`/api/v1/workspaces/${WS}/facilities/${id}/model`, { data: { baseVersion: m.version, doc } });
    expect(put.status()).toBe(200);
  }
  return id;
}

const ROOM = {
  id: "cold-1",
  name: "Chill room",
  kind: "storage",
  lengthM: 12,
  widthM: 10,
  heightM: 6,
  setPointC: 2,
  rhPct: 85,
  surfaces: [
    { kind: "wall", along: "length", otherSide: "outdoors", uValueWm2K: 0.2 },
    { kind: "roof", otherSide: "outdoors", uValueWm2K: 0.2 },
  ],
};

const node = (page: Page, prefix: string) => page.locator(`.react-flow__node[data-id^="${prefix}"]`).last();
const figure = (page: Page, prefix: string, label: string) => node(page, prefix).locator(`[data-figure="${label}"]`);
const saved = (page: Page) => expect(page.locator("[data-save=saved]")).toBeVisible({ timeout: 20_000 });

test.describe("designer on the canvas", () => {
  test.use({ storageState: stateOf("designer") });

  test("draws a room, door, evaporator, circuit and condenser; figures update live; the save lands", async ({ page }) => {
    const id = await newFacility(page.request, `Canvas e2e ${Date.now()}`);
    await page.goto(`/w/${WS}/f/${id}/layout`);
    await expect(page.getByText("Draw the facility here.")).toBeVisible();

    await page.getByRole("button", { name: /^\+ Room/ }).click();
    const required = figure(page, "room:", "Required");
    await expect(required).toHaveText(/kW\(r\)/);
    const before = await required.textContent();
    await page.getByLabel("Set point").fill("-20");
    await expect(required).not.toHaveText(before!);
    await saved(page);
    // the facility header follows the autosaved version (it was created at version 1)
    await expect(page.locator("h2 ~ span").filter({ hasText: /^version / })).toHaveText(/^version [2-9]\d*$/);

    await page.getByRole("button", { name: /^\+ Door/ }).click();
    await page.getByLabel("Opens from").selectOption({ label: "Room 1" });
    await page.getByLabel("Opens to").selectOption({ label: "Outdoors" });
    await page.getByRole("button", { name: /^\+ Condenser/ }).click();
    await page.getByRole("button", { name: /^\+ Circuit/ }).click();
    await page.getByLabel("Refrigerant").selectOption("R290");
    await page.getByLabel("Rejects heat to").selectOption({ label: "Condenser CD-1" });
    await page.getByRole("button", { name: /^\+ Evaporator/ }).click();
    await page.getByLabel("Sits in room").selectOption({ label: "Room 1" });
    await page.getByLabel("Feeds circuit").selectOption({ label: "C-1 (R290)" });

    const cop = figure(page, "circuit:", "COP");
    await expect(cop).toHaveText(/^\d+\.\d\d$/, { timeout: 20_000 });
    await saved(page);
    const shaft = figure(page, "circuit:", "Shaft");
    const kwBefore = await required.textContent();
    const shaftBefore = await shaft.textContent();
    await shot(page, "canvas-designer-drawn");

    // More door traffic: the room's load and the compressor's shaft power go up.
    await node(page, "door:").click();
    await page.getByLabel("Passages").fill("900");
    await expect(required).not.toHaveText(kwBefore!);
    await expect(shaft).not.toHaveText(shaftBefore!);
    await saved(page);

    // A refused connection says why: a room does not connect to a condenser.
    await page.getByRole("button", { name: "Fit View" }).click();
    const from = await node(page, "room:").locator(".react-flow__handle-bottom").boundingBox();
    const to = await node(page, "condenser:").boundingBox();
    await page.mouse.move(from!.x + from!.width / 2, from!.y + from!.height / 2);
    await page.mouse.down();
    await page.mouse.move(to!.x + to!.width / 2, to!.y + 12, { steps: 12 });
    await page.mouse.move(to!.x + to!.width / 2, to!.y + to!.height / 2, { steps: 4 });
    await page.mouse.up();
    await expect(page.getByRole("alert").filter({ hasText: "Connection refused" })).toContainText("does not connect to a condenser");
    await shot(page, "canvas-refused-connection");

    // Reload: the model came back from the server.
    const kwSaved = await required.textContent();
    await page.reload();
    await expect(figure(page, "room:", "Required")).toHaveText(kwSaved!, { timeout: 20_000 });
    await expect(figure(page, "circuit:", "COP")).toHaveText(/^\d+\.\d\d$/);
    await node(page, "room:").click();
    await expect(page.getByLabel("Set point")).toHaveValue("-20");
    const m = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    expect(m.doc.rooms[0].setPointC).toBe(-20);
    expect(m.doc.doors[0].passagesPerDay).toBe(900);
    expect(m.doc.plant.circuits[0].refrigerant).toBe("R290");
  });

  test("two people edit the same field: the second sees the conflict, nothing is lost", async ({ browser, page }) => {
    const id = await newFacility(page.request, `Canvas conflict ${Date.now()}`, { schemaVersion: 1, rooms: [ROOM], doors: [], plant: {} });
    const other = await browser.newContext({ storageState: stateOf("designer") });
    const b = await other.newPage();
    await page.goto(`/w/${WS}/f/${id}/layout`);
    await b.goto(`/w/${WS}/f/${id}/layout`);
    for (const p of [page, b]) {
      await node(p, "room:").click();
      await expect(p.getByLabel("Set point")).toHaveValue("2");
    }
    await page.getByLabel("Set point").fill("-5");
    await saved(page);
    await b.getByLabel("Set point").fill("-8");
    const alert = b.getByRole("alert").filter({ hasText: "Someone saved version" });
    await expect(alert).toContainText("rooms");
    await shot(b, "canvas-conflict");
    await b.getByRole("button", { name: /^Load version/ }).click();
    await expect(b.getByLabel("Set point")).toHaveValue("-5");
    const m = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    expect(m.doc.rooms[0].setPointC).toBe(-5);
    await other.close();
  });
});

test.describe("walls, sun and doors in walls", () => {
  test.use({ storageState: stateOf("designer") });

  test("sets a wall's facing and colour, puts the door in that wall at its own U; the load follows and the model keeps it", async ({ page }) => {
    const door = { id: "d1", name: "Dock door", widthM: 3, heightM: 4, sides: ["cold-1", "outdoors"], passagesPerDay: 10 };
    const id = await newFacility(page.request, `Sun and doors ${Date.now()}`, { schemaVersion: 1, rooms: [ROOM], doors: [door], plant: {} });
    await page.goto(`/w/${WS}/f/${id}/layout`);
    const required = figure(page, "room:", "Required");
    await expect(required).toHaveText(/kW/, { timeout: 20_000 });
    await node(page, "room:").click();
    // The eight facings and three colours are the choices offered.
    const faces = page.getByLabel("Surface 1 faces");
    await expect(faces.locator("option")).toHaveText(["(none)", "N", "NE", "E", "SE", "S", "SW", "W", "NW"]);
    await expect(page.getByLabel("Surface 2 colour").locator("option")).toHaveText(["light", "medium", "dark"]);
    const before = await required.textContent();
    await faces.selectOption("SW");
    await page.getByLabel("Surface 1 colour").selectOption("dark");
    await page.getByLabel("Surface 2 colour").selectOption("light");
    await expect(required).not.toHaveText(before!);
    await saved(page);

    await node(page, "door:").click();
    await page.getByLabel("Sits in wall").selectOption({ label: "Chill room: wall SW (surface 1)" });
    await page.getByLabel("Door leaf U-value").fill("0.6");
    await saved(page);
    await page.getByLabel("Sits in wall").scrollIntoViewIfNeeded();
    await shot(page, "canvas-door-in-wall");
    await node(page, "room:").click();
    await page.getByLabel("Surface 2 colour").scrollIntoViewIfNeeded();
    await shot(page, "canvas-walls-sun");

    const m = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    expect(m.doc.rooms[0].surfaces[0]).toMatchObject({ orientation: "SW", colour: "dark" });
    expect(m.doc.rooms[0].surfaces[1]).toMatchObject({ colour: "light" });
    expect(m.doc.doors[0]).toMatchObject({ wall: { roomId: "cold-1", surfaceIndex: 0 }, uValueWm2K: 0.6 });
  });
});

test.describe("hot-gas defrost on the circuits page", () => {
  test.use({ storageState: stateOf("designer") });

  test("the circuit supplying the hot gas shows the defrost heat it carries and for which coil", async ({ page }) => {
    const plant = {
      evaporators: [{ id: "ev1", tag: "EV-1", roomId: "cold-1", circuitId: "c1", defrost: { type: "hot-gas" } }],
      circuits: [{ id: "c1", tag: "C-1", refrigerant: "R717", heatRejection: { to: "condenser", condenserId: "cd1" } }],
      condensers: [{ id: "cd1", tag: "CD-1", type: "evaporative" }],
    };
    const id = await newFacility(page.request, `Hot gas ${Date.now()}`, { schemaVersion: 1, rooms: [{ ...ROOM, setPointC: -20, rhPct: 90 }], doors: [], plant });
    await page.goto(`/w/${WS}/f/${id}/circuits`);
    const row = page.locator("dt", { hasText: "Hot-gas defrost carried" });
    await expect(row).toBeVisible({ timeout: 20_000 });
    await expect(row.locator("xpath=following-sibling::dd[1]")).toHaveText(/kW\(r\)/);
    await expect(page.locator("dl div", { hasText: "Hot-gas defrost carried" }).first()).toHaveAttribute("title", /EV-1 \(cold-1\)/);
    await shot(page, "circuits-hot-gas");
  });
});

test.describe("keyboard on the canvas", () => {
  test.use({ storageState: stateOf("designer") });

  test("arrow keys move a node (and the position is saved); copy, paste, undo and redo", async ({ page }) => {
    const id = await newFacility(page.request, `Canvas keys ${Date.now()}`, { schemaVersion: 1, rooms: [ROOM], doors: [], plant: {} });
    await page.goto(`/w/${WS}/f/${id}/layout`);
    const room = page.locator('.react-flow__node[data-id="room:cold-1"]');
    await expect(room.locator('[data-figure="Required"]')).toHaveText(/kW/);
    await room.click();
    await saved(page);
    for (let i = 0; i < 3; i++) await page.keyboard.press("ArrowRight");
    const layoutOf = async () => (await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/layout`)).json()).layout.positions["room:cold-1"];
    await expect.poll(layoutOf, { timeout: 10_000 }).toMatchObject({ y: expect.any(Number) });
    const moved = await layoutOf();
    await page.keyboard.press("ArrowRight");
    await expect.poll(async () => (await layoutOf()).x, { timeout: 10_000 }).toBeGreaterThan(moved.x);

    await page.keyboard.press("Control+c");
    await page.keyboard.press("Control+v");
    await expect(page.locator(".react-flow__node-room")).toHaveCount(2);
    await expect(page.getByText("Chill room (copy)").first()).toBeVisible();
    await page.keyboard.press("Control+z");
    await expect(page.locator(".react-flow__node-room")).toHaveCount(1);
    await page.keyboard.press("Control+Shift+z");
    await expect(page.locator(".react-flow__node-room")).toHaveCount(2);
    await saved(page);
    const m = await (await page.request.get(`/api/v1/workspaces/${WS}/facilities/${id}/model`)).json();
    expect(m.doc.rooms.map((r: { name: string }) => r.name)).toEqual(["Chill room", "Chill room (copy)"]);
  });
});

test.describe("viewer on the canvas", () => {
  test.use({ storageState: stateOf("viewer") });

  test("sees the demo layout read-only", async ({ page }) => {
    await page.goto(`/w/${WS}`);
    await page.getByRole("link", { name: /Harrowfield Cold Store — main building/ }).click();
    await page.getByRole("link", { name: "Layout" }).click();
    await expect(page.getByText(/Read-only: your role \(viewer\)/)).toBeVisible();
    await expect(page.getByRole("button", { name: /^\+ Room/ })).toHaveCount(0);
    await expect(figure(page, "room:frozen-store", "Required")).toHaveText(/kW\(r\)/, { timeout: 20_000 });
    await node(page, "room:frozen-store").click();
    await expect(page.getByLabel("Set point")).toBeDisabled();
    await shot(page, "canvas-viewer");
  });
});
