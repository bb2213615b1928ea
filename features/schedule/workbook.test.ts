import { readFileSync } from "node:fs";
import path from "node:path";
import ExcelJS from "exceljs";
import { beforeAll, describe, expect, it } from "vitest";
import { loadFluid } from "@/lib/engine/thermo";
import { buildSchedule, computeFacility, facilityModelSchema, type FacilityModel } from "@/lib/engine/model";
import { convert } from "@/lib/units";
import { HEADER_ROW, SHEETS, scheduleCsv, workbookBuffer, type WorkbookInput } from "./workbook";
import { scheduleChanges } from "./changes";
import { csvField, neutralise } from "./safe-text";

const root = path.resolve(__dirname, "../..");
const read = (p: string) => {
  const { $comment, ...rest } = JSON.parse(readFileSync(path.join(root, p), "utf8"));
  void $comment;
  return rest;
};

function model(roomName?: (name: string, i: number) => string): FacilityModel {
  const ledger = read("seeds/data/example-facility.json");
  if (roomName) ledger.rooms = ledger.rooms.map((r: { name: string }, i: number) => ({ ...r, name: roomName(r.name, i) }));
  return facilityModelSchema.parse({ schemaVersion: 1, ...ledger, plant: read("lib/engine/plant/fixtures/harrowfield-plant.json") });
}

function input(m: FacilityModel, unitSystem: "SI" | "IP" = "SI"): WorkbookInput {
  const result = computeFacility(m);
  return {
    facilityName: "Harrowfield Cold Store (invented)",
    result,
    schedule: buildSchedule(result.plant),
    site: { designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 },
    rooms: m.rooms.map((r) => ({ id: r.id, name: r.name, setPointC: r.setPointC })),
    revision: { number: 3, letter: "B", status: "for tender", issued: true, checkedBy: "A. Checker" },
    unitSystem,
    exportedAt: new Date("2026-12-01T20:00:00Z"),
    exportedBy: "purchaser@harrowfield.example",
  };
}

/** A small RFC 4180 reader for the checks (quoted fields, doubled quotes, CRLF). */
function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') (field += '"'), i++;
      else if (ch === '"') quoted = false;
      else field += ch;
    } else if (ch === '"') quoted = true;
    else if (ch === ",") row.push(field), (field = "");
    else if (ch === "\r" && text[i + 1] === "\n") {
      row.push(field);
      rows.push(row);
      row = [];
      field = "";
      i++;
    } else field += ch;
  }
  return rows;
}

async function readBack(buf: Buffer): Promise<ExcelJS.Workbook> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(buf as unknown as ArrayBuffer);
  return wb;
}

/** Column index (1-based) of a header on a sheet's header row. */
function col(ws: ExcelJS.Worksheet, header: string, row = HEADER_ROW): number {
  let found = 0;
  ws.getRow(row).eachCell((c, i) => {
    if (c.value === header) found = i;
  });
  if (!found) throw new Error(`no column "${header}" on ${ws.name}`);
  return found;
}

beforeAll(async () => {
  await loadFluid("R717");
});

describe("Excel export round trip", () => {
  it("has every sheet, with frozen, filtered header rows", async () => {
    const wb = await readBack(await workbookBuffer(input(model())));
    expect(wb.worksheets.map((w) => w.name)).toEqual(Object.values(SHEETS));
    for (const name of [SHEETS.schedule, SHEETS.loads, SHEETS.circuits, SHEETS.statePoints]) {
      const ws = wb.getWorksheet(name)!;
      expect(ws.views[0]).toMatchObject({ state: "frozen", ySplit: HEADER_ROW });
      expect(ws.autoFilter).toBeTruthy();
      expect(ws.getColumn(1).width).toBeGreaterThan(5);
      expect(ws.pageSetup).toMatchObject({ orientation: "landscape", fitToWidth: 1, printTitlesRow: "3:3" });
    }
  });

  it("every duty, electrical load, power and COP equals the engine's numbers (full precision, with display formats)", async () => {
    const inp = input(model());
    const wb = await readBack(await workbookBuffer(inp));
    const ws = wb.getWorksheet(SHEETS.schedule)!;
    const cTag = col(ws, "Tag");
    const cDuty = col(ws, "Duty total [kW]");
    const cUnit = col(ws, "Duty per running unit [kW]");
    const cElec = col(ws, "Electrical load [kW(e)]");
    inp.schedule.forEach((item, i) => {
      const row = ws.getRow(HEADER_ROW + 1 + i);
      expect(row.getCell(cTag).value).toBe(item.tag);
      // kW = W / 1000: a unit conversion, stored unrounded.
      expect(row.getCell(cDuty).value).toBe(item.dutyW / 1000);
      expect(row.getCell(cUnit).value).toBe(item.dutyPerUnitW / 1000);
      expect(row.getCell(cElec).value).toBe(item.electricalW / 1000);
      expect(row.getCell(cDuty).numFmt).toBe("#,##0.0");
    });
    expect(ws.getRow(HEADER_ROW + 1 + inp.schedule.length).getCell(cTag).value).toBeNull();

    const cs = wb.getWorksheet(SHEETS.circuits)!;
    inp.result.plant.circuits.forEach((c, i) => {
      const row = cs.getRow(HEADER_ROW + 1 + i);
      expect(row.getCell(col(cs, "Circuit")).value).toBe(c.tag);
      expect(row.getCell(col(cs, "Refrigeration [kW(r)]")).value).toBe(c.refrigerationW / 1000);
      expect(row.getCell(col(cs, "Compressor shaft power [kW]")).value).toBe(c.shaftPowerW / 1000);
      expect(row.getCell(col(cs, "Electrical incl. pumps and condenser fans [kW(e)]")).value).toBe(c.electricalW / 1000);
      expect(row.getCell(col(cs, "Mass flow [kg/s]")).value).toBe(c.massFlowKgS);
      expect(row.getCell(col(cs, "COP")).value).toBe(c.cop);
      expect(row.getCell(col(cs, "Carnot COP")).value).toBe(c.copCarnot);
      expect(row.getCell(col(cs, "Second-law efficiency")).value).toBe(c.secondLawEfficiency);
      expect(row.getCell(col(cs, "Second-law efficiency")).numFmt).toBe("0.0%");
      expect(row.getCell(col(cs, "Heat rejected [kW]")).value).toBe(c.heatRejectedW / 1000);
    });

    const sp = wb.getWorksheet(SHEETS.statePoints)!;
    const points = inp.result.plant.circuits.flatMap((c) => c.statePoints);
    points.forEach((p, i) => expect(sp.getRow(HEADER_ROW + 1 + i).getCell(col(sp, "Enthalpy [kJ/kg] (IIR reference)")).value).toBe(p.hJkg / 1000));

    const ls = wb.getWorksheet(SHEETS.loads)!;
    const components = inp.result.ledger.rooms.flatMap((r) => r.components);
    const cPower = col(ls, "Load [kW(r)]");
    const cLine = col(ls, "Line");
    const got: number[] = [];
    ls.eachRow((row, n) => {
      if (n > HEADER_ROW && row.getCell(cLine).value === "component") got.push(row.getCell(cPower).value as number);
    });
    expect(got).toEqual(components.map((c) => c.powerW / 1000));
  });

  it("states the site, the sources, the cautions and the codes notice on the design basis sheet", async () => {
    const wb = await readBack(await workbookBuffer(input(model())));
    const ws = wb.getWorksheet(SHEETS.basis)!;
    const text: string[] = [];
    ws.eachRow((row) => row.eachCell((c) => text.push(String(c.value))));
    const all = text.join("\n");
    expect(all).toContain("Gosney–Olama door infiltration");
    expect(all).toMatch(/Ammonia \(B2L\) is toxic/);
    expect(all).toContain("licensed professional");
    expect(all).toContain("revision B (for tender, version 3)");
    expect(text).toContain("32"); // design dry bulb, °C
  });

  it("converts to IP units through lib/units", async () => {
    const inp = input(model(), "IP");
    const wb = await readBack(await workbookBuffer(inp));
    const ws = wb.getWorksheet(SHEETS.schedule)!;
    const c = col(ws, "Duty total [Btu/h]");
    expect(ws.getRow(HEADER_ROW + 1).getCell(c).value).toBe(convert.powerToDisplay(inp.schedule[0].dutyW, "IP", "heat"));
    expect(ws.getRow(HEADER_ROW + 1).getCell(c).numFmt).toBe("#,##0");
  });

  it("neutralises user text that would start a formula, in the workbook and the CSV", async () => {
    const evil = ['=HYPERLINK("http://example.invalid","x")', "+1+2", "-3+4", "@SUM(A1)", "\t=1"];
    const m = model((name, i) => evil[i] ?? name);
    const inp = input(m);
    const wb = await readBack(await workbookBuffer(inp));
    const ws = wb.getWorksheet(SHEETS.schedule)!;
    const cRoom = col(ws, "Room");
    const rooms: ExcelJS.Cell[] = [];
    for (let i = 0; i < inp.schedule.length; i++) {
      const cell = ws.getRow(HEADER_ROW + 1 + i).getCell(cRoom);
      if (cell.value) rooms.push(cell);
    }
    expect(rooms.length).toBeGreaterThanOrEqual(5);
    for (const cell of rooms) {
      expect(cell.type).toBe(ExcelJS.ValueType.String);
      expect(String(cell.value).startsWith("'")).toBe(true);
    }
    const csv = scheduleCsv(inp);
    expect(csv).toContain(`"'=HYPERLINK(""http://example.invalid"",""x"")"`);
    expect(csv).toContain(",'+1+2,");
    expect(csv).toContain(",'@SUM(A1),");
    // No field of the CSV starts a formula unless it is a plain number.
    for (const row of parseCsv(csv.replace(/^\uFEFF/, ""))) for (const f of row) if (/^[=+\-@\t\r]/.test(f)) expect(Number.isFinite(Number(f))).toBe(true);
    expect(neutralise("plain text")).toBe("plain text");
    expect(csvField(-12.5)).toBe("-12.5"); // numbers are numbers, never prefixed
  });

  it("writes the CSV with units in the header and full-precision numbers", () => {
    const inp = input(model());
    const rows = parseCsv(scheduleCsv(inp).replace(/^\uFEFF/, ""));
    const i = rows[0].indexOf("Duty total [kW]");
    expect(i).toBeGreaterThan(0);
    expect(rows).toHaveLength(inp.schedule.length + 1);
    inp.schedule.forEach((item, r) => {
      expect(rows[r + 1][0]).toBe(item.tag);
      expect(Number(rows[r + 1][i])).toBe(item.dutyW / 1000);
    });
  });
});

describe("changes since the last export", () => {
  it("marks new and changed rows by tag, naming the fields, and lists removed tags", () => {
    const rows = input(model()).schedule;
    expect(scheduleChanges(rows, null).firstExport).toBe(true);
    const prev = structuredClone(rows);
    prev[0].dutyW *= 0.9;
    prev[1].quantity += 1;
    const dropped = prev.splice(2, 1)[0];
    prev.push({ ...prev[0], tag: "EV-99" });
    const ch = scheduleChanges(rows, prev);
    expect(ch.byTag[rows[0].tag]).toEqual({ status: "changed", fields: ["duty"] });
    expect(ch.byTag[rows[1].tag]).toEqual({ status: "changed", fields: ["quantity"] });
    expect(ch.byTag[dropped.tag]).toEqual({ status: "new" });
    expect(ch.byTag[rows[3].tag]).toEqual({ status: "same" });
    expect(ch.removed).toEqual(["EV-99"]);
  });
});
