/**
 * The Excel export: equipment schedule, room loads (every ledger line), circuits, their state
 * points and the design basis, built from one computed facility. Numbers go in as numbers in
 * display units at full precision, with display formats; headers carry the units; header
 * rows are frozen and filtered; every text cell is neutralised against formula injection.
 */
import ExcelJS from "exceljs";
import type { FacilityResult } from "@/lib/engine/model";
import type { ScheduleItem } from "@/lib/engine/plant/schedule";
import { SAFETY_GROUP } from "@/lib/engine/plant/safety";
import { convert, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { numberFormats, scheduleColumns, type Column } from "./columns";
import type { ScheduleChanges } from "./changes";
import { csvField, neutralise } from "./safe-text";
import { addOptionSheets, type OptionSheetsInput } from "./option-sheets";

export const SHEETS = {
  schedule: "Equipment schedule",
  loads: "Room loads",
  circuits: "Circuits",
  statePoints: "Circuit state points",
  basis: "Design basis",
} as const;

/** Rows above each table: title, then a line of context; the header row follows. */
export const HEADER_ROW = 3;

export interface RevisionInfo {
  number: number;
  letter: string | null;
  status: string | null;
  issued: boolean;
  checkedBy: string | null;
}

export interface SiteInfo {
  designDryBulbC: number;
  coincidentWetBulbC?: number | null;
  designRH?: number | null;
  groundTempC: number;
  elevationM: number;
}

export interface WorkbookInput {
  facilityName: string;
  result: FacilityResult;
  schedule: ScheduleItem[];
  site: SiteInfo;
  rooms: { id: string; name: string; setPointC: number }[];
  revision: RevisionInfo;
  unitSystem: UnitSystem;
  exportedAt: Date;
  exportedBy: string;
  changes?: ScheduleChanges;
  /** The plant options comparison; its sheets are added when the facility has options. */
  options?: OptionSheetsInput;
}

export function revisionLabel(r: RevisionInfo): string {
  return r.issued && r.letter ? `revision ${r.letter} (${r.status ?? "issued"}, version ${r.number})` : `version ${r.number} (not issued)`;
}

function textOrNumber(v: number | string | null): ExcelJS.CellValue {
  if (v === null) return null;
  return typeof v === "string" ? neutralise(v) : v;
}

function table<R>(ws: ExcelJS.Worksheet, title: string, context: string, cols: Column<R>[], rows: R[]) {
  ws.getCell(1, 1).value = neutralise(title);
  ws.getCell(1, 1).font = { bold: true, size: 13 };
  ws.getCell(2, 1).value = neutralise(context);
  ws.getCell(2, 1).font = { italic: true, color: { argb: "FF555555" } };
  cols.forEach((c, i) => {
    const col = ws.getColumn(i + 1);
    col.width = c.width;
    const h = ws.getCell(HEADER_ROW, i + 1);
    h.value = c.header;
    h.font = { bold: true };
    h.alignment = { wrapText: true, vertical: "top" };
    h.fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FFE8EDF2" } };
    h.border = { bottom: { style: "thin" } };
  });
  ws.getRow(HEADER_ROW).height = 42;
  rows.forEach((r, ri) => {
    const row = ws.getRow(HEADER_ROW + 1 + ri);
    cols.forEach((c, ci) => {
      const cell = row.getCell(ci + 1);
      cell.value = textOrNumber(c.value(r));
      if (c.numFmt) cell.numFmt = c.numFmt;
    });
  });
  ws.views = [{ state: "frozen", xSplit: 1, ySplit: HEADER_ROW, topLeftCell: `B${HEADER_ROW + 1}` }];
  // Printed (or sent as PDF): A4 landscape, one page wide, the header row repeated on each page.
  ws.pageSetup = { paperSize: 9, orientation: "landscape", fitToPage: true, fitToWidth: 1, fitToHeight: 0, printTitlesRow: `${HEADER_ROW}:${HEADER_ROW}` };
  ws.headerFooter = { oddFooter: `&L${title.replace(/&/g, "&&")}&RPage &P of &N` };
  ws.autoFilter = { from: { row: HEADER_ROW, column: 1 }, to: { row: HEADER_ROW + Math.max(rows.length, 1), column: cols.length } };
}

interface LoadRow {
  room: string;
  setPointC: number;
  line: "component" | "total";
  kind: string;
  label: string;
  powerW: number;
  energyKWh: number | null;
  sensibleW: number | null;
  latentW: number | null;
  method: string;
  source: string;
}

function loadRows(input: WorkbookInput): LoadRow[] {
  const out: LoadRow[] = [];
  const setPoints = new Map(input.rooms.map((r) => [r.id, r.setPointC]));
  for (const r of input.result.ledger.rooms) {
    const sp = setPoints.get(r.roomId) ?? Number.NaN;
    for (const c of r.components)
      out.push({ room: r.roomName, setPointC: sp, line: "component", kind: c.kind, label: c.label, powerW: c.powerW, energyKWh: c.energyKWhPerDay, sensibleW: c.sensibleW, latentW: c.latentW, method: c.trace.method, source: c.trace.source });
    const sf = `${(r.safetyFactor * 100).toFixed(0)} %`;
    const base = { room: r.roomName, setPointC: sp, line: "total" as const, method: "Design capacity from the 24-h energy, safety factor and allowed run time", source: "ASHRAE Handbook—Refrigeration, refrigerated-facility loads chapter; safety factor about 10 % and 18–20 h run time are common practice" };
    out.push(
      { ...base, kind: "total", label: "24-h average load", powerW: r.averageLoadW, energyKWh: r.totalEnergyKWhPerDay, sensibleW: r.sensibleW, latentW: r.latentW },
      { ...base, kind: "required-daily", label: `Required capacity: 24-h energy × (1 + ${sf}) / ${r.runHoursPerDay} h`, powerW: r.requiredCapacityW, energyKWh: null, sensibleW: null, latentW: null },
      { ...base, kind: "required-peak", label: `Required capacity: peak hour ${String(r.peakHour).padStart(2, "0")}:00 × (1 + ${sf})`, powerW: r.requiredPeakCapacityW, energyKWh: null, sensibleW: null, latentW: null },
      { ...base, kind: "design", label: "Design capacity (the larger of the two)", powerW: r.designCapacityW, energyKWh: null, sensibleW: null, latentW: null },
    );
  }
  return out;
}

type Circuit = FacilityResult["plant"]["circuits"][number];

function circuitColumns(s: UnitSystem): Column<Circuit>[] {
  const L = UNIT_LABELS[s];
  const f = numberFormats(s);
  const p = (w: number) => convert.powerToDisplay(w, s, "heat");
  const e = (w: number) => convert.powerToDisplay(w, s, "electrical");
  const t = (c: number | undefined) => (c === undefined ? null : convert.tempToDisplay(c, s));
  const dt = (k: number) => convert.tempDiffToDisplay(k, s);
  const massFlow = (kgS: number) => convert.massToDisplay(kgS, s);
  return [
    { key: "tag", header: "Circuit", width: 10, value: (c) => c.tag },
    { key: "refrigerant", header: "Refrigerant", width: 11, value: (c) => c.refrigerant },
    { key: "group", header: "Safety group (ISO 817)", width: 11, value: (c) => SAFETY_GROUP[c.refrigerant] },
    { key: "arrangement", header: "Arrangement", width: 14, value: (c) => c.arrangement },
    { key: "convention", header: "Temperature convention", width: 12, value: (c) => c.tempConvention },
    { key: "suction", header: `Suction [${L.temp}]`, width: 10, numFmt: f.temp, value: (c) => t(c.suctionC) },
    { key: "condensing", header: `Condensing / gas-cooler outlet [${L.temp}]`, width: 14, numFmt: f.temp, value: (c) => t(c.condensingC) },
    { key: "intermediate", header: `Intermediate [${L.temp}]`, width: 12, numFmt: f.temp, value: (c) => t(c.intermediateC) },
    { key: "superheat", header: `Superheat [${L.tempDiff}]`, width: 10, numFmt: f.tempDiff, value: (c) => dt(c.superheatK) },
    { key: "subcooling", header: `Subcooling [${L.tempDiff}]`, width: 10, numFmt: f.tempDiff, value: (c) => dt(c.subcoolingK) },
    { key: "sink", header: `Sink [${L.temp}]`, width: 9, numFmt: f.temp, value: (c) => t(c.sinkC) },
    { key: "refrigeration", header: `Refrigeration [${L.power_refrigeration}]`, width: 13, numFmt: f.power, value: (c) => p(c.refrigerationW) },
    { key: "massFlow", header: `Mass flow [${L.mass}/s]`, width: 11, numFmt: f.massFlow, value: (c) => massFlow(c.massFlowKgS) },
    { key: "shaft", header: "Compressor shaft power [kW]", width: 13, numFmt: f.electrical, value: (c) => e(c.shaftPowerW) },
    { key: "compressorElectrical", header: `Compressor electrical [${L.power_electrical}]`, width: 13, numFmt: f.electrical, value: (c) => e(c.compressorElectricalW) },
    { key: "electrical", header: `Electrical incl. pumps and condenser fans [${L.power_electrical}]`, width: 15, numFmt: f.electrical, value: (c) => e(c.electricalW) },
    { key: "cop", header: "COP", width: 8, numFmt: f.cop, value: (c) => c.cop },
    { key: "carnot", header: "Carnot COP", width: 9, numFmt: f.cop, value: (c) => c.copCarnot },
    { key: "eta2", header: "Second-law efficiency", width: 11, numFmt: f.percent, value: (c) => c.secondLawEfficiency },
    { key: "rejected", header: `Heat rejected [${L.power_heat}]`, width: 13, numFmt: f.power, value: (c) => p(c.heatRejectedW) },
    { key: "discharge", header: `Discharge [${L.temp}]`, width: 10, numFmt: f.temp, value: (c) => t(c.dischargeTempC) },
    { key: "ratio", header: "Pressure ratio", width: 9, numFmt: f.ratio, value: (c) => c.pressureRatio },
    { key: "sgen", header: "Entropy generated [W/K]", width: 11, numFmt: "0.00", value: (c) => c.entropyGeneration.totalW_K },
  ];
}

interface PointRow {
  circuit: string;
  refrigerant: string;
  id: string;
  label: string;
  pPa: number;
  tK: number;
  hJkg: number;
  sJkgK: number;
}

function pointColumns(s: UnitSystem): Column<PointRow>[] {
  const L = UNIT_LABELS[s];
  const f = numberFormats(s);
  return [
    { key: "circuit", header: "Circuit", width: 10, value: (r) => r.circuit },
    { key: "refrigerant", header: "Refrigerant", width: 11, value: (r) => r.refrigerant },
    { key: "id", header: "Point", width: 7, value: (r) => r.id },
    { key: "label", header: "State", width: 34, value: (r) => r.label },
    { key: "p", header: `Pressure [${L.pressure_abs}]`, width: 12, numFmt: f.pressure, value: (r) => convert.pressureToDisplay(r.pPa, s, "abs") },
    { key: "t", header: `Temperature [${L.temp}]`, width: 12, numFmt: f.temp, value: (r) => convert.tempToDisplay(r.tK - 273.15, s) },
    // Enthalpy and entropy stay SI in both unit systems (IIR reference state).
    { key: "h", header: "Enthalpy [kJ/kg] (IIR reference)", width: 14, numFmt: f.enthalpy, value: (r) => r.hJkg / 1000 },
    { key: "s", header: "Entropy [kJ/(kg·K)] (IIR reference)", width: 14, numFmt: f.entropy, value: (r) => r.sJkgK / 1000 },
  ];
}

/** The methods the numbers come from and their sources, from the ledger traces and the plant. */
export function methodsAndSources(result: FacilityResult): { method: string; source: string }[] {
  const seen = new Map<string, { method: string; source: string }>();
  for (const r of result.ledger.rooms) for (const c of r.components) seen.set(`${c.trace.method}|${c.trace.source}`, { method: c.trace.method, source: c.trace.source });
  const plant = [
    { method: "Evaporator duty Q = UA·TD; design TD by humidity class", source: "ASHRAE Handbook—Refrigeration (air coolers); TD of 4–8 K by room humidity is common practice" },
    { method: "Vapour-compression cycle: ṁ = Q/(h1 − h4), h2 = h1 + (h2s − h1)/η_is, W = ṁ(h2 − h1), COP = Q/W", source: "Standard vapour-compression cycle analysis (ASHRAE Handbook—Fundamentals, thermodynamics and refrigeration cycles)" },
    { method: "Carnot COP = T_L/(T_H − T_L); second-law efficiency = COP/COP_Carnot; entropy generation by the Clausius inequality", source: "Second-law analysis (ASHRAE Handbook—Fundamentals, thermodynamics chapter)" },
    { method: "Refrigerant properties: Rimeplan's own property module, IIR reference state (h = 200 kJ/kg, s = 1 kJ/(kg·K), saturated liquid at 0 °C)", source: "Rimeplan thermo module: models, reference state and measured accuracy in its design note (lib/engine/thermo/README.md)" },
    { method: "Fan and defrost heat fed back into each room's load (fixed point)", source: `tolerance ${result.fixedPoint.tolerance} relative, at most ${result.fixedPoint.maxIterations} iterations` },
  ];
  return [...seen.values(), ...plant];
}

/** Builds the workbook. Pure apart from exceljs: no I/O. */
export function buildWorkbook(input: WorkbookInput): ExcelJS.Workbook {
  const s = input.unitSystem;
  const wb = new ExcelJS.Workbook();
  wb.creator = "Rimeplan";
  wb.created = input.exportedAt;
  wb.title = `${input.facilityName} — equipment schedule`;
  const rev = revisionLabel(input.revision);
  const when = input.exportedAt.toISOString().replace("T", " ").slice(0, 16) + " UTC";
  const context = `${rev} · exported ${when} by ${input.exportedBy} · ${s} units · conditions, methods and safety cautions on the "${SHEETS.basis}" sheet`;
  const roomNames = Object.fromEntries(input.rooms.map((r) => [r.id, r.name]));
  const circuitTags = Object.fromEntries(input.result.plant.circuits.map((c) => [c.id, c.tag]));

  table(wb.addWorksheet(SHEETS.schedule), `Equipment schedule — ${input.facilityName}`, context, scheduleColumns({ unitSystem: s, roomNames, circuitTags, changes: input.changes }), input.schedule);

  const L = UNIT_LABELS[s];
  const f = numberFormats(s);
  const loadCols: Column<LoadRow>[] = [
    { key: "room", header: "Room", width: 28, value: (r) => r.room },
    { key: "sp", header: `Set point [${L.temp}]`, width: 10, numFmt: f.temp, value: (r) => (Number.isFinite(r.setPointC) ? convert.tempToDisplay(r.setPointC, s) : null) },
    { key: "line", header: "Line", width: 10, value: (r) => r.line },
    { key: "kind", header: "Component", width: 16, value: (r) => r.kind },
    { key: "label", header: "Description", width: 46, value: (r) => r.label },
    { key: "power", header: `Load [${L.power_refrigeration}]`, width: 12, numFmt: f.power, value: (r) => convert.powerToDisplay(r.powerW, s, "refrigeration") },
    { key: "energy", header: "Energy [kWh/day]", width: 12, numFmt: f.energy, value: (r) => r.energyKWh },
    { key: "sensible", header: `Sensible [${L.power_refrigeration}]`, width: 12, numFmt: f.power, value: (r) => (r.sensibleW === null ? null : convert.powerToDisplay(r.sensibleW, s, "refrigeration")) },
    { key: "latent", header: `Latent [${L.power_refrigeration}]`, width: 12, numFmt: f.power, value: (r) => (r.latentW === null ? null : convert.powerToDisplay(r.latentW, s, "refrigeration")) },
    { key: "method", header: "Method", width: 44, value: (r) => r.method },
    { key: "source", header: "Source", width: 44, value: (r) => r.source },
  ];
  table(wb.addWorksheet(SHEETS.loads), `Room loads — ${input.facilityName}`, `${rev} · every line of each room's heat ledger, 24-h average basis`, loadCols, loadRows(input));

  table(wb.addWorksheet(SHEETS.circuits), `Circuits — ${input.facilityName}`, `${rev} · design point of each circuit`, circuitColumns(s), input.result.plant.circuits);
  const points: PointRow[] = input.result.plant.circuits.flatMap((c) => c.statePoints.map((p) => ({ circuit: c.tag, refrigerant: c.refrigerant, ...p })));
  table(wb.addWorksheet(SHEETS.statePoints), `Circuit state points — ${input.facilityName}`, `${rev} · numbered as on the circuit's pressure–enthalpy chart`, pointColumns(s), points);

  buildBasis(wb.addWorksheet(SHEETS.basis), input, rev, when);
  if (input.options && input.options.comparison.options.length > 1) addOptionSheets(wb, table, input.options, { facilityName: input.facilityName, rev, unitSystem: s });
  return wb;
}

function buildBasis(ws: ExcelJS.Worksheet, input: WorkbookInput, rev: string, when: string) {
  const s = input.unitSystem;
  const L = UNIT_LABELS[s];
  ws.getColumn(1).width = 40;
  ws.getColumn(2).width = 70;
  ws.getColumn(3).width = 14;
  ws.getColumn(4).width = 10;
  const header = ws.getRow(1);
  header.values = ["Item", "Value", "Number", "Unit"];
  header.font = { bold: true };
  header.fill = { type: "pattern", pattern: "solid", fgColor: { argb: "FFE8EDF2" } };
  ws.views = [{ state: "frozen", ySplit: 1 }];
  let r = 2;
  const section = (title: string) => {
    r++;
    ws.getCell(r, 1).value = neutralise(title);
    ws.getCell(r, 1).font = { bold: true };
    r++;
  };
  const line = (item: string, text: string, num?: number | null, unit?: string, numFmt?: string) => {
    ws.getCell(r, 1).value = neutralise(item);
    ws.getCell(r, 2).value = neutralise(text);
    ws.getCell(r, 2).alignment = { wrapText: true, vertical: "top" };
    if (num !== undefined && num !== null) {
      ws.getCell(r, 3).value = num;
      if (numFmt) ws.getCell(r, 3).numFmt = numFmt;
      ws.getCell(r, 4).value = unit ?? "";
    }
    r++;
  };
  section("Project");
  line("Facility", input.facilityName);
  line("Revision", rev);
  line("Issued", input.revision.issued ? "yes" : "no — for information, not an issued design");
  line("Checked by", input.revision.checkedBy ?? "—");
  line("Exported", `${when} by ${input.exportedBy}`);
  line("Units", s === "SI" ? "SI (values stored and computed in SI)" : "IP for display (values computed in SI and converted)");
  line("Engine", input.result.engineVersion);

  section("Site design conditions");
  const site = input.site;
  line("Design dry bulb", "", convert.tempToDisplay(site.designDryBulbC, s), L.temp, "0.0");
  if (site.coincidentWetBulbC !== null && site.coincidentWetBulbC !== undefined) line("Coincident wet bulb", "", convert.tempToDisplay(site.coincidentWetBulbC, s), L.temp, "0.0");
  if (site.designRH !== null && site.designRH !== undefined) line("Design relative humidity", "", site.designRH, "%", "0.0");
  line("Ground temperature", "", convert.tempToDisplay(site.groundTempC, s), L.temp, "0.0");
  line("Elevation", "", convert.lengthToDisplay(site.elevationM, s), L.length, "0");
  line("Site air pressure (from elevation)", "", convert.pressureToDisplay(input.result.ledger.site.pressurePa, s, "abs"), L.pressure_abs, "0.000");
  for (const st of input.result.ledger.options.statements) line("Ledger basis", st);

  section("Methods and sources");
  for (const m of methodsAndSources(input.result)) line(m.method, m.source);

  section("Refrigerant safety");
  for (const c of input.result.plant.cautions) for (const text of c.cautions) line(`${c.refrigerant} (${c.safetyGroup})`, text);
  line("Codes and licensed practice", input.result.plant.codesNotice);

  if (input.result.plant.warnings.length) {
    section("Warnings");
    for (const w of input.result.plant.warnings) line(w.ref.tag ?? w.ref.id, w.message);
  }
}

export async function workbookBuffer(input: WorkbookInput): Promise<Buffer> {
  const wb = buildWorkbook(input);
  return Buffer.from(await wb.xlsx.writeBuffer());
}

/** The schedule as CSV (UTF-8 with BOM so spreadsheet programs read the units' symbols). */
export function scheduleCsv(input: Pick<WorkbookInput, "schedule" | "unitSystem" | "rooms" | "result" | "changes">): string {
  const cols = scheduleColumns({
    unitSystem: input.unitSystem,
    roomNames: Object.fromEntries(input.rooms.map((r) => [r.id, r.name])),
    circuitTags: Object.fromEntries(input.result.plant.circuits.map((c) => [c.id, c.tag])),
    changes: input.changes,
  });
  const lines = [cols.map((c) => csvField(c.header)).join(",")];
  for (const row of input.schedule) lines.push(cols.map((c) => csvField(c.value(row))).join(","));
  return "\uFEFF" + lines.join("\r\n") + "\r\n";
}
