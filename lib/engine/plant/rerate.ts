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
import { condenserSink, K0, type Ambient, type PlantWarning } from "./circuit";
import { singleStageCycle, transcriticalCycle, twoStageCycle, type CycleSpec } from "./cycle";
import { PlantError } from "./errors";
import { defaultTdK } from "./evaporator";
import type { CircuitInput } from "./schema";

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
  rooms: RoomRerate[];
  warnings: PlantWarning[];
}

interface PerWatt {
  /** Swept volume per W of refrigeration (first stage), m³/s per W. */
  sweptM3sPerW: number;
  shaftWPerW: number;
}

function perWatt(fluid: Fluid, c: CircuitInput, type: CircuitInput["compressor"]["type"], suctionC: number, condensingC: number, superheatK: number, subcoolingK: number): PerWatt {
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
  };
  const r = c.arrangement === "two-stage" ? twoStageCycle(spec) : c.arrangement === "transcritical" ? transcriticalCycle(spec) : singleStageCycle(spec);
  return { sweptM3sPerW: r.stages[0].sweptVolumeM3s, shaftWPerW: r.shaftPowerW };
}

/**
 * Re-rates the installed plant recorded in `model.plant.installed` at the given conditions
 * (defaults: the design conditions of the model). For two-stage circuits the installed
 * compressors are taken as the low-stage (booster) machines; the high stage is assumed to
 * follow. Fluids must be loaded first.
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

    let compressorCapacityW = 0;
    let compressorShaftPowerW = 0;
    for (const { x, i } of comps) {
      const running = x.units - x.standbyUnits;
      const nowT = x.type === c.compressor.type ? now : perWatt(fluid, c, x.type, suctionC, condensingC, superheatK, c.subcoolingK);
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
        const atRating = perWatt(fluid, c, x.type, r.evaporatingC, r.condensingC, r.superheatK, r.subcoolingK);
        sweptPerUnit = r.capacityWPerUnit * atRating.sweptM3sPerW;
        powerFactor = r.shaftPowerWPerUnit / (r.capacityWPerUnit * atRating.shaftWPerW);
      }
      const q = (running * sweptPerUnit) / nowT.sweptM3sPerW;
      compressorCapacityW += q;
      compressorShaftPowerW += q * nowT.shaftWPerW * powerFactor;
    }
    if (comps.length === 0)
      warnings.push({ code: "INSTALLED_SHORTFALL", severity: "warning", message: `${c.tag}: no installed compressors recorded`, ref: { kind: "circuit", id: c.id, tag: c.tag } });

    const byRoom = new Map<string, number>();
    let evaporatorCapacityW = 0;
    for (const e of evs) {
      const sp = setPoint(e.roomId);
      // A warmer room's coil is held at its design TD by its regulator; colder ones see the suction.
      const evapC = Math.max(suctionC + c.suctionLineAllowanceK, sp - designTd(e.roomId, c.id));
      const td = Math.max(0, sp - evapC);
      const q = (e.units - e.standbyUnits) * e.ratedCapacityWPerUnit * (td / e.rating.tdK);
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
  return { ambient, circuits: out, rooms: [...rooms.values()], warnings };
}
