/**
 * A provisional installed plant from the design: each evaporator, compressor set and condenser
 * rated at its design duty × (1 + selection margin), at the design conditions. For a designer
 * who has not yet entered the real catalogue ratings; the page says so, and the ratings stay
 * editable. Pure.
 */
import type { FacilityResult } from "@/lib/engine/model";
import { DEFAULT_FROST_CAPACITY_LOSS } from "@/lib/engine/plant/rerate";
import type { InstalledPlant } from "@/lib/engine/plant/schema";

export type InstalledPlantRaw = {
  evaporators: InstalledPlant["evaporators"];
  compressors: InstalledPlant["compressors"];
  condensers: InstalledPlant["condensers"];
};

/** Selection margin proposed by default: catalogue sizes land above the design duty (common practice). */
export const DEFAULT_SELECTION_MARGIN = 0.15;

export function installedFromDesign(result: FacilityResult, margin = DEFAULT_SELECTION_MARGIN, rooms: ReadonlyArray<{ id: string; rhPct: number }> = []): InstalledPlantRaw {
  const k = 1 + margin;
  const p = result.plant;
  const rh = new Map(rooms.map((r) => [r.id, r.rhPct]));
  return {
    evaporators: p.evaporators.map((e) => {
      // Rated clean at the room's own air-on state: a coil below 0 °C is chosen so that it still
      // gives the duty × (1 + margin) with the re-rating's mean frost loss.
      const frost = e.evaporatingC < 0 ? DEFAULT_FROST_CAPACITY_LOSS : 0;
      const roomRh = rh.get(e.roomId);
      return {
        id: `inst-${e.id}`,
        tag: e.tag,
        roomId: e.roomId,
        circuitId: e.circuitId,
        units: e.units,
        standbyUnits: 0,
        ratedCapacityWPerUnit: (e.dutyPerUnitW * k) / (1 - frost),
        rating: { airOnC: e.evaporatingC + e.tdK, tdK: e.tdK, feed: e.feed.type, ...(roomRh !== undefined ? { rhPct: roomRh } : {}) },
      };
    }),
    compressors: p.circuits.flatMap((c) => {
      const running = c.compressor.units - c.compressor.standbyUnits;
      // rerateInstalled scales by each stage's swept volume per W: the same basis here. A
      // two-stage circuit gets a low-stage (booster) set and a high-stage set.
      const set = (stage: "low" | "high" | undefined, swept: number, tag: string) => ({
        id: `inst-cp-${c.id}${stage === "high" ? "-hs" : ""}`,
        tag,
        circuitId: c.id,
        ...(stage ? { stage } : {}),
        type: c.compressor.type,
        units: c.compressor.units,
        standbyUnits: c.compressor.standbyUnits,
        motorEfficiency: c.compressor.motorEfficiency,
        rating: { by: "swept-volume" as const, sweptVolumeM3sPerUnit: (swept / running) * k },
      });
      if (c.arrangement === "two-stage" && c.stages.length === 2)
        return [set("low", c.stages[0].sweptVolumeM3s, c.scheduleTags.compressor), set("high", c.stages[1].sweptVolumeM3s, `${c.scheduleTags.compressor}-HS`)];
      return [set(undefined, c.stages[0].sweptVolumeM3s, c.scheduleTags.compressor)];
    }),
    condensers: p.condensers.map((cd) => ({
      id: `inst-${cd.id}`,
      tag: cd.tag,
      condenserId: cd.id,
      units: cd.units,
      standbyUnits: 0,
      ratedHeatRejectionWPerUnit: (cd.heatRejectedW / cd.units) * k,
      ratingApproachK: cd.condensingC - cd.sinkC,
    })),
  };
}
