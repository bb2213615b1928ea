/**
 * Installed-plant re-rating (issue 5 §4): what the equipment actually installed can deliver
 * at other conditions — a new room temperature, suction or condensing temperature, another
 * ambient — with standby units excluded. The stocking check compares a new load with this.
 *
 * Evaporators: Q = UA·TD with UA from the rating (Q_rated / TD_rated), DOMAIN.md §2.
 * Compressors: a swept volume V gives Q = V·η_v·ρ₁·(h₁ − h₄); a rated machine's effective
 * swept volume and power factor come from the same cycle model at its rating conditions, so
 * the efficiency curves carry it to the new point. Condensers: heat rejection proportional
 * to the approach (condensing − sink), Q = UA·ΔT.
 */
import type { FacilityModel } from "../model";
import { getFluid as thermoGetFluid } from "../thermo";
import type { Fluid, FluidId } from "../thermo/types";
import { ambientOf } from "./ambient";
import { airFromRH, sitePressurePa } from "../loads/psychro";
import { condenserSink, K0, satPressurePa, type Ambient, type PlantWarning } from "./circuit";
import { singleStageCycle, transcriticalCycle, twoStageCycle, type CycleSpec } from "./cycle";
import { PlantError } from "./errors";
import { defaultTdK } from "./evaporator";
import type { CircuitInput, InstalledPlant } from "./schema";

const P_STD = 101_325;

export interface RerateConditions {
  ambient?: Partial<Ambient>;
  /** New set points by room id. */
  rooms?: Record<string, { setPointC: number }>;
  /** Saturated suction and condensing temperatures by circuit id, °C; default from the model. */
  circuits?: Record<string, { suctionC?: number; condensingC?: number }>;
}

export interface CircuitRerate {
  circuitId: string;
  tag: string;
  suctionC: number;
  condensingC: number;
  /** Running compressors (standby excluded), W refrigeration. */
  compressorCapacityW: number;
  compressorShaftPowerW: number;
  /** Installed evaporators on the circuit at the new TDs, W. */
  evaporatorCapacityW: number;
  /** Refrigeration the installed condensers can reject heat for; null if none recorded. */
  condenserLimitW: number | null;
  availableW: number;
  limitedBy: "compressors" | "evaporators" | "condenser" | "high-stage";
  /** Cascade high stages: the part of availableW their low stages' rejected heat takes, W. */
  cascadeLoadW: number;
  /**
   * Two-stage circuits with high-stage machines recorded: each stage's compressors as
   * refrigeration at the evaporators, W, and the intermediate temperature they were rated at.
   */
  stages?: { intermediateC: number; lowW: number; highW: number; limitedBy: "low" | "high" };
}

export interface RoomRerate {
  roomId: string;
  setPointC: number;
  evaporatorCapacityW: number;
  /** What the room can get: its evaporators, capped by the circuits behind them. */
  availableW: number;
}

export interface RerateResult {
  ambient: Ambient;
  circuits: CircuitRerate[];
  /** Each installed evaporator item with the factors applied to its rating. */
  evaporators: EvaporatorRerateTrace[];
  rooms: RoomRerate[];
  warnings: PlantWarning[];
}

interface PerWatt {
  /** Swept volume per W of refrigeration (first stage), m³/s per W. */
  sweptM3sPerW: number;
  shaftWPerW: number;
  /** Two-stage: the low stage's own shaft power per W (shaftWPerW is both stages'). */
  lowShaftWPerW?: number;
  /** Two-stage: the high stage's swept volume and shaft power per W of refrigeration. */
  high?: { sweptM3sPerW: number; shaftWPerW: number };
}

function perWatt(
  fluid: Fluid,
  c: CircuitInput,
  type: CircuitInput["compressor"]["type"],
  suctionC: number,
  condensingC: number,
  superheatK: number,
  subcoolingK: number,
  arrangement: CircuitInput["arrangement"] = c.arrangement,
): PerWatt {
  const spec: CycleSpec = {
    fluid,
    convention: c.tempConvention,
    evaporatingK: suctionC + K0,
    condensingK: condensingC + K0,
    superheatK,
    subcoolingK,
    compressor: { ...c.compressor, type },
    loadW: 1,
    coldReservoirs: [{ heatW: 1, tK: suctionC + K0 + 1 }],
    sinkK: condensingC + K0 - 1,
    intermediateK: arrangement === "two-stage" && c.intermediateC !== undefined ? c.intermediateC + K0 : undefined,
    // CO2: the high-pressure control's set point and the switch-over to condensing, as the
    // design calculation uses them (circuit.ts), so re-rating sees the same cycle.
    highSidePa: typeof c.highSidePa === "number" ? c.highSidePa : undefined,
    switchOverK: c.switchOverC === undefined ? undefined : c.switchOverC + K0,
  };
  const r = arrangement === "two-stage" ? twoStageCycle(spec) : arrangement === "transcritical" ? transcriticalCycle(spec) : singleStageCycle(spec);
  if (arrangement === "two-stage") {
    const [lo, hi] = r.stages;
    return { sweptM3sPerW: lo.sweptVolumeM3s, shaftWPerW: r.shaftPowerW, lowShaftWPerW: lo.shaftPowerW, high: { sweptM3sPerW: hi.sweptVolumeM3s, shaftWPerW: hi.shaftPowerW } };
  }
  return { sweptM3sPerW: r.stages[0].sweptVolumeM3s, shaftWPerW: r.shaftPowerW };
}

/** Saturation temperature (°C, the circuit's convention) of the intermediate pressure of a two-stage cycle. */
function intermediateOf(fluid: Fluid, c: CircuitInput, suctionC: number, condensingC: number): number {
  if (c.intermediateC !== undefined) return c.intermediateC;
  const pL = satPressurePa(fluid, suctionC + K0, c.tempConvention);
  const pH = satPressurePa(fluid, condensingC + K0, c.tempConvention);
  return fluid.saturationAtP(Math.sqrt(pL * pH)).vapour.tK - K0;
}

/** Unit-cooler capacity relative to DX feed: pumped / flooded coils wet the whole tube and have no superheat section (common practice, makers' catalogue factors 1.1–1.2, from memory). */
export const FEED_CAPACITY_FACTOR = { dx: 1, pumped: 1.15 } as const;
/** Mean capacity lost to frost over a defrost cycle for a coil below 0 °C (common practice). */
export const DEFAULT_FROST_CAPACITY_LOSS = 0.1;
/** Air-on RH a rating is taken at when none is given: EN 328 wet standard conditions (from memory). */
export const DEFAULT_RATING_RH_PCT = 85;

/**
 * The coil's driving temperature difference with the latent part, K:
 * `TD + (W_on − W_s(t_evap))·h_fg/c_p`, the enthalpy potential of a wet (or frosting) coil
 * divided by the moist-air specific heat (Threlkeld; ASHRAE Handbook—Fundamentals, cooling and
 * dehumidifying coils), with the coil surface taken at the evaporating temperature. h_fg is
 * the heat of condensation (2501 kJ/kg) above 0 °C and of deposition (2834 kJ/kg) below.
 */
export function coilDrivingTdK(airOnC: number, rhPct: number, evaporatingC: number, pressurePa: number): { tdK: number; latentK: number; drivingK: number } {
  const tdK = Math.max(0, airOnC - evaporatingC);
  const on = airFromRH(airOnC, rhPct, pressurePa);
  const wall = airFromRH(Math.min(evaporatingC, airOnC), 100, pressurePa);
  const hfg = evaporatingC < 0 ? 2834 : 2501;
  const cp = 1.006 + 1.86 * on.humRatio;
  const latentK = tdK > 0 ? (Math.max(0, on.humRatio - wall.humRatio) * hfg) / cp : 0;
  return { tdK, latentK, drivingK: tdK + latentK };
}

export interface EvaporatorRerateTrace {
  id: string;
  tag: string;
  roomId: string;
  circuitId: string;
  runningUnits: number;
  ratedW: number;
  ratingDrivingK: number;
  siteTdK: number;
  siteDrivingK: number;
  ratingFeed: "dx" | "pumped";
  siteFeed: "dx" | "pumped";
  feedFactor: number;
  frostCapacityLoss: number;
  capacityW: number;
  formula: string;
}

/**
 * One installed evaporator item's capacity at the site: rating × driving-TD ratio × feed
 * factor × (1 − frost loss), standby units excluded. The rule and every factor are returned.
 */
export function rerateEvaporator(
  e: InstalledPlant["evaporators"][number],
  site: { setPointC: number; rhPct: number; evaporatingC: number; pressurePa: number; designFeed?: "dx" | "pumped" },
): EvaporatorRerateTrace {
  const running = e.units - e.standbyUnits;
  const rated = coilDrivingTdK(e.rating.airOnC, e.rating.rhPct ?? DEFAULT_RATING_RH_PCT, e.rating.airOnC - e.rating.tdK, P_STD);
  const now = coilDrivingTdK(site.setPointC, site.rhPct, site.evaporatingC, site.pressurePa);
  const siteFeed = e.siteFeed ?? site.designFeed ?? e.rating.feed;
  const feedFactor = FEED_CAPACITY_FACTOR[siteFeed] / FEED_CAPACITY_FACTOR[e.rating.feed];
  const frost = e.frostCapacityLoss ?? (site.evaporatingC < 0 && now.tdK > 0 ? DEFAULT_FROST_CAPACITY_LOSS : 0);
  const capacityW = running * e.ratedCapacityWPerUnit * (now.drivingK / rated.drivingK) * feedFactor * (1 - frost);
  return {
    id: e.id,
    tag: e.tag,
    roomId: e.roomId,
    circuitId: e.circuitId,
    runningUnits: running,
    ratedW: e.ratedCapacityWPerUnit,
    ratingDrivingK: rated.drivingK,
    siteTdK: now.tdK,
    siteDrivingK: now.drivingK,
    ratingFeed: e.rating.feed,
    siteFeed,
    feedFactor,
    frostCapacityLoss: frost,
    capacityW,
    formula: "Q = n·Q_rated·ΔT_drive,site/ΔT_drive,rating·F_feed·(1 − frost), ΔT_drive = TD + (W_on − W_s(t_evap))·h_fg/c_p",
  };
}

/**
 * Re-rates the installed plant recorded in `model.plant.installed` at the given conditions
 * (defaults: the design conditions of the model). On two-stage circuits each compressor set
 * serves its `stage` (default low); with high-stage machines recorded the circuit carries the
 * lesser of the two stages, at the design intermediate pressure. Fluids must be loaded first.
 */
export function rerateInstalled(model: FacilityModel, conditions: RerateConditions = {}, getFluid?: (id: FluidId) => Fluid): RerateResult {
  const inst = model.plant.installed ?? { evaporators: [], compressors: [], condensers: [] };
  const design = ambientOf(model.site);
  const ambient: Ambient = {
    dryBulbC: conditions.ambient?.dryBulbC ?? design.dryBulbC,
    wetBulbC: conditions.ambient?.wetBulbC ?? design.wetBulbC,
  };
  const fluidOf = (id: FluidId) => {
    try {
      return (getFluid ?? thermoGetFluid)(id);
    } catch (err) {
      throw new PlantError("FLUID_NOT_LOADED", err instanceof Error ? err.message : String(err), "plant.circuits.refrigerant");
    }
  };
  const setPoint = (roomId: string) => conditions.rooms?.[roomId]?.setPointC ?? model.rooms.find((r) => r.id === roomId)?.setPointC ?? 0;
  const rhOf = (roomId: string) => model.rooms.find((r) => r.id === roomId)?.rhPct ?? 85;
  const pressurePa = sitePressurePa(model.site.elevationM);
  const evapTraces: EvaporatorRerateTrace[] = [];
  const designTd = (roomId: string, circuitId: string) =>
    model.plant.evaporators.find((e) => e.roomId === roomId && e.circuitId === circuitId)?.tdK ?? defaultTdK(setPoint(roomId), rhOf(roomId));
  const warnings: PlantWarning[] = [];
  const out: CircuitRerate[] = [];
  const evapCap = new Map<string, Map<string, number>>(); // circuit → room → W
  const perWOf = new Map<string, number>();
  const rejectionNeed = new Map<string, { circuit: CircuitRerate; perW: number; condenserId: string }>();

  model.plant.circuits.forEach((c) => {
    const fluid = fluidOf(c.refrigerant);
    const evs = inst.evaporators.filter((e) => e.circuitId === c.id);
    const comps = inst.compressors.map((x, i) => ({ x, i })).filter(({ x }) => x.circuitId === c.id);
    if (evs.length === 0 && comps.length === 0) return;
    const lows = model.plant.circuits.filter((o) => o.heatRejection.to === "circuit" && o.heatRejection.circuitId === c.id);
    const evapTemps = evs.map((e) => setPoint(e.roomId) - designTd(e.roomId, c.id));
    for (const lo of lows) if (lo.heatRejection.to === "circuit") evapTemps.push(lo.heatRejection.condensingC - lo.heatRejection.approachK);
    const given = conditions.circuits?.[c.id];
    const suctionC = given?.suctionC ?? (evapTemps.length ? Math.min(...evapTemps) : -10) - c.suctionLineAllowanceK;
    const hr = c.heatRejection;
    let condensingC: number;
    if (given?.condensingC !== undefined) condensingC = given.condensingC;
    else if (hr.to === "circuit") condensingC = hr.condensingC;
    else {
      const idx = model.plant.condensers.findIndex((x) => x.id === hr.condenserId);
      condensingC = condenserSink(model.plant.condensers[idx], idx, ambient, c.arrangement === "transcritical").condensingC;
    }
    // As the design: the circuit's superheat, else the largest DX superheat on it (0 if all pumped).
    const dx = model.plant.evaporators.flatMap((e) => (e.circuitId === c.id && e.feed.type === "dx" ? [e.feed.superheatK] : []));
    const superheatK = c.superheatK ?? (dx.length ? Math.max(...dx) : 0);
    const now = perWatt(fluid, c, c.compressor.type, suctionC, condensingC, superheatK, c.subcoolingK);

    // Two-stage circuits: machines marked "high" serve the high stage; the others (and all
    // machines of older documents, which carry no stage) the low stage.
    const twoStage = c.arrangement === "two-stage";
    const intermediateC = twoStage ? intermediateOf(fluid, c, suctionC, condensingC) : undefined;
    const stageTotals = { low: { q: 0, p: 0, n: 0 }, high: { q: 0, p: 0, n: 0 } };
    let markedLowW = 0;
    for (const { x, i } of comps) {
      const running = x.units - x.standbyUnits;
      const nowT = x.type === c.compressor.type ? now : perWatt(fluid, c, x.type, suctionC, condensingC, superheatK, c.subcoolingK);
      const high = twoStage && x.stage === "high";
      // Explicit stages carry their own stage's power; a machine without a stage (older
      // documents) carries both stages', as before.
      const perW = high ? nowT.high! : twoStage && x.stage === "low" ? { sweptM3sPerW: nowT.sweptM3sPerW, shaftWPerW: nowT.lowShaftWPerW! } : nowT;
      let sweptPerUnit: number;
      let powerFactor = 1;
      if (x.rating.by === "swept-volume") sweptPerUnit = x.rating.sweptVolumeM3sPerUnit;
      else {
        const r = x.rating;
        const teK = r.evaporatingC + K0;
        const tcK = r.condensingC + K0;
        const carnot = teK / (tcK - teK);
        if (!(tcK > teK) || r.capacityWPerUnit / r.shaftPowerWPerUnit > carnot)
          throw new PlantError(
            "SECOND_LAW_VIOLATION",
            `${x.tag}: rated COP ${(r.capacityWPerUnit / r.shaftPowerWPerUnit).toFixed(2)} exceeds the Carnot COP ${carnot.toFixed(2)} of its rating temperatures`,
            `plant.installed.compressors.${i}.rating.shaftPowerWPerUnit`,
          );
        // A machine given its stage is rated as the single stage it is (a booster from the
        // evaporating to the intermediate temperature, a high-stage machine from there to the
        // condensing); without a stage, as the low stage of the whole two-stage lift.
        const asSingle = twoStage && x.stage !== undefined;
        const atRating = perWatt(fluid, c, x.type, r.evaporatingC, r.condensingC, r.superheatK, r.subcoolingK, asSingle ? "single-stage" : c.arrangement);
        sweptPerUnit = r.capacityWPerUnit * atRating.sweptM3sPerW;
        powerFactor = r.shaftPowerWPerUnit / (r.capacityWPerUnit * atRating.shaftWPerW);
      }
      const q = (running * sweptPerUnit) / perW.sweptM3sPerW;
      const t = stageTotals[high ? "high" : "low"];
      t.q += q;
      t.p += q * perW.shaftWPerW * powerFactor;
      t.n++;
      if (twoStage && x.stage === "low") markedLowW += q;
    }
    let compressorCapacityW: number;
    let compressorShaftPowerW: number;
    let stages: CircuitRerate["stages"];
    const lo = stageTotals.low;
    const hi = stageTotals.high;
    if (twoStage && hi.n > 0) {
      // The refrigeration both stages can carry is the lesser; each stage's power scales to it.
      const lowW = lo.n > 0 ? lo.q : hi.q;
      compressorCapacityW = Math.min(lowW, hi.q);
      const lowShaftPerW = lo.n > 0 && lo.q > 0 ? lo.p / lo.q : now.lowShaftWPerW!;
      const highShaftPerW = hi.q > 0 ? hi.p / hi.q : now.high!.shaftWPerW;
      compressorShaftPowerW = compressorCapacityW * (lowShaftPerW + highShaftPerW);
      stages = { intermediateC: intermediateC!, lowW: lo.n > 0 ? lo.q : Number.NaN, highW: hi.q, limitedBy: hi.q < lowW ? "high" : "low" };
      if (lo.n === 0) stages.lowW = hi.q;
    } else {
      // Single stage, or low-stage machines alone (the high stage taken to follow; a machine
      // marked "low" adds the high stage's power, one without a stage already carries it).
      compressorCapacityW = lo.q;
      compressorShaftPowerW = lo.p + (twoStage ? markedLowW * now.high!.shaftWPerW : 0);
    }
    if (comps.length === 0)
      warnings.push({ code: "INSTALLED_SHORTFALL", severity: "warning", message: `${c.tag}: no installed compressors recorded`, ref: { kind: "circuit", id: c.id, tag: c.tag } });

    const byRoom = new Map<string, number>();
    let evaporatorCapacityW = 0;
    for (const e of evs) {
      const sp = setPoint(e.roomId);
      // A warmer room's coil is held at its design TD by its regulator; colder ones see the suction.
      const evapC = Math.max(suctionC + c.suctionLineAllowanceK, sp - designTd(e.roomId, c.id));
      const designFeed = model.plant.evaporators.find((d) => d.roomId === e.roomId && d.circuitId === c.id)?.feed.type;
      const tr = rerateEvaporator(e, { setPointC: sp, rhPct: rhOf(e.roomId), evaporatingC: evapC, pressurePa, designFeed });
      evapTraces.push(tr);
      const q = tr.capacityW;
      byRoom.set(e.roomId, (byRoom.get(e.roomId) ?? 0) + q);
      evaporatorCapacityW += q;
    }
    // A cascade high stage also serves its low stages: their exchanger counts as "evaporator".
    const serves = lows.length > 0 ? Number.POSITIVE_INFINITY : evaporatorCapacityW;
    evapCap.set(c.id, byRoom);
    const r: CircuitRerate = {
      circuitId: c.id,
      tag: c.tag,
      suctionC,
      condensingC,
      compressorCapacityW,
      compressorShaftPowerW,
      evaporatorCapacityW,
      condenserLimitW: null,
      availableW: Math.min(compressorCapacityW, serves),
      limitedBy: compressorCapacityW <= serves ? "compressors" : "evaporators",
      cascadeLoadW: 0,
      ...(stages ? { stages } : {}),
    };
    out.push(r);
    const perW = 1 + (compressorCapacityW > 0 ? compressorShaftPowerW / compressorCapacityW : now.shaftWPerW);
    perWOf.set(c.id, perW);
    if (hr.to === "condenser") rejectionNeed.set(c.id, { circuit: r, perW, condenserId: hr.condenserId });
  });

  // Condensers shared by several circuits split their capacity in proportion to the heat
  // the circuits would reject at their otherwise-available capacity.
  for (const cd of model.plant.condensers) {
    const units = inst.condensers.filter((x) => x.condenserId === cd.id);
    if (units.length === 0) continue;
    const on = [...rejectionNeed.values()].filter((n) => n.condenserId === cd.id);
    if (on.length === 0) continue;
    const cIdx = model.plant.condensers.indexOf(cd);
    const firstCircuit = model.plant.circuits.find((c) => c.id === on[0].circuit.circuitId)!;
    const sink = condenserSink(cd, cIdx, ambient, firstCircuit.arrangement === "transcritical");
    const condensingC = Math.max(...on.map((n) => n.circuit.condensingC));
    const approachNow = condensingC - sink.sinkC;
    const capacity = units.reduce((a, x) => a + (x.units - x.standbyUnits) * x.ratedHeatRejectionWPerUnit * Math.max(0, approachNow / x.ratingApproachK), 0);
    const need = on.reduce((a, n) => a + n.circuit.availableW * n.perW, 0);
    for (const n of on) {
      // This circuit's share of the condenser, capacity × (its rejection / all rejection),
      // in refrigeration: divided by the heat rejected per W refrigerated (1 + W/Q).
      n.circuit.condenserLimitW = need > 0 ? (capacity * n.circuit.availableW * n.perW) / need / n.perW : capacity / n.perW;
      if (n.circuit.condenserLimitW < n.circuit.availableW) {
        n.circuit.availableW = n.circuit.condenserLimitW;
        n.circuit.limitedBy = "condenser";
      }
    }
  }

  // Cascades: a high stage carries its low stages' rejected heat before its own rooms. When
  // it cannot carry all of it and its own evaporators, both are cut back in proportion.
  const byId = new Map(out.map((c) => [c.circuitId, c]));
  for (const hi of out) {
    const lows = model.plant.circuits.filter((o) => o.heatRejection.to === "circuit" && o.heatRejection.circuitId === hi.circuitId);
    if (lows.length === 0) continue;
    const lowRates = lows.map((l) => ({ r: byId.get(l.id), perW: perWOf.get(l.id) ?? 1 })).filter((x) => x.r !== undefined) as { r: CircuitRerate; perW: number }[];
    const lowHeat = lowRates.reduce((a, x) => a + x.r.availableW * x.perW, 0);
    const demand = lowHeat + hi.evaporatorCapacityW;
    // hi.availableW here is its compressors, already capped by its condenser.
    const factor = demand > 0 ? Math.min(1, hi.availableW / demand) : 1;
    for (const x of lowRates)
      if (factor < 1) {
        x.r.availableW *= factor;
        x.r.limitedBy = "high-stage";
      }
    hi.cascadeLoadW = lowHeat * factor;
    hi.availableW = Math.min(hi.availableW, hi.evaporatorCapacityW * factor + hi.cascadeLoadW);
  }

  const rooms = new Map<string, RoomRerate>();
  for (const c of out) {
    const byRoom = evapCap.get(c.circuitId)!;
    const share = c.evaporatorCapacityW > 0 ? Math.min(1, (c.availableW - c.cascadeLoadW) / c.evaporatorCapacityW) : 0;
    for (const [roomId, q] of byRoom) {
      const r = rooms.get(roomId) ?? { roomId, setPointC: setPoint(roomId), evaporatorCapacityW: 0, availableW: 0 };
      r.evaporatorCapacityW += q;
      r.availableW += q * share;
      rooms.set(roomId, r);
    }
  }
  return { ambient, circuits: out, evaporators: evapTraces, rooms: [...rooms.values()], warnings };
}
