import { create, unitDependencies } from "mathjs";

/**
 * The one units module: values are stored and computed in SI; screens and exports format
 * through here in the user's system. Conversions go through mathjs units (only the unit
 * factory is bundled). Traps handled: temperature differences convert without the offset
 * (K → Δ°F via °R), pressures say absolute or gauge, refrigeration and electrical power are
 * labelled apart.
 */
const { unit } = create({ unitDependencies });

export type UnitSystem = "SI" | "IP";
export type PowerKind = "refrigeration" | "electrical" | "heat";
export type PressureRef = "abs" | "gauge";

/** Standard atmosphere, Pa (ISO 2533), used to label gauge pressures. */
export const STANDARD_ATMOSPHERE_PA = 101_325;

function conv(value: number, from: string, to: string): number {
  return unit(value, from).toNumber(to);
}

export const convert = {
  tempToDisplay: (c: number, s: UnitSystem) => (s === "SI" ? c : conv(c, "degC", "degF")),
  tempFromDisplay: (v: number, s: UnitSystem) => (s === "SI" ? v : conv(v, "degF", "degC")),
  /** A temperature difference: no offset. */
  tempDiffToDisplay: (k: number, s: UnitSystem) => (s === "SI" ? k : conv(k, "K", "degR")),
  tempDiffFromDisplay: (v: number, s: UnitSystem) => (s === "SI" ? v : conv(v, "degR", "K")),
  powerToDisplay: (w: number, s: UnitSystem, kind: PowerKind = "refrigeration") =>
    s === "SI" ? w / 1000 : kind === "electrical" ? w / 1000 : conv(w, "W", "BTU/h"),
  powerFromDisplay: (v: number, s: UnitSystem, kind: PowerKind = "refrigeration") =>
    s === "SI" || kind === "electrical" ? v * 1000 : conv(v, "BTU/h", "W"),
  /** Tons of refrigeration (12 000 Btu/h). */
  powerToTR: (w: number) => conv(w, "W", "BTU/h") / 12_000,
  pressureToDisplay: (paAbs: number, s: UnitSystem, ref: PressureRef = "abs") => {
    const pa = ref === "abs" ? paAbs : paAbs - STANDARD_ATMOSPHERE_PA;
    return s === "SI" ? pa / 1e5 : conv(pa, "Pa", "psi");
  },
  pressureFromDisplay: (v: number, s: UnitSystem, ref: PressureRef = "abs") => {
    const pa = s === "SI" ? v * 1e5 : conv(v, "psi", "Pa");
    return ref === "abs" ? pa : pa + STANDARD_ATMOSPHERE_PA;
  },
  lengthToDisplay: (m: number, s: UnitSystem) => (s === "SI" ? m : conv(m, "m", "ft")),
  lengthFromDisplay: (v: number, s: UnitSystem) => (s === "SI" ? v : conv(v, "ft", "m")),
  areaToDisplay: (m2: number, s: UnitSystem) => (s === "SI" ? m2 : conv(m2, "m^2", "ft^2")),
  massToDisplay: (kg: number, s: UnitSystem) => (s === "SI" ? kg : conv(kg, "kg", "lb")),
  massFromDisplay: (v: number, s: UnitSystem) => (s === "SI" ? v : conv(v, "lb", "kg")),
  energyToDisplay: (kwh: number, s: UnitSystem) => (s === "SI" ? kwh : conv(kwh, "kWh", "BTU")),
  /** Refrigeration delivered: kWh(r), or ton-hours (12 000 Btu each) in IP. */
  coolingEnergyToDisplay: (kwh: number, s: UnitSystem) => (s === "SI" ? kwh : conv(kwh, "kWh", "BTU") / 12_000),
  /** Annual energy per volume: kWh/m³ (SI) or kWh/ft³ (IP). */
  perVolumeToDisplay: (kwhPerM3: number, s: UnitSystem) => (s === "SI" ? kwhPerM3 : kwhPerM3 / conv(1, "m^3", "ft^3")),
  /** Energy per mass handled: kWh/t (SI) or kWh per short ton of 2000 lb (IP). */
  perMassToDisplay: (kwhPerT: number, s: UnitSystem) => (s === "SI" ? kwhPerT : kwhPerT * conv(2000, "lb", "kg") / 1000),
};

export const UNIT_LABELS: Record<UnitSystem, Record<string, string>> = {
  SI: {
    temp: "°C",
    tempDiff: "K",
    power_refrigeration: "kW(r)",
    power_electrical: "kW(e)",
    power_heat: "kW",
    pressure_abs: "bar(a)",
    pressure_gauge: "bar(g)",
    length: "m",
    area: "m²",
    mass: "kg",
    energy: "kWh",
  },
  IP: {
    temp: "°F",
    tempDiff: "Δ°F",
    power_refrigeration: "Btu/h",
    power_electrical: "kW(e)",
    power_heat: "Btu/h",
    pressure_abs: "psia",
    pressure_gauge: "psig",
    length: "ft",
    area: "ft²",
    mass: "lb",
    energy: "Btu",
  },
};

const MINUS = "\u2212";
// One formatter per precision: creating Intl formatters (or calling toLocaleString, which
// does so each time) dominates when a canvas re-labels hundreds of figures per edit.
const formatters = new Map<number, Intl.NumberFormat>();
function num(v: number, digits: number): string {
  if (!Number.isFinite(v)) return "—";
  let f = formatters.get(digits);
  if (!f) {
    f = new Intl.NumberFormat("en-GB", { minimumFractionDigits: digits, maximumFractionDigits: digits });
    formatters.set(digits, f);
  }
  const s = f.format(v);
  return s.startsWith("-") ? MINUS + s.slice(1) : s;
}

/** kW to 0.1 below 1000, else 3 significant figures (UI.md precision rules). */
function powerDigits(v: number): number {
  const a = Math.abs(v);
  return a >= 1000 ? 0 : a >= 100 ? 1 : a >= 10 ? 1 : 2;
}

export const fmt = {
  temp: (c: number, s: UnitSystem) => `${num(convert.tempToDisplay(c, s), 1)} ${UNIT_LABELS[s].temp}`,
  tempDiff: (k: number, s: UnitSystem) => `${num(convert.tempDiffToDisplay(k, s), 1)} ${UNIT_LABELS[s].tempDiff}`,
  power: (w: number, s: UnitSystem, kind: PowerKind = "refrigeration") => {
    const v = convert.powerToDisplay(w, s, kind);
    return `${num(v, s === "IP" && kind !== "electrical" ? 0 : powerDigits(v))} ${UNIT_LABELS[s][`power_${kind}`]}`;
  },
  pressure: (pa: number, s: UnitSystem, ref: PressureRef = "abs") =>
    `${num(convert.pressureToDisplay(pa, s, ref), s === "SI" ? 2 : 1)} ${UNIT_LABELS[s][`pressure_${ref}`]}`,
  length: (m: number, s: UnitSystem) => `${num(convert.lengthToDisplay(m, s), 2)} ${UNIT_LABELS[s].length}`,
  area: (m2: number, s: UnitSystem) => `${num(convert.areaToDisplay(m2, s), 1)} ${UNIT_LABELS[s].area}`,
  mass: (kg: number, s: UnitSystem) => `${num(convert.massToDisplay(kg, s), 0)} ${UNIT_LABELS[s].mass}`,
  cop: (v: number) => num(v, 2),
  /** Electrical energy: kWh(e) in both systems (tariffs are per kWh); MWh(e) from 10 000 kWh. */
  energyElectrical: (kwh: number) => (Math.abs(kwh) >= 10_000 ? `${num(kwh / 1000, 1)} MWh(e)` : `${num(kwh, 0)} kWh(e)`),
  /** Refrigeration energy: kWh(r) (MWh(r) from 10 000) in SI, ton·h in IP. */
  energyCooling: (kwh: number, s: UnitSystem) =>
    s === "IP" ? `${num(convert.coolingEnergyToDisplay(kwh, s), 0)} ton·h` : Math.abs(kwh) >= 10_000 ? `${num(kwh / 1000, 1)} MWh(r)` : `${num(kwh, 0)} kWh(r)`,
  /** kWh(e) per m³ (or ft³) of refrigerated volume per year. */
  energyPerVolume: (kwhPerM3: number, s: UnitSystem) => `${num(convert.perVolumeToDisplay(kwhPerM3, s), s === "SI" ? 1 : 2)} kWh(e)/${s === "SI" ? "m³" : "ft³"}·yr`,
  /** kWh(e) per tonne (or short ton) of product handled. */
  energyPerMass: (kwhPerT: number, s: UnitSystem) => `${num(convert.perMassToDisplay(kwhPerT, s), 1)} kWh(e)/${s === "SI" ? "t" : "ton"}`,
  /** An amount of money in the workspace's currency (ISO 4217 code), whole units from 1000. */
  money: (v: number, currency: string) => {
    if (!Number.isFinite(v)) return "—";
    const digits = Math.abs(v) >= 1000 ? 0 : 2;
    try {
      return new Intl.NumberFormat("en-GB", { style: "currency", currency, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(v).replace(/^-/, MINUS);
    } catch {
      return `${num(v, digits)} ${currency}`;
    }
  },
  hours: (h: number) => `${num(h, 0)} h`,
  percent: (fraction: number) => `${num(fraction * 100, 1)} %`,
  number: num,
};
