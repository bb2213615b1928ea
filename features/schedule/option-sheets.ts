/**
 * The plant options comparison in the Excel export: its own sheets beside the schedule's —
 * one row per plant (design first), the year by month, the charge estimate part by part, and
 * the code aid per circuit. Numbers at full precision in display units, units in the headers.
 */
import type ExcelJS from "exceljs";
import type { OptionFigures, OptionsComparison } from "@/lib/engine/compare-options";
import { convert, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { numberFormats, type Column } from "./columns";

export const OPTION_SHEETS = {
  compare: "Plant options",
  monthly: "Option monthly energy",
  charge: "Option charge",
  codeAid: "Option code aid",
} as const;

export interface OptionSheetsInput {
  comparison: OptionsComparison;
  currency: string;
  weatherLabel: string | null;
  codesNotice: string;
}

type Table = <R>(ws: ExcelJS.Worksheet, title: string, context: string, cols: Column<R>[], rows: R[]) => void;

const n = (v: number | undefined | null) => (v === undefined || v === null || !Number.isFinite(v) ? null : v);

function compareColumns(s: UnitSystem, currency: string, years: number): Column<OptionFigures>[] {
  const L = UNIT_LABELS[s];
  const f = numberFormats(s);
  const mass = (kg: number | undefined) => n(kg === undefined ? undefined : convert.massToDisplay(kg, s));
  return [
    { key: "name", header: "Plant", width: 24, value: (o) => o.name },
    { key: "design", header: "Design", width: 8, value: (o) => (o.isDesign ? "design" : "option") },
    { key: "status", header: "Status", width: 20, value: (o) => (o.error ? `not computed: ${o.error.message}` : "computed") },
    { key: "refrigerants", header: "Refrigerants", width: 14, value: (o) => o.refrigerants?.map((r) => r.id).join(", ") ?? "" },
    { key: "installed", header: `Installed refrigeration [${L.power_refrigeration}]`, width: 14, numFmt: f.power, value: (o) => n(o.installedRefrigerationW === undefined ? undefined : convert.powerToDisplay(o.installedRefrigerationW, s, "refrigeration")) },
    { key: "designKWe", header: `Design-hour electrical [${L.power_electrical}]`, width: 14, numFmt: f.electrical, value: (o) => n(o.designElectricalW === undefined ? undefined : o.designElectricalW / 1000) },
    { key: "peakKWe", header: `Peak electrical of the year [${L.power_electrical}]`, width: 14, numFmt: f.electrical, value: (o) => n(o.annual?.peakKWe) },
    { key: "kWh", header: "Annual energy [kWh/year]", width: 14, numFmt: "#,##0", value: (o) => n(o.annual?.kWh) },
    { key: "cost", header: `Annual running cost [${currency}/year]`, width: 14, numFmt: "#,##0", value: (o) => n(o.annual?.cost?.total) },
    { key: "scop", header: "Seasonal COP [-]", width: 10, numFmt: f.cop, value: (o) => n(o.annual?.seasonalCOP) },
    { key: "scarnot", header: "Seasonal Carnot COP [-]", width: 10, numFmt: f.cop, value: (o) => n(o.annual?.seasonalCarnotCOP) },
    { key: "charge", header: `Refrigerant charge, estimate [${L.mass}]`, width: 14, numFmt: "#,##0.0", value: (o) => mass(o.charge?.totalKg) },
    { key: "gwp", header: "GWP100, charge-weighted [kg CO2e/kg]", width: 14, numFmt: "0.0", value: (o) => n(o.gwpWeighted) },
    { key: "gwpEach", header: "GWP100 by refrigerant (IPCC AR4)", width: 20, value: (o) => o.refrigerants?.map((r) => `${r.id} ${r.gwp100}`).join("; ") ?? "" },
    { key: "safety", header: "Safety group (ISO 817)", width: 14, value: (o) => o.refrigerants?.map((r) => `${r.id} ${r.safetyGroup}`).join("; ") ?? "" },
    { key: "leak", header: "Leak rate [%/year]", width: 10, numFmt: "0.0", value: (o) => o.assumptions.leakPctPerYear },
    { key: "recovery", header: "End-of-life recovery [%]", width: 10, numFmt: "0.0", value: (o) => o.assumptions.recoveryPct },
    { key: "tewiLeak", header: `TEWI leakage GWP·L·n, ${years} years [kg CO2e]`, width: 16, numFmt: "#,##0", value: (o) => n(o.tewi?.leakageKg) },
    { key: "tewiEol", header: "TEWI end of life GWP·m·(1−α) [kg CO2e]", width: 16, numFmt: "#,##0", value: (o) => n(o.tewi?.endOfLifeKg) },
    { key: "tewiDirect", header: "TEWI direct [kg CO2e]", width: 16, numFmt: "#,##0", value: (o) => n(o.tewi?.directKg) },
    { key: "tewiIndirect", header: `TEWI indirect n·E·β, ${years} years [kg CO2e]`, width: 16, numFmt: "#,##0", value: (o) => n(o.tewi?.indirectKnown ? o.tewi.indirectKg : undefined) },
    { key: "tewiTotal", header: "TEWI total [kg CO2e]", width: 16, numFmt: "#,##0", value: (o) => n(o.tewi?.indirectKnown ? o.tewi.totalKg : undefined) },
    {
      key: "aid",
      header: "Code aid: highest charge ÷ room volume ÷ practical limit [-]",
      width: 16,
      numFmt: "0.000",
      value: (o) => {
        const r = o.codeAid?.flatMap((a) => (a.ratio === undefined ? [] : [a.ratio])) ?? [];
        return r.length ? Math.max(...r) : null;
      },
    },
  ];
}

export function addOptionSheets(wb: ExcelJS.Workbook, table: Table, input: OptionSheetsInput, ctx: { facilityName: string; rev: string; unitSystem: UnitSystem }) {
  const s = ctx.unitSystem;
  const L = UNIT_LABELS[s];
  const f = numberFormats(s);
  const c = input.comparison;
  const opts = c.options;
  const weather = input.weatherLabel ? `weather: ${input.weatherLabel}` : "no weather year: annual figures and indirect TEWI empty";
  table(
    wb.addWorksheet(OPTION_SHEETS.compare),
    `Plant options — ${ctx.facilityName}`,
    `${ctx.rev} · same rooms, plant per option · ${weather} · ${c.years} years, grid ${c.gridKgCo2PerKWh} kg CO2/kWh · ${c.tewiFormula}`,
    compareColumns(s, input.currency, c.years),
    opts,
  );

  type M = { plant: string; month: number; kWh: number; loadKWh: number | null; cop: number | null };
  const months: M[] = opts.flatMap((o) => (o.annual?.monthly ?? []).map((m, i) => ({ plant: o.name, month: i + 1, kWh: m.kWh, loadKWh: m.loadKWh ?? null, cop: m.meanCOP ?? null })));
  table(wb.addWorksheet(OPTION_SHEETS.monthly), `Option monthly energy — ${ctx.facilityName}`, `${ctx.rev} · ${weather}`, [
    { key: "plant", header: "Plant", width: 24, value: (r: M) => r.plant },
    { key: "month", header: "Month [1–12]", width: 8, numFmt: "0", value: (r: M) => r.month },
    { key: "kWh", header: "Electrical energy [kWh]", width: 14, numFmt: "#,##0.0", value: (r: M) => r.kWh },
    { key: "load", header: "Refrigeration load [kWh]", width: 14, numFmt: "#,##0.0", value: (r: M) => r.loadKWh },
    { key: "cop", header: "Mean COP [-]", width: 10, numFmt: f.cop, value: (r: M) => r.cop },
  ], months);

  type P = { plant: string; circuit: string; refrigerant: string; part: string; key: string; volumeM3: number; volumeSource: string; phi: number; tempC: number; pPa: number; rhoL: number; rhoV: number; rho: number; kg: number; basis: string };
  const parts: P[] = opts.flatMap((o) =>
    (o.charge?.circuits ?? []).flatMap((cc) =>
      cc.parts.map((p) => ({ plant: o.name, circuit: cc.tag, refrigerant: cc.refrigerant, part: p.label, key: p.key, volumeM3: p.volumeM3, volumeSource: p.volumeSource, phi: p.liquidFraction, tempC: p.tempC, pPa: p.pPa, rhoL: p.liquidDensityKgM3, rhoV: p.vapourDensityKgM3, rho: p.meanDensityKgM3, kg: p.massKg, basis: p.basis })),
    ),
  );
  table(wb.addWorksheet(OPTION_SHEETS.charge), `Option charge estimate — ${ctx.facilityName}`, `${ctx.rev} · m = V·(φ·ρ_liquid + (1 − φ)·ρ_vapour) per part; default volumes and fills are common practice, replace them with the manufacturers' internal volumes`, [
    { key: "plant", header: "Plant", width: 22, value: (r: P) => r.plant },
    { key: "circuit", header: "Circuit", width: 9, value: (r: P) => r.circuit },
    { key: "refrigerant", header: "Refrigerant", width: 10, value: (r: P) => r.refrigerant },
    { key: "part", header: "Part", width: 30, value: (r: P) => r.part },
    { key: "key", header: "Part key (for overrides)", width: 22, value: (r: P) => r.key },
    { key: "volume", header: "Internal volume [m³]", width: 12, numFmt: "0.0000", value: (r: P) => r.volumeM3 },
    { key: "vsrc", header: "Volume from", width: 10, value: (r: P) => r.volumeSource },
    { key: "phi", header: "Liquid fraction φ [-]", width: 10, numFmt: "0.00", value: (r: P) => r.phi },
    { key: "t", header: `At temperature [${L.temp}]`, width: 10, numFmt: f.temp, value: (r: P) => convert.tempToDisplay(r.tempC, s) },
    { key: "p", header: `At pressure [${L.pressure_abs}]`, width: 10, numFmt: f.pressure, value: (r: P) => convert.pressureToDisplay(r.pPa, s, "abs") },
    { key: "rhoL", header: "Liquid density [kg/m³]", width: 11, numFmt: "0.00", value: (r: P) => r.rhoL },
    { key: "rhoV", header: "Vapour density [kg/m³]", width: 11, numFmt: "0.000", value: (r: P) => r.rhoV },
    { key: "rho", header: "Mean density [kg/m³]", width: 11, numFmt: "0.00", value: (r: P) => r.rho },
    { key: "kg", header: `Charge [${L.mass}]`, width: 11, numFmt: "#,##0.00", value: (r: P) => convert.massToDisplay(r.kg, s) },
    { key: "basis", header: "Basis", width: 60, value: (r: P) => r.basis },
  ], parts);

  type A = { plant: string; circuit: string; refrigerant: string; kg: number; room: string; volume: number | null; occupied: string; perV: number | null; limit: number; source: string; ratio: number | null; verdict: string; note: string };
  const aids: A[] = opts.flatMap((o) =>
    (o.codeAid ?? []).map((a) => ({
      plant: o.name,
      circuit: o.circuits?.find((x) => x.id === a.circuitId)?.tag ?? a.circuitId,
      refrigerant: a.refrigerant,
      kg: a.chargeKg,
      room: a.room?.name ?? "",
      volume: a.room?.volumeM3 ?? null,
      occupied: a.room ? (a.room.occupied ? "yes" : "no") : "",
      perV: a.chargePerVolumeKgM3 ?? null,
      limit: a.limit.kgPerM3,
      source: a.limit.source,
      ratio: a.ratio ?? null,
      verdict: a.verdict,
      note: a.note,
    })),
  );
  table(wb.addWorksheet(OPTION_SHEETS.codeAid), `Option code aid — ${ctx.facilityName}`, `Charge per room volume beside a practical limit: an aid, not a code check. ${input.codesNotice}`, [
    { key: "plant", header: "Plant", width: 22, value: (r: A) => r.plant },
    { key: "circuit", header: "Circuit", width: 9, value: (r: A) => r.circuit },
    { key: "refrigerant", header: "Refrigerant", width: 10, value: (r: A) => r.refrigerant },
    { key: "kg", header: "Circuit charge [kg]", width: 11, numFmt: "#,##0.00", value: (r: A) => r.kg },
    { key: "room", header: "Smallest occupied room served", width: 26, value: (r: A) => r.room },
    { key: "vol", header: "Room volume [m³]", width: 11, numFmt: "#,##0.0", value: (r: A) => r.volume },
    { key: "occ", header: "Occupied", width: 9, value: (r: A) => r.occupied },
    { key: "perV", header: "Charge ÷ room volume [kg/m³]", width: 13, numFmt: "0.00000", value: (r: A) => r.perV },
    { key: "limit", header: "Practical limit [kg/m³]", width: 12, numFmt: "0.00000", value: (r: A) => r.limit },
    { key: "source", header: "Limit source", width: 50, value: (r: A) => r.source },
    { key: "ratio", header: "Ratio to the limit [-]", width: 10, numFmt: "0.000", value: (r: A) => r.ratio },
    { key: "verdict", header: "Verdict", width: 10, value: (r: A) => r.verdict },
    { key: "note", header: "Note", width: 40, value: (r: A) => r.note },
  ], aids);
}
