/**
 * The equipment schedule: one row per item (evaporators, compressor sets, condensers,
 * intercoolers, cascade exchangers, separators / low-pressure receivers) with its stable tag,
 * the data behind the schedule screen and the Excel export. Tags come from the stored
 * items (or from the stored circuit tag), so adding or removing items never renumbers others.
 */
import type { CircuitResult } from "./circuit";
import type { PlantResult } from "./plant";

export type ScheduleItemKind = "evaporator" | "compressor-set" | "condenser" | "intercooler" | "cascade-hx" | "separator";

export interface ScheduleItem {
  tag: string;
  kind: ScheduleItemKind;
  description: string;
  /** Id of the model item the row comes from (evaporator, circuit or condenser id). */
  sourceId: string;
  quantity: number;
  standbyQuantity: number;
  /** Design duty of the whole row, W (refrigeration, or heat rejected for condensers). */
  dutyW: number;
  dutyPerUnitW: number;
  refrigerant?: string;
  /** Temperatures of the row's design point, °C. */
  temperatures: Partial<Record<"room" | "evaporating" | "suction" | "intermediate" | "condensing" | "sink" | "discharge", number>>;
  /** The conditions the duty is stated at, in words (for the purchaser's enquiry). */
  ratingConditions: string;
  feed?: string;
  defrost?: { type: string; heaterW: number };
  airflowM3s?: number;
  /** Electrical input of the row (fans, motors, heaters as applicable), W. */
  electricalW: number;
  /** Electrical supply (the site's, from plant options) for rows that draw power. */
  supply?: string;
  designPressurePa?: { lowSide?: number; highSide?: number };
  roomId?: string;
  circuitId?: string;
}

const c1 = (x: number) => x.toFixed(1);

function circuitRows(c: CircuitResult, p: PlantResult): ScheduleItem[] {
  const rows: ScheduleItem[] = [];
  const dp = { lowSide: c.designPressures.lowSide.pPa, highSide: c.designPressures.highSide.pPa };
  const running = c.compressor.units - c.compressor.standbyUnits;
  const stages = c.stages.map((s) => s.name).join(" + ");
  const hotGasW = c.hotGasDefrost?.heatW ?? 0;
  rows.push({
    tag: c.scheduleTags.compressor,
    kind: "compressor-set",
    description: `${c.compressor.type} compressor set, ${c.arrangement}${c.stages.length > 1 ? ` (${stages} stage)` : ""}`,
    sourceId: c.id,
    quantity: c.compressor.units,
    standbyQuantity: c.compressor.standbyUnits,
    // The set also supplies its evaporators' hot-gas defrosts (24-h mean), stated with the duty.
    dutyW: c.refrigerationW + hotGasW,
    dutyPerUnitW: (c.refrigerationW + hotGasW) / running,
    refrigerant: c.refrigerant,
    temperatures: { suction: c.suctionC, condensing: c.condensingC, intermediate: c.intermediateC, discharge: c.dischargeTempC },
    ratingConditions: `suction ${c1(c.suctionC)} °C (${c.tempConvention}), ${c.cycle === "transcritical" ? "gas-cooler outlet" : "condensing"} ${c1(c.condensingC)} °C, superheat ${c1(c.superheatK)} K, subcooling ${c1(c.subcoolingK)} K; swept volume ${(c.sweptVolumeM3s * 3600).toFixed(0)} m³/h in total; shaft ${(c.shaftPowerW / 1000).toFixed(1)} kW${hotGasW > 0 ? `; includes ${(hotGasW / 1000).toFixed(1)} kW hot-gas defrost (24-h mean) for ${c.hotGasDefrost.byEvaporator.map((e) => e.tag).join(", ")}` : ""}`,
    electricalW: c.compressorElectricalW,
    designPressurePa: dp,
    circuitId: c.id,
  });
  if (c.arrangement === "two-stage" && c.intermediateC !== undefined) {
    const low = c.stages[0];
    const h = (id: string) => c.statePoints.find((x) => x.id === id)?.hJkg ?? 0;
    const icDuty = low.massFlowKgS * (h("2") - h("3") + h("5") - h("7"));
    rows.push({
      tag: c.scheduleTags.intercooler,
      kind: "intercooler",
      description: "open flash intercooler",
      sourceId: c.id,
      quantity: 1,
      standbyQuantity: 0,
      // Heat its flashing takes up: desuperheating the low-stage discharge, ṁ_L·(h2 − h3),
      // and cooling the low stage's liquid from the condenser outlet, ṁ_L·(h5 − h7).
      dutyW: icDuty,
      dutyPerUnitW: icDuty,
      refrigerant: c.refrigerant,
      temperatures: { intermediate: c.intermediateC },
      ratingConditions: `intermediate ${c1(c.intermediateC)} °C, ${(low.dischargePa / 1e5).toFixed(2)} bar(a)`,
      electricalW: 0,
      designPressurePa: { lowSide: dp.lowSide },
      circuitId: c.id,
    });
  }
  if (c.rejectsTo.kind === "circuit") {
    rows.push({
      tag: c.scheduleTags.cascadeHx,
      kind: "cascade-hx",
      description: `cascade heat exchanger into ${p.circuits.find((x) => x.id === c.rejectsTo.id)?.tag ?? c.rejectsTo.id}`,
      sourceId: c.id,
      quantity: 1,
      standbyQuantity: 0,
      dutyW: c.heatRejectedW,
      dutyPerUnitW: c.heatRejectedW,
      refrigerant: c.refrigerant,
      temperatures: { condensing: c.condensingC, sink: c.sinkC },
      ratingConditions: `${c.refrigerant} condensing ${c1(c.condensingC)} °C against the high stage evaporating at ${c1(c.sinkC)} °C`,
      electricalW: 0,
      designPressurePa: dp,
      circuitId: c.id,
    });
  }
  if (c.pumpedEvaporatorIds.length > 0) {
    const duty = p.evaporators.filter((e) => c.pumpedEvaporatorIds.includes(e.id)).reduce((a, e) => a + e.dutyW, 0);
    rows.push({
      tag: c.scheduleTags.separator,
      kind: "separator",
      description: "liquid separator / low-pressure receiver with refrigerant pumps",
      sourceId: c.id,
      quantity: 1,
      standbyQuantity: 0,
      dutyW: duty,
      dutyPerUnitW: duty,
      refrigerant: c.refrigerant,
      temperatures: { suction: c.suctionC },
      ratingConditions: `pumped recirculation at ${c1(c.suctionC)} °C; pump input ${(c.pumpPowerW / 1000).toFixed(2)} kW`,
      electricalW: c.pumpPowerW,
      designPressurePa: { lowSide: dp.lowSide },
      circuitId: c.id,
    });
  }
  return rows;
}

/**
 * The schedule rows of a computed plant, in a stable order: evaporators, then per circuit
 * its compressor set, intercooler, cascade exchanger and separator, then condensers.
 */
export function buildSchedule(plant: PlantResult): ScheduleItem[] {
  const circuits = new Map(plant.circuits.map((c) => [c.id, c]));
  const rows: ScheduleItem[] = plant.evaporators.map((e) => {
    const c = circuits.get(e.circuitId);
    return {
      tag: e.tag,
      kind: "evaporator",
      description: `unit cooler, ${e.feed.type === "dx" ? "direct expansion" : "pumped recirculation"}, ${e.defrost.type} defrost`,
      sourceId: e.id,
      quantity: e.units,
      standbyQuantity: 0,
      dutyW: e.dutyW,
      dutyPerUnitW: e.dutyPerUnitW,
      refrigerant: c?.refrigerant,
      temperatures: { room: e.evaporatingC + e.tdK, evaporating: e.evaporatingC },
      ratingConditions: `air on ${c1(e.evaporatingC + e.tdK)} °C, TD ${c1(e.tdK)} K, ${e.feed.type === "dx" ? `DX, superheat ${e.feed.superheatK} K` : `pumped, circulation ratio ${e.feed.circulationRatio}`}`,
      feed: e.feed.type,
      defrost: { type: e.defrost.type, heaterW: e.defrost.heaterW },
      airflowM3s: e.airflowM3s,
      electricalW: e.fanPowerW + e.defrost.electricW,
      designPressurePa: c ? { lowSide: c.designPressures.lowSide.pPa } : undefined,
      roomId: e.roomId,
      circuitId: e.circuitId,
    };
  });
  for (const c of plant.circuits) rows.push(...circuitRows(c, plant));
  for (const cd of plant.condensers) {
    const on = plant.circuits.filter((c) => cd.circuitIds.includes(c.id));
    rows.push({
      tag: cd.tag,
      kind: "condenser",
      description: `${cd.type} condenser`,
      sourceId: cd.id,
      quantity: cd.units,
      standbyQuantity: 0,
      dutyW: cd.heatRejectedW,
      dutyPerUnitW: cd.heatRejectedW / cd.units,
      refrigerant: [...new Set(on.map((c) => c.refrigerant))].join(", "),
      temperatures: { condensing: cd.condensingC, sink: cd.sinkC },
      ratingConditions: `condensing ${c1(cd.condensingC)} °C at ${cd.type === "evaporative" ? "wet bulb" : cd.type === "water-cooled" ? "entering water" : "dry bulb"} ${c1(cd.sinkC)} °C`,
      electricalW: cd.fanPowerW,
      designPressurePa: { highSide: Math.max(...on.map((c) => c.designPressures.highSide.pPa)) },
    });
  }
  if (plant.electricalSupply) for (const r of rows) if (r.electricalW > 0) r.supply = plant.electricalSupply;
  return rows;
}

/**
 * The next free tag with a prefix ("EV" → "EV-7" when EV-1…EV-6 exist): one above the highest
 * number in use, so a removed item's number is never handed to a new one.
 */
export function nextTag(prefix: string, existing: Iterable<string>): string {
  const re = new RegExp(`^${prefix.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}-(\\d+)$`);
  let max = 0;
  for (const t of existing) {
    const m = re.exec(t);
    if (m) max = Math.max(max, Number(m[1]));
  }
  return `${prefix}-${max + 1}`;
}
