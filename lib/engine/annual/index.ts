/**
 * Annual energy, hour by hour (issue 11 §1): every room's ledger at each hour's weather and
 * schedules, the plant at each hour's condensing temperature and part load, and the year's
 * figures and cost. Pure TypeScript; see README.md in this folder for methods and sources.
 */
import { contextFromParsed, LoadInputError, type LedgerInput } from "../loads";
import { fail } from "../loads/errors";
import { airFromRH } from "../loads/psychro";
import type { AirState } from "../loads/psychro";
import { computeFacility, type FacilityModel } from "../model";
import { stullWetBulbC } from "../plant/ambient";
import { cascadeOrder, computeCircuit, defaultApproachK, K0, preparePlant, type Ambient, type CircuitContext, type CircuitResult } from "../plant/circuit";
import { PlantError } from "../plant/errors";
import type { EvaporatorSizing } from "../plant/evaporator";
import type { CircuitInput } from "../plant/schema";
import { getFluid as thermoGetFluid } from "../thermo";
import type { Fluid, FluidId } from "../thermo/types";
import { controlSource, defaultCapacityControl, powerFraction } from "./part-load";
import { buildRoomHourModel, directRoomHour, fastRoomHour, type HourFactors, type RoomHourModel } from "./room-hours";
import { operationSchema, type CapacityControl, type CircuitOperation, type OperationInput } from "./schema";
import { calendarOf, hourLabel, validateWeatherYear, type Calendar, type WeatherYear } from "./weather";

export * from "./schema";
export { sineDayYear, constantYear, validateWeatherYear, calendarOf, hourLabel, weekdayOfJan1, isLeapYear, parseMonthlyClimate, MONTH_NAMES } from "./weather";
export type { WeatherYear, Calendar } from "./weather";
export { powerFraction, leadPowerFraction, defaultCapacityControl, SLIDE_VALVE_CURVE, VSD_EFFICIENCY_CURVE, SLIDE_VALVE_SOURCE, VSD_SOURCE, CYCLING_SOURCE } from "./part-load";

export const ANNUAL_ENGINE_VERSION = "annual-1.0.0";

export interface SplitKWh {
  compressors: number;
  condenserFans: number;
  evaporatorFans: number;
  defrost: number;
  /** Refrigerant pumps, oil-cooling pumps and other circuit auxiliaries. */
  pumps: number;
}

export interface MonthFigures {
  kWh: number;
  /** Refrigeration delivered, kWh (facility: to the rooms; circuit: rooms + cascade exchangers). */
  loadKWh: number;
  /** loadKWh ÷ (compressor shaft + refrigerant pump) kWh of the month; null without load. */
  meanCOP: number | null;
}

export interface PeakHour {
  index: number;
  month: number;
  dayOfMonth: number;
  hourOfDay: number;
  label: string;
  dryBulbC: number;
  rhPct: number;
}

export interface AnnualFigures {
  kWh: number;
  split: SplitKWh;
  /** Refrigeration delivered over the year, kWh. */
  loadKWh: number;
  monthly: MonthFigures[];
  peakKWe: number;
  peakHour: PeakHour;
  /** Σ refrigeration ÷ Σ (compressor shaft + refrigerant pump input): the plant engine's COP definition, over the year. */
  seasonalCOP: number | null;
  /** Σ refrigeration ÷ Σ Carnot work of the same hours (rooms' air to the hour's sink); null when the sink is never warmer. */
  seasonalCarnotCOP: number | null;
  /** Σ refrigeration ÷ Σ all kWe (fans, defrost and pumps included). */
  seasonalSystemCOP: number | null;
  kWhPerM3: number | null;
  kWhPerTonne: number | null;
  /** Hours at each condensing temperature, 1 K bins (facility: circuit-hours of circuits rejecting to a condenser). */
  hoursAtCondensingC: { fromC: number; toC: number; hours: number }[];
  cost: { energy: number; demand: number; total: number };
  /** Load the compressors could not meet at the hour's temperatures, kWh, and in how many hours. */
  unmetLoadKWh: number;
  hoursOverCapacity: number;
  trace: FigureTrace;
}

export interface FigureTrace {
  /** How the figures were formed, one statement each. */
  statements: string[];
  /** Named inputs behind the figures. */
  inputs: Record<string, number | string>;
  /** The peak hour taken apart, kWe. */
  peak: { label: string; kWe: SplitKWh; loadKW: number; condensingC?: number; partLoadRatio?: number; powerFraction?: number };
}

export interface AnnualResult {
  engineVersion: string;
  method: "fast" | "direct";
  hours: number;
  weather: { kind: WeatherYear["source"]["kind"]; label: string; year: number };
  facility: AnnualFigures;
  circuits: Array<AnnualFigures & { circuitId: string; name: string }>;
  /** Rooms' load over the year, kWh, and the evaporators' share of fans and defrost. */
  rooms: Array<{ roomId: string; name: string; loadKWh: number; served: boolean; defrostsPerYear: number }>;
  statements: string[];
  warnings: string[];
}

export interface AnnualOptions {
  /** "fast" (default): cycle results tabulated on a condensing-temperature grid; "direct": the cycle at every hour. */
  method?: "fast" | "direct";
  /** Grid step of the cycle table, K (fast method); default 0.5. */
  gridStepK?: number;
  getFluid?: (id: FluidId) => Fluid;
}

/** Validates the `operation` section (defaults filled); errors name `operation.<path>` and the range. */
export function parseOperation(raw: unknown, model?: Pick<FacilityModel, "plant" | "doors">): OperationInput {
  const r = operationSchema.safeParse(raw ?? {});
  if (!r.success) throw new LoadInputError(r.error.issues.map((i) => ({ field: ["operation", ...i.path.map(String)].join("."), message: i.message })));
  if (model) {
    const circuits = new Set(model.plant.circuits.map((c) => c.id));
    for (const id of Object.keys(r.data.circuits)) if (!circuits.has(id)) fail(`operation.circuits.${id}`, `no circuit with id "${id}"`);
    const doors = new Set(model.doors.map((d) => d.id));
    for (const id of Object.keys(r.data.doorTraffic.byDoor)) if (!doors.has(id)) fail(`operation.doorTraffic.byDoor.${id}`, `no door with id "${id}"`);
  }
  return r.data;
}

function ledgerPart(m: FacilityModel): LedgerInput {
  const { schemaVersion, plant, operation, ...ledger } = m as FacilityModel & { operation?: unknown };
  void schemaVersion;
  void plant;
  void operation;
  return ledger;
}

interface CircuitPlan {
  c: CircuitInput;
  index: number;
  op: CircuitOperation;
  control: CapacityControl;
  units: number;
  design: CircuitResult;
  sized: EvaporatorSizing[];
  /** Condensing temperature fixed all year (cascade low stage, user-set, water at a set temperature). */
  fixedC?: number;
  condenserIndex?: number;
  /** Approach the condenser's own design uses, K (for building the table's ambient). */
  designApproachK: number;
  approachK: number;
  minC: number;
  cascadeEvapC?: number;
  load: Float64Array;
  entropy: Float64Array;
  pump: Float64Array;
  evapFans: Float64Array;
  defrost: Float64Array;
  lowHeat: Float64Array;
  /** Direct method: each evaporator's duty per hour, and each low stage's heat per hour. */
  evapDuty?: Map<string, Float64Array>;
  lowHeatBy?: Map<string, Float64Array>;
  sinkHourly?: Float64Array;
}

const SPLIT_KEYS = ["compressors", "condenserFans", "evaporatorFans", "defrost", "pumps"] as const;

/**
 * A year of the facility, hour by hour. The design (computeFacility) sizes the evaporators
 * and compressors; every hour then has its own loads, condensing temperature and part load.
 * Throws LoadInputError / PlantError naming the field on bad input or an impossible result.
 */
export function runAnnual(model: FacilityModel, weather: WeatherYear, opts: AnnualOptions = {}): AnnualResult {
  const method = opts.method ?? "fast";
  const step = opts.gridStepK ?? 0.5;
  if (!(step > 0 && step <= 5)) fail("gridStepK", "must be greater than 0 and at most 5 K");
  validateWeatherYear(weather);
  const op = parseOperation((model as { operation?: unknown }).operation, model);
  const getFluid = opts.getFluid ?? thermoGetFluid;
  const design = computeFacility(model, { getFluid });
  const lctx = contextFromParsed(ledgerPart(model));
  const hours = weather.dryBulbC.length;
  const cal = calendarOf(hours, weather.startWeekday);
  const pressurePa = weather.pressurePa ?? lctx.site.pressurePa;

  // The hour's outdoor air (psychrolib at the site pressure) and wet bulb (Stull, as the plant's design does).
  const air: AirState[] = new Array(hours);
  const wetBulb = new Float64Array(hours);
  for (let i = 0; i < hours; i++) {
    const t = weather.dryBulbC[i];
    air[i] = airFromRH(t, weather.rhPct[i], pressurePa, `weather.rhPct.${i}`);
    wetBulb[i] = Math.min(t, stullWetBulbC(t, weather.rhPct[i]));
  }

  const prep = preparePlant(model.plant);
  const designById = new Map(design.plant.circuits.map((r) => [r.id, r]));
  const sizedByRoom = new Map<string, EvaporatorSizing[]>();
  for (const s of design.plant.evaporators) sizedByRoom.set(s.roomId, [...(sizedByRoom.get(s.roomId) ?? []), s]);
  const warnings: string[] = [];
  const rooms = new Map(model.rooms.map((r) => [r.id, { setPointC: r.setPointC, rhPct: r.rhPct }]));

  // Circuits -------------------------------------------------------------------------------
  const plans = new Map<string, CircuitPlan>();
  model.plant.circuits.forEach((c, index) => {
    const d = designById.get(c.id);
    if (!d) return; // no load at design: nothing runs
    const cop = op.circuits[c.id] ?? operationSchema.shape.circuits.parse({ x: {} }).x;
    const units = Math.max(1, c.compressor.units - c.compressor.standbyUnits);
    const plan: CircuitPlan = {
      c,
      index,
      op: cop,
      control: cop.capacityControl ?? defaultCapacityControl(c.compressor.type, units),
      units,
      design: d,
      sized: design.plant.evaporators.filter((e) => e.circuitId === c.id),
      designApproachK: 0,
      approachK: 0,
      minC: cop.minCondensingC ?? (c.refrigerant === "R744" ? 10 : 20),
      load: new Float64Array(hours),
      entropy: new Float64Array(hours),
      pump: new Float64Array(hours),
      evapFans: new Float64Array(hours),
      defrost: new Float64Array(hours),
      lowHeat: new Float64Array(hours),
    };
    const hr = c.heatRejection;
    if (hr.to === "circuit") {
      plan.fixedC = hr.condensingC;
    } else {
      const ci = prep.condenserIndex.get(hr.condenserId)!;
      const cd = model.plant.condensers[ci];
      plan.condenserIndex = ci;
      plan.designApproachK = cd.approachK ?? defaultApproachK(cd.type, c.arrangement === "transcritical");
      plan.approachK = cop.approachK ?? plan.designApproachK;
      if (cd.type === "user-set") plan.fixedC = cd.condensingC;
      if (cd.type === "water-cooled" && cd.waterInC !== undefined) plan.fixedC = cd.waterInC + plan.designApproachK;
    }
    plans.set(c.id, plan);
  });
  for (const p of plans.values()) {
    const hr = p.c.heatRejection;
    if (hr.to === "circuit") plans.get(hr.circuitId)!.cascadeEvapC = hr.condensingC - hr.approachK;
  }

  // Rooms, hour by hour -------------------------------------------------------------------
  const intake = op.productIntake;
  const roomModels: RoomHourModel[] = model.rooms.map((r, i) => buildRoomHourModel(r, i, lctx, op));
  const roomOut: AnnualResult["rooms"] = [];
  let tonnes = 0;
  let volumeM3 = 0;
  const dayFactor = new Float64Array(cal.days);
  for (let d = 0; d < cal.days; d++) {
    const i = d * 24;
    dayFactor[d] = (intake.byWeekday?.[cal.weekday[i]] ?? 1) * (intake.byMonth?.[cal.month[i]] ?? 1);
  }
  const facilityLoad = new Float64Array(hours);
  const roomVolumeByCircuit = new Map<string, number>();
  for (const m of roomModels) {
    const r = m.room;
    const vol = r.lengthM * r.widthM * r.heightM;
    volumeM3 += vol;
    for (let d = 0; d < cal.days; d++) tonnes += m.designIntakeT * dayFactor[d];
    const evs = sizedByRoom.get(r.id) ?? [];
    for (const e of evs) roomVolumeByCircuit.set(e.circuitId, (roomVolumeByCircuit.get(e.circuitId) ?? 0) + vol / evs.length);
    const base = new Float64Array(24);
    let loadWh = 0;
    let defrosts = 0;
    for (let d = 0; d < cal.days; d++) {
      let moistureKg = 0;
      for (let h = 0; h < 24; h++) {
        const i = d * 24 + h;
        const wd = cal.weekday[i];
        const f: HourFactors = { product: dayFactor[d], people: op.people?.[wd][h] ?? 1, lights: op.lights?.[wd][h] ?? 1 };
        const fast = fastRoomHour(m, h, wd, f, air[i]);
        base[h] = method === "direct" ? directRoomHour(m, h, wd, f, air[i], lctx) : fast.w;
        moistureKg += fast.moistureKgS * 3600;
      }
      // Defrosts per day rise with the moisture the air exchange brings in (README: the rule).
      const ratio = m.designMoistureKg > 0 ? Math.min(op.defrost.maxFactor, op.defrost.fixedShare + (1 - op.defrost.fixedShare) * (moistureKg / m.designMoistureKg)) : 1;
      let fanW = 0;
      let fanHeatW = 0;
      let defrostHeatW = 0;
      const perEvap: { e: EvaporatorSizing; fanW: number; electricW: number }[] = [];
      for (const e of evs) {
        const n = Math.min(e.defrost.defrostsPerDay * ratio, e.defrost.minutesPerDefrost > 0 ? 1440 / e.defrost.minutesPerDefrost : Infinity);
        defrosts += n;
        const downH = e.defrost.type === "off-cycle" ? 0 : (e.defrost.minutesPerDefrost * n) / 60;
        const fw = (e.fanPowerW * Math.max(0, 24 - downH)) / 24;
        const heat = (e.defrost.heaterW * (e.defrost.minutesPerDefrost / 60) * n * e.defrost.fractionToRoom) / 24;
        fanW += fw;
        fanHeatW += fw;
        defrostHeatW += heat;
        perEvap.push({ e, fanW: fw, electricW: (e.defrost.electricW * (e.defrost.minutesPerDefrost / 60) * n) / 24 });
      }
      void fanW;
      for (let h = 0; h < 24; h++) {
        const i = d * 24 + h;
        const q = Math.max(0, base[h] + fanHeatW + defrostHeatW);
        loadWh += q;
        facilityLoad[i] += evs.length ? q : 0;
        for (const pe of perEvap) {
          const plan = plans.get(pe.e.circuitId);
          if (!plan) continue;
          const share = q / evs.length;
          plan.load[i] += share;
          if (method === "direct") {
            plan.evapDuty ??= new Map();
            let a = plan.evapDuty.get(pe.e.id);
            if (!a) plan.evapDuty.set(pe.e.id, (a = new Float64Array(hours)));
            a[i] += share;
          }
          plan.entropy[i] += share / (r.setPointC + K0);
          plan.pump[i] += pumpPerW(plan, pe.e, getFluid) * share;
          plan.evapFans[i] += pe.fanW;
          plan.defrost[i] += pe.electricW;
        }
      }
    }
    if (evs.length === 0 && loadWh > 0) warnings.push(`${r.name}: no evaporator, its ${(loadWh / 1000).toFixed(0)} kWh of load a year are not served`);
    roomOut.push({ roomId: r.id, name: r.name, loadKWh: loadWh / 1000, served: evs.length > 0, defrostsPerYear: defrosts });
  }

  // Plant, circuit by circuit (low stages first) --------------------------------------------
  const totals = newAccumulator(hours);
  const circuitFigures: AnnualResult["circuits"] = [];
  const cctxBase: CircuitContext = { plant: model.plant, ambient: { dryBulbC: 0, wetBulbC: 0 }, rooms, getFluid };
  const lowDone = new Map<string, CircuitResult>(design.plant.circuits.map((r) => [r.id, r]));
  const price = tariffPrices(op, cal);
  const ordered = cascadeOrder(model.plant.circuits).filter((c) => plans.has(c.id));
  const perCircuitAcc = new Map<string, Accumulator>();
  for (const c of ordered) {
    const p = plans.get(c.id)!;
    const acc = newAccumulator(hours);
    perCircuitAcc.set(c.id, acc);
    const tc = new Float64Array(hours);
    const sink = new Float64Array(hours);
    let tMin = Infinity;
    let tMax = -Infinity;
    for (let i = 0; i < hours; i++) {
      const s = sinkOf(p, model, weather.dryBulbC[i], wetBulb[i]);
      sink[i] = s;
      tc[i] = p.fixedC ?? Math.max(s + p.approachK, p.minC);
      if (p.fixedC !== undefined && p.c.heatRejection.to === "condenser" && !(p.fixedC > s))
        throw new PlantError(
          "SECOND_LAW_VIOLATION",
          `${c.tag}: the set condensing temperature ${p.fixedC} °C is not above the sink (${s.toFixed(1)} °C) in ${hourLabel(cal, i)}`,
          `plant.condensers.${p.condenserIndex}.condensingC`,
        );
      if (p.load[i] + p.lowHeat[i] > 0) {
        if (tc[i] < tMin) tMin = tc[i];
        if (tc[i] > tMax) tMax = tc[i];
      }
    }
    const table = method === "fast" && tMin <= tMax ? buildTable(p, tMin, tMax, step, model, cctxBase, prep, lowDone) : undefined;
    const designSwept = p.design.stages[0].sweptVolumeM3s;
    const fanDesignW = p.design.condenserFanW;
    const rejDesignW = p.design.heatRejectedW;
    const casc = p.cascadeEvapC;
    const motor = c.compressor.motorEfficiency;
    for (let i = 0; i < hours; i++) {
      const q = p.load[i] + p.lowHeat[i];
      acc.evaporatorFans[i] = p.evapFans[i];
      acc.defrost[i] = p.defrost[i];
      if (!(q > 0)) continue;
      const loadW = q + p.pump[i];
      let ratios: { shaft: number; swept: number; oil: number };
      if (table) ratios = table(tc[i]);
      else ratios = directRatios(p, tc[i], i, model, cctxBase, prep, lowDone, plans);
      const capW = designSwept / ratios.swept;
      const plr = loadW / capW;
      const served = Math.min(loadW, capW);
      if (plr > 1 + 1e-9) {
        acc.unmetWh += loadW - capW;
        acc.overHours++;
      }
      const pf = powerFraction(Math.min(1, plr), p.control, p.units);
      const shaftW = pf * capW * ratios.shaft;
      const rejW = served + shaftW;
      const oilW = ratios.shaft > 0 ? (shaftW * ratios.oil) / ratios.shaft : 0;
      const frac = served / loadW;
      const qServed = q * frac;
      // Carnot work of the same hour: the rooms' air (and a cascade exchanger) to the hour's sink.
      const sRes = (p.entropy[i] + (casc !== undefined ? p.lowHeat[i] / (casc + K0) : 0)) * frac;
      const carnotW = Math.max(0, (sink[i] + K0) * sRes - qServed);
      const workW = shaftW + p.pump[i] * frac;
      if (workW < carnotW * (1 - 1e-9))
        throw new PlantError("SECOND_LAW_VIOLATION", `${c.tag}: in ${hourLabel(cal, i)} the work ${workW.toFixed(0)} W is below the Carnot work ${carnotW.toFixed(0)} W`, `plant.circuits.${p.index}`);
      acc.compressors[i] = shaftW / motor;
      acc.pumps[i] = p.pump[i] * frac + (p.op.oilCoolingWPerKw * oilW) / 1000 + p.op.auxiliaryW;
      if (p.c.heatRejection.to === "condenser" && fanDesignW > 0) {
        const dT = tc[i] - sink[i];
        const x = Math.min(1, (rejW / rejDesignW) * (p.designApproachK / Math.max(dT, 1e-6)));
        acc.condenserFans[i] = fanDesignW * fanFraction(x, p.op);
      }
      acc.loadW[i] = qServed;
      acc.roomLoadW[i] = p.load[i] * frac;
      acc.roomEntropy[i] = p.entropy[i] * frac;
      acc.sink[i] = sink[i];
      acc.workW[i] = workW;
      acc.carnotW[i] = carnotW;
      acc.tc[i] = tc[i];
      acc.plr[i] = plr;
      acc.pf[i] = pf;
      const hr = p.c.heatRejection;
      if (hr.to === "circuit") {
        const hi = plans.get(hr.circuitId);
        if (hi) {
          hi.lowHeat[i] += rejW;
          if (method === "direct") {
            hi.lowHeatBy ??= new Map();
            let a = hi.lowHeatBy.get(c.id);
            if (!a) hi.lowHeatBy.set(c.id, (a = new Float64Array(hours)));
            a[i] += rejW;
          }
        }
      }
    }
    const vol = roomVolumeByCircuit.get(c.id) ?? 0;
    const tonnesC = tonnes * (vol / Math.max(volumeM3, 1e-9));
    circuitFigures.push({
      circuitId: c.id,
      name: c.tag,
      ...figures(acc, cal, weather, price, op, vol, tonnesC, p.c.heatRejection.to === "condenser", [
        `capacity control: ${controlSource(p.control)}`,
        p.fixedC !== undefined ? `condensing held at ${p.fixedC} °C all year` : `condensing = sink + ${p.approachK} K, not below ${p.minC} °C`,
      ], {
        designSweptVolumeM3s: designSwept,
        designCondenserFanW: fanDesignW,
        designHeatRejectedW: rejDesignW,
        ...(p.fixedC !== undefined ? { condensingC: p.fixedC } : { minCondensingC: p.minC, approachK: p.approachK }),
        ...(p.c.arrangement === "transcritical" ? transcriticalInputs(p, tc, getFluid) : {}),
        condenserFanControl: p.op.condenserFanControl,
      }),
    });
    addInto(totals, acc);
  }
  // Facility: room load served, the chain COP, circuits merged.
  for (let i = 0; i < hours; i++) {
    totals.loadW[i] = 0;
    totals.carnotW[i] = 0;
  }
  facilityChains(plans, perCircuitAcc, totals, hours, model, weather, wetBulb);
  const facility = figures(totals, cal, weather, price, op, volumeM3, tonnes, true, [
    "facility: refrigeration is the rooms' load served; work is every circuit's compressor shaft and pump input (cascade heat is inside the chain)",
  ], { rooms: model.rooms.length, circuits: plans.size, volumeM3, tonnesPerYear: tonnes });
  void facilityLoad;
  return {
    engineVersion: ANNUAL_ENGINE_VERSION,
    method,
    hours,
    weather: { kind: weather.source.kind, label: weather.source.label, year: weather.year },
    facility,
    circuits: model.plant.circuits.flatMap((c) => circuitFigures.filter((f) => f.circuitId === c.id)),
    rooms: roomOut,
    statements: STATEMENTS(op),
    warnings,
  };
}

const STATEMENTS = (op: OperationInput) => [
  "Each hour: every room's design-day ledger at the hour's outdoor air (transmission with the sun allowance as a daily mean, door infiltration, fresh air) and the hour's schedules (door traffic, product intake, lights, people), plus evaporator fans and defrost heat.",
  `Defrosts per day: n = n_design·[${op.defrost.fixedShare} + ${1 - op.defrost.fixedShare}·M_day/M_design], at most ${op.defrost.maxFactor}·n_design, where M is the water the door and fresh-air exchange carries in over the day.`,
  "Condensing temperature floats with the sink (air-cooled and gas coolers: dry bulb; evaporative: wet bulb by Stull's fit; water-cooled: wet bulb + 5 K) plus the approach, down to the minimum set per circuit.",
  "Compressors are the design's (swept volume at design); capacity at each hour follows the cycle at that hour's temperatures; part load by the circuit's capacity control.",
  "Costs are in the workspace's currency.",
];

/** R744 transcritical: the switch-over (gas-cooler outlet 5 K below critical, the plant engine's rule) and the hours above it. */
function transcriticalInputs(p: CircuitPlan, tc: Float64Array, getFluid: (id: FluidId) => Fluid): Record<string, number> {
  const switchC = getFluid(p.c.refrigerant).meta.criticalTempK - K0 - 5;
  let n = 0;
  for (let i = 0; i < tc.length; i++) if (tc[i] >= switchC && p.load[i] + p.lowHeat[i] > 0) n++;
  return { switchOverOutletC: switchC, switchOverAmbientC: switchC - p.approachK, transcriticalHours: n };
}

function sinkOf(p: CircuitPlan, model: FacilityModel, dryBulbC: number, wetBulbC: number): number {
  const hr = p.c.heatRejection;
  if (hr.to === "circuit") return hr.condensingC - hr.approachK;
  const cd = model.plant.condensers[p.condenserIndex!];
  if (p.c.arrangement === "transcritical") return dryBulbC;
  switch (cd.type) {
    case "evaporative":
      return wetBulbC;
    case "water-cooled":
      return cd.waterInC ?? wetBulbC + 5;
    default:
      return dryBulbC;
  }
}

/** The ambient that makes the circuit's condenser condense at tcC (the design engine's own rule run backwards). */
function ambientFor(p: CircuitPlan, model: FacilityModel, tcC: number): Ambient {
  const hr = p.c.heatRejection;
  if (hr.to === "circuit") return { dryBulbC: 0, wetBulbC: 0 };
  const cd = model.plant.condensers[p.condenserIndex!];
  const s = tcC - p.designApproachK;
  if (cd.type === "water-cooled" && cd.waterInC === undefined) return { dryBulbC: s - 5, wetBulbC: s - 5 };
  return { dryBulbC: s, wetBulbC: s };
}

const pumpCache = new WeakMap<EvaporatorSizing, number>();
/** Refrigerant-pump input per W of duty for a pumped evaporator (as circuit.ts: CR·Q/h_fg·Δp/(ρ_l·η)). */
function pumpPerW(p: CircuitPlan, e: EvaporatorSizing, getFluid: (id: FluidId) => Fluid): number {
  if (e.feed.type !== "pumped") return 0;
  let k = pumpCache.get(e);
  if (k === undefined) {
    const sat = getFluid(p.c.refrigerant).saturationAtT(p.design.suctionC + K0, p.c.tempConvention);
    const latent = sat.vapour.hJkg - sat.liquid.hJkg;
    k = (e.feed.circulationRatio * e.feed.pumpHeadPa) / (latent * sat.liquid.densityKgM3 * e.feed.pumpEfficiency);
    pumpCache.set(e, k);
  }
  return k;
}

function cycleAt(
  p: CircuitPlan,
  tcC: number,
  sized: EvaporatorSizing[],
  done: ReadonlyMap<string, CircuitResult>,
  model: FacilityModel,
  cctx: CircuitContext,
  prep: ReturnType<typeof preparePlant>,
): CircuitResult | undefined {
  try {
    return computeCircuit(p.c, sized, done, { ...cctx, ambient: ambientFor(p, model, tcC) }, prep, []);
  } catch (err) {
    if (err instanceof PlantError && p.fixedC === undefined)
      throw new PlantError(err.code, `at a condensing temperature of ${tcC.toFixed(1)} °C: ${err.message}`, `operation.circuits.${p.c.id}.minCondensingC`, err.allowed);
    throw err;
  }
}

function ratiosOf(r: CircuitResult): { shaft: number; swept: number; oil: number } {
  const loadW = r.refrigerationW + r.pumpPowerW;
  return { shaft: r.shaftPowerW / loadW, swept: r.stages[0].sweptVolumeM3s / loadW, oil: r.oilCoolerHeatW / loadW };
}

/** Cycle results per W of load on a grid of condensing temperature, linearly interpolated. */
function buildTable(
  p: CircuitPlan,
  tMin: number,
  tMax: number,
  step: number,
  model: FacilityModel,
  cctx: CircuitContext,
  prep: ReturnType<typeof preparePlant>,
  done: ReadonlyMap<string, CircuitResult>,
): (tcC: number) => { shaft: number; swept: number; oil: number } {
  // The grid starts at the lowest condensing temperature of the year, so the many hours held
  // at the minimum (and a constant-temperature year) fall on a node.
  const t0 = tMin;
  const n = tMax > tMin ? Math.ceil((tMax - tMin) / step - 1e-9) + 1 : 1;
  const shaft = new Float64Array(n);
  const swept = new Float64Array(n);
  const oil = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const r = cycleAt(p, t0 + k * step, p.sized, done, model, cctx, prep);
    if (!r) throw new PlantError("INPUT_OUT_OF_RANGE", `${p.c.tag}: no load at design to tabulate`, `plant.circuits.${p.index}`);
    const x = ratiosOf(r);
    shaft[k] = x.shaft;
    swept[k] = x.swept;
    oil[k] = x.oil;
  }
  return (tc) => {
    const u = (tc - t0) / step;
    const k = Math.min(n - 2, Math.max(0, Math.floor(u)));
    if (n === 1) return { shaft: shaft[0], swept: swept[0], oil: oil[0] };
    const f = u - k;
    return { shaft: shaft[k] + f * (shaft[k + 1] - shaft[k]), swept: swept[k] + f * (swept[k + 1] - swept[k]), oil: oil[k] + f * (oil[k + 1] - oil[k]) };
  };
}

/** The direct method: the circuit's cycle at this hour's duties and temperatures. */
function directRatios(
  p: CircuitPlan,
  tcC: number,
  i: number,
  model: FacilityModel,
  cctx: CircuitContext,
  prep: ReturnType<typeof preparePlant>,
  designDone: ReadonlyMap<string, CircuitResult>,
  plans: Map<string, CircuitPlan>,
): { shaft: number; swept: number; oil: number } {
  // The hour's duty per evaporator: the room's load shared equally by its evaporators.
  const sized = p.sized.map((e) => ({ ...e, dutyW: p.evapDuty?.get(e.id)?.[i] ?? 0 }));
  const done = new Map(designDone);
  for (const [id, lo] of plans) {
    const hr = lo.c.heatRejection;
    if (hr.to === "circuit" && hr.circuitId === p.c.id) {
      const d = designDone.get(id);
      if (d) done.set(id, { ...d, heatRejectedW: p.lowHeatBy?.get(id)?.[i] ?? 0 });
    }
  }
  const r = cycleAt(p, tcC, sized, done, model, cctx, prep);
  if (!r) return { shaft: 0, swept: 1, oil: 0 };
  return ratiosOf(r);
}

// Accumulation and figures ---------------------------------------------------------------------

interface Accumulator {
  compressors: Float64Array;
  condenserFans: Float64Array;
  evaporatorFans: Float64Array;
  defrost: Float64Array;
  pumps: Float64Array;
  /** Refrigeration the figure's COP is on, W. */
  loadW: Float64Array;
  roomLoadW: Float64Array;
  roomEntropy: Float64Array;
  sink: Float64Array;
  workW: Float64Array;
  carnotW: Float64Array;
  /** Condensing temperature (NaN when idle). */
  tc: Float64Array;
  plr: Float64Array;
  pf: Float64Array;
  unmetWh: number;
  overHours: number;
  /** Condensing temperatures counted into the histogram (facility: several circuits). */
  tcList: Float64Array[];
}

function newAccumulator(hours: number): Accumulator {
  const a = () => new Float64Array(hours);
  const tc = a().fill(NaN);
  return {
    compressors: a(),
    condenserFans: a(),
    evaporatorFans: a(),
    defrost: a(),
    pumps: a(),
    loadW: a(),
    roomLoadW: a(),
    roomEntropy: a(),
    sink: a(),
    workW: a(),
    carnotW: a(),
    tc,
    plr: a(),
    pf: a(),
    unmetWh: 0,
    overHours: 0,
    tcList: [tc],
  };
}

function addInto(t: Accumulator, a: Accumulator): void {
  for (const k of SPLIT_KEYS) for (let i = 0; i < a[k].length; i++) t[k][i] += a[k][i];
  for (let i = 0; i < a.workW.length; i++) t.workW[i] += a.workW[i];
  t.unmetWh += a.unmetWh;
  t.overHours = Math.max(t.overHours, a.overHours);
}

/** The facility's refrigeration and Carnot work: per heat-rejection chain, the rooms' air to the chain's sink. */
function facilityChains(
  plans: Map<string, CircuitPlan>,
  accs: Map<string, Accumulator>,
  totals: Accumulator,
  hours: number,
  _model: FacilityModel,
  _weather: WeatherYear,
  _wet: Float64Array,
): void {
  const top = (id: string): string => {
    let cur = plans.get(id)!;
    for (let g = 0; g < 50 && cur.c.heatRejection.to === "circuit"; g++) {
      const next = plans.get(cur.c.heatRejection.circuitId);
      if (!next) break;
      cur = next;
    }
    return cur.c.id;
  };
  const chains = new Map<string, string[]>();
  for (const id of accs.keys()) {
    const t = top(id);
    chains.set(t, [...(chains.get(t) ?? []), id]);
  }
  totals.tcList = [];
  for (const [t, ids] of chains) {
    const sink = accs.get(t)!.sink;
    totals.tcList.push(accs.get(t)!.tc);
    for (let i = 0; i < hours; i++) {
      let q = 0;
      let s = 0;
      for (const id of ids) {
        const a = accs.get(id)!;
        q += a.roomLoadW[i];
        s += a.roomEntropy[i];
      }
      totals.loadW[i] += q;
      if (q > 0) totals.carnotW[i] += Math.max(0, (sink[i] + K0) * s - q);
    }
  }
}

function fanFraction(x: number, op: CircuitOperation): number {
  if (x <= 0) return 0;
  switch (op.condenserFanControl) {
    case "proportional":
      return x;
    case "staged":
      return Math.ceil(x * op.condenserFanStages - 1e-12) / op.condenserFanStages;
    case "speed": {
      // Fan laws: input ∝ speed³ with airflow ∝ speed; below the lowest speed the fans cycle.
      const m = op.condenserFanMinSpeed;
      return x >= m ? x * x * x : (m * m * m * x) / m;
    }
  }
}

/** Price of electricity in each hour of the year, per kWh. */
function tariffPrices(op: OperationInput, cal: Calendar): Float64Array {
  const t = op.tariff;
  const out = new Float64Array(cal.hours);
  for (let i = 0; i < cal.hours; i++) {
    if (t.kind === "flat") out[i] = t.pricePerKWh;
    else {
      const h = i % 24;
      const day = t.dayStartHour <= t.dayEndHour ? h >= t.dayStartHour && h < t.dayEndHour : h >= t.dayStartHour || h < t.dayEndHour;
      out[i] = day ? t.dayPricePerKWh : t.nightPricePerKWh;
    }
  }
  return out;
}

function figures(
  a: Accumulator,
  cal: Calendar,
  weather: WeatherYear,
  price: Float64Array,
  op: OperationInput,
  volumeM3: number,
  tonnes: number,
  histogram: boolean,
  statements: string[],
  inputs: Record<string, number | string>,
): AnnualFigures {
  const hours = cal.hours;
  const split: SplitKWh = { compressors: 0, condenserFans: 0, evaporatorFans: 0, defrost: 0, pumps: 0 };
  const monthly: MonthFigures[] = Array.from({ length: 12 }, () => ({ kWh: 0, loadKWh: 0, meanCOP: null }));
  const monthWork = new Float64Array(12);
  const monthPeak = new Float64Array(12);
  let loadWh = 0;
  let workWh = 0;
  let carnotWh = 0;
  let energyCost = 0;
  let peak = -1;
  let peakI = 0;
  for (let i = 0; i < hours; i++) {
    let kwe = 0;
    for (const k of SPLIT_KEYS) {
      split[k] += a[k][i] / 1000;
      kwe += a[k][i] / 1000;
    }
    const m = cal.month[i];
    monthly[m].kWh += kwe;
    monthly[m].loadKWh += a.loadW[i] / 1000;
    monthWork[m] += a.workW[i] / 1000;
    if (kwe > monthPeak[m]) monthPeak[m] = kwe;
    if (kwe > peak) {
      peak = kwe;
      peakI = i;
    }
    loadWh += a.loadW[i];
    workWh += a.workW[i];
    carnotWh += a.carnotW[i];
    energyCost += kwe * price[i];
  }
  for (let m = 0; m < 12; m++) monthly[m].meanCOP = monthWork[m] > 0 ? monthly[m].loadKWh / monthWork[m] : null;
  const kWh = SPLIT_KEYS.reduce((s, k) => s + split[k], 0);
  const seasonalCOP = workWh > 0 ? loadWh / workWh : null;
  const seasonalCarnotCOP = carnotWh > 0 ? loadWh / carnotWh : null;
  if (seasonalCOP !== null && seasonalCarnotCOP !== null && seasonalCOP > seasonalCarnotCOP * (1 + 1e-9))
    throw new PlantError("SECOND_LAW_VIOLATION", `seasonal COP ${seasonalCOP.toFixed(3)} above the seasonal Carnot COP ${seasonalCarnotCOP.toFixed(3)}`, "plant.circuits");
  for (const v of [kWh, loadWh, workWh, carnotWh, energyCost])
    if (!Number.isFinite(v)) throw new PlantError("INPUT_OUT_OF_RANGE", "an annual figure came out non-finite: check the weather and operation inputs", "operation");
  const demandRate = op.tariff.demandChargePerKWMonth;
  const demand = monthPeak.reduce((s, v) => s + v * demandRate, 0);
  const hist = new Map<number, number>();
  if (histogram)
    for (const tc of a.tcList)
      for (let i = 0; i < hours; i++) {
        const t = tc[i];
        if (Number.isNaN(t)) continue;
        const b = Math.floor(t);
        hist.set(b, (hist.get(b) ?? 0) + 1);
      }
  const peakKWe: SplitKWh = { compressors: 0, condenserFans: 0, evaporatorFans: 0, defrost: 0, pumps: 0 };
  for (const k of SPLIT_KEYS) peakKWe[k] = a[k][peakI] / 1000;
  return {
    kWh,
    split,
    loadKWh: loadWh / 1000,
    monthly,
    peakKWe: peak,
    peakHour: {
      index: peakI,
      month: cal.month[peakI],
      dayOfMonth: cal.dayOfMonth[peakI],
      hourOfDay: peakI % 24,
      label: hourLabel(cal, peakI),
      dryBulbC: weather.dryBulbC[peakI],
      rhPct: weather.rhPct[peakI],
    },
    seasonalCOP,
    seasonalCarnotCOP,
    seasonalSystemCOP: kWh > 0 ? loadWh / 1000 / kWh : null,
    kWhPerM3: volumeM3 > 0 ? kWh / volumeM3 : null,
    kWhPerTonne: tonnes > 0 ? kWh / tonnes : null,
    hoursAtCondensingC: [...hist.entries()].sort((x, y) => x[0] - y[0]).map(([b, h]) => ({ fromC: b, toC: b + 1, hours: h })),
    cost: { energy: energyCost, demand, total: energyCost + demand },
    unmetLoadKWh: a.unmetWh / 1000,
    hoursOverCapacity: a.overHours,
    trace: {
      statements,
      inputs: { ...inputs, hours, weather: weather.source.label, tariff: op.tariff.kind, demandChargePerKWMonth: demandRate },
      peak: {
        label: hourLabel(cal, peakI),
        kWe: peakKWe,
        loadKW: a.loadW[peakI] / 1000,
        condensingC: Number.isNaN(a.tc[peakI]) ? undefined : a.tc[peakI],
        partLoadRatio: a.plr[peakI] || undefined,
        powerFraction: a.pf[peakI] || undefined,
      },
    },
  };
}
