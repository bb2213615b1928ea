/**
 * The equipment schedule's columns, shared by the Excel sheet and the CSV: header with the
 * unit, the value in display units at full precision (converted by lib/units, never rounded)
 * and the Excel display format.
 */
import type { ScheduleItem } from "@/lib/engine/plant/schedule";
import { convert, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { markText, type ScheduleChanges } from "./changes";

export interface ScheduleContext {
  unitSystem: UnitSystem;
  roomNames: Record<string, string>;
  circuitTags: Record<string, string>;
  changes?: ScheduleChanges;
}

export interface Column<R> {
  key: string;
  header: string;
  width: number;
  /** Excel number format for numeric columns. */
  numFmt?: string;
  value: (row: R) => number | string | null;
}

const KIND_WORDS: Record<ScheduleItem["kind"], string> = {
  evaporator: "Evaporator",
  "compressor-set": "Compressor set",
  condenser: "Condenser",
  intercooler: "Intercooler",
  "cascade-hx": "Cascade heat exchanger",
  separator: "Separator / LP receiver",
};

export const scheduleKindWord = (k: ScheduleItem["kind"]) => KIND_WORDS[k];

/** Formats that show sensible precision while the cell keeps every digit (UI.md: kW to 0.1). */
export function numberFormats(s: UnitSystem) {
  return {
    power: s === "SI" ? "#,##0.0" : "#,##0",
    electrical: "#,##0.00",
    temp: "0.0",
    tempDiff: "0.0",
    pressure: s === "SI" ? "0.00" : "0.0",
    count: "0",
    cop: "0.00",
    percent: "0.0%",
    massFlow: "0.000",
    airflow: "0.00",
    energy: "#,##0.0",
    enthalpy: "0.0",
    entropy: "0.0000",
    ratio: "0.00",
  };
}

const nOrNull = (v: number | undefined | null) => (v === undefined || v === null || !Number.isFinite(v) ? null : v);

export function scheduleColumns(ctx: ScheduleContext): Column<ScheduleItem>[] {
  const s = ctx.unitSystem;
  const L = UNIT_LABELS[s];
  const f = numberFormats(s);
  const power = (w: number | undefined) => nOrNull(w === undefined ? undefined : convert.powerToDisplay(w, s, "heat"));
  const elec = (w: number | undefined) => nOrNull(w === undefined ? undefined : convert.powerToDisplay(w, s, "electrical"));
  const temp = (c: number | undefined) => nOrNull(c === undefined ? undefined : convert.tempToDisplay(c, s));
  const pres = (pa: number | undefined) => nOrNull(pa === undefined ? undefined : convert.pressureToDisplay(pa, s, "abs"));
  return [
    { key: "tag", header: "Tag", width: 11, value: (r) => r.tag },
    { key: "kind", header: "Item", width: 22, value: (r) => KIND_WORDS[r.kind] },
    { key: "description", header: "Description", width: 44, value: (r) => r.description },
    { key: "room", header: "Room", width: 28, value: (r) => (r.roomId ? (ctx.roomNames[r.roomId] ?? r.roomId) : "") },
    { key: "circuit", header: "Circuit", width: 10, value: (r) => (r.circuitId ? (ctx.circuitTags[r.circuitId] ?? r.circuitId) : "") },
    { key: "refrigerant", header: "Refrigerant", width: 12, value: (r) => r.refrigerant ?? "" },
    { key: "quantity", header: "Quantity (incl. standby)", width: 12, numFmt: f.count, value: (r) => r.quantity },
    { key: "standby", header: "Standby", width: 9, numFmt: f.count, value: (r) => r.standbyQuantity },
    { key: "dutyBasis", header: "Duty basis", width: 14, value: (r) => (r.kind === "condenser" || r.kind === "cascade-hx" ? "heat rejected" : "refrigeration") },
    { key: "dutyPerUnit", header: `Duty per running unit [${L.power_heat}]`, width: 14, numFmt: f.power, value: (r) => power(r.dutyPerUnitW) },
    { key: "duty", header: `Duty total [${L.power_heat}]`, width: 14, numFmt: f.power, value: (r) => power(r.dutyW) },
    { key: "electrical", header: `Electrical load [${L.power_electrical}]`, width: 14, numFmt: f.electrical, value: (r) => elec(r.electricalW) },
    { key: "tRoom", header: `Room air [${L.temp}]`, width: 11, numFmt: f.temp, value: (r) => temp(r.temperatures.room) },
    { key: "tEvap", header: `Evaporating [${L.temp}]`, width: 12, numFmt: f.temp, value: (r) => temp(r.temperatures.evaporating) },
    { key: "tSuction", header: `Suction [${L.temp}]`, width: 11, numFmt: f.temp, value: (r) => temp(r.temperatures.suction) },
    { key: "tIntermediate", header: `Intermediate [${L.temp}]`, width: 12, numFmt: f.temp, value: (r) => temp(r.temperatures.intermediate) },
    { key: "tCond", header: `Condensing [${L.temp}]`, width: 12, numFmt: f.temp, value: (r) => temp(r.temperatures.condensing) },
    { key: "tSink", header: `Sink [${L.temp}]`, width: 10, numFmt: f.temp, value: (r) => temp(r.temperatures.sink) },
    { key: "tDischarge", header: `Discharge [${L.temp}]`, width: 11, numFmt: f.temp, value: (r) => temp(r.temperatures.discharge) },
    { key: "airflow", header: "Airflow [m³/s]", width: 11, numFmt: f.airflow, value: (r) => nOrNull(r.airflowM3s) },
    { key: "defrost", header: "Defrost", width: 10, value: (r) => r.defrost?.type ?? "" },
    { key: "defrostHeater", header: `Defrost heater [${L.power_electrical}]`, width: 13, numFmt: f.electrical, value: (r) => elec(r.defrost?.heaterW) },
    { key: "pLow", header: `Design pressure, low side [${L.pressure_abs}]`, width: 14, numFmt: f.pressure, value: (r) => pres(r.designPressurePa?.lowSide) },
    { key: "pHigh", header: `Design pressure, high side [${L.pressure_abs}]`, width: 14, numFmt: f.pressure, value: (r) => pres(r.designPressurePa?.highSide) },
    { key: "rating", header: "Rating conditions (SI)", width: 60, value: (r) => r.ratingConditions },
    { key: "changed", header: "Changed since last export", width: 26, value: (r) => (ctx.changes ? markText(ctx.changes.byTag[r.tag]) : "") },
  ];
}
