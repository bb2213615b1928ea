import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { getFluid, loadFluid } from "@/lib/engine/thermo";
import { buildSchedule, computeFacility, facilityModelSchema } from "@/lib/engine/model";
import { addOption } from "@/lib/engine/options";
import { compareOptions } from "@/lib/engine/compare-options";
import { HEADER_ROW, SHEETS, workbookBuffer, type WorkbookInput } from "./workbook";
import { OPTION_SHEETS } from "./option-sheets";

const root = path.resolve(__dirname, "../..");
const read = (p: string) => {
  const { $comment, ...rest } = JSON.parse(readFileSync(path.join(root, p), "utf8"));
  void $comment;
  return rest;
};

beforeAll(async () => {
  await Promise.all([loadFluid("R717"), loadFluid("R744")]);
});

function input(withOptions: boolean): WorkbookInput {
  let doc: Record<string, unknown> = { schemaVersion: 1, ...read("seeds/data/example-facility.json"), plant: read("lib/engine/plant/fixtures/harrowfield-plant.json") };
  doc = addOption(doc, { id: "o1", name: "Two LT standbys" });
  const m = facilityModelSchema.parse(doc);
  m.plantOptions[0].plant.circuits[0].compressor.units = 4;
  m.plantOptions[0].plant.circuits[0].compressor.standbyUnits = 2;
  const result = computeFacility(m);
  const annual = new Map([["design", { kWh: 1234567.891, monthly: Array.from({ length: 12 }, (_, i) => ({ kWh: 100000 + i + 0.125, loadKWh: 250000 + i, meanCOP: 2.5 })), peakKWe: 321.987, seasonalCOP: 2.4567, cost: { energy: 1, demand: 2, total: 185185.18 } }]]);
  const comparison = compareOptions(m, { getFluid, annual });
  return {
    facilityName: "Harrowfield Cold Store (invented)",
    result,
    schedule: buildSchedule(result.plant),
    site: { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 },
    rooms: m.rooms.map((r) => ({ id: r.id, name: r.name, setPointC: r.setPointC })),
    revision: { number: 3, letter: null, status: null, issued: false, checkedBy: null },
    unitSystem: "SI",
    exportedAt: new Date("2026-12-01T20:00:00Z"),
    exportedBy: "purchaser@harrowfield.example",
    options: withOptions ? { comparison, currency: "EUR", weatherLabel: "Invented demo year", codesNotice: "Local codes govern." } : undefined,
  };
}

async function load(i: WorkbookInput) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load((await workbookBuffer(i)) as unknown as ArrayBuffer);
  return wb;
}

const headers = (ws: ExcelJS.Worksheet) => (ws.getRow(HEADER_ROW).values as unknown[]).slice(1) as string[];

describe("options comparison in the Excel export", () => {
  it("adds its own sheets beside the schedule's, with units in the headers and full-precision numbers", async () => {
    const i = input(true);
    const wb = await load(i);
    expect(wb.worksheets.map((w) => w.name)).toEqual([...Object.values(SHEETS), ...Object.values(OPTION_SHEETS)]);
    const ws = wb.getWorksheet(OPTION_SHEETS.compare)!;
    const h = headers(ws);
    expect(h).toContain("Annual energy [kWh/year]");
    expect(h).toContain("Annual running cost [EUR/year]");
    expect(h).toContain("TEWI direct [kg CO2e]");
    expect(h).toContain("Refrigerant charge, estimate [kg]");
    const col = (name: string) => h.indexOf(name) + 1;
    const design = ws.getRow(HEADER_ROW + 1);
    const option = ws.getRow(HEADER_ROW + 2);
    expect(design.getCell(1).value).toBe("Design");
    expect(option.getCell(1).value).toBe("Two LT standbys");
    expect(design.getCell(col("Annual energy [kWh/year]")).value).toBe(1234567.891);
    expect(design.getCell(col("Annual running cost [EUR/year]")).value).toBe(185185.18);
    const c = i.options!.comparison.options;
    expect(design.getCell(col("Refrigerant charge, estimate [kg]")).value).toBe(c[0].charge!.totalKg);
    // The option has a fourth LT compressor as a second standby: more installed refrigeration, same rooms.
    const inst = col("Installed refrigeration [kW(r)]");
    expect(option.getCell(inst).value as number).toBeGreaterThan(design.getCell(inst).value as number);
    expect(option.getCell(col("Annual energy [kWh/year]")).value).toBeNull();
    const months = wb.getWorksheet(OPTION_SHEETS.monthly)!;
    expect(months.getRow(HEADER_ROW + 1).getCell(3).value).toBe(100000.125);
    const charge = wb.getWorksheet(OPTION_SHEETS.charge)!;
    expect(headers(charge)).toContain("Mean density [kg/m³]");
    expect(charge.rowCount - HEADER_ROW).toBe(c.reduce((s, o) => s + o.charge!.circuits.reduce((t, cc) => t + cc.parts.length, 0), 0));
    const aid = wb.getWorksheet(OPTION_SHEETS.codeAid)!;
    expect(String(aid.getCell(2, 1).value)).toContain("not a code check");
  });

  it("adds no option sheets to a facility without options", async () => {
    const wb = await load(input(false));
    expect(wb.worksheets.map((w) => w.name)).toEqual(Object.values(SHEETS));
  });
});
