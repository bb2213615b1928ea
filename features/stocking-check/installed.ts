/**
 * A provisional installed plant from the design: each evaporator, compressor set and condenser
 * rated at its design duty × (1 + selection margin), at the design conditions. For a designer
 * who has not yet entered the real catalogue ratings; the page says so, and the ratings stay
 * editable. Pure.
 */
import type { FacilityResult } from "@/lib/engine/model";
import type { InstalledPlant } from "@/lib/engine/plant/schema";

export type InstalledPlantRaw = {
  evaporators: InstalledPlant["evaporators"];
  compressors: InstalledPlant["compressors"];
  condensers: InstalledPlant["condensers"];
};

/** Selection margin proposed by default: catalogue sizes land above the design duty (common practice). */
export const DEFAULT_SELECTION_MARGIN = 0.15;

export function installedFromDesign(result: FacilityResult, margin = DEFAULT_SELECTION_MARGIN): InstalledPlantRaw {
  const k = 1 + margin;
  const p = result.plant;
  return {
    evaporators: p.evaporators.map((e) => ({
      id: `inst-${e.id}`,
      tag: e.tag,
      roomId: e.roomId,
      circuitId: e.circuitId,
      units: e.units,
      standbyUnits: 0,
      ratedCapacityWPerUnit: e.dutyPerUnitW * k,
      rating: { airOnC: e.evaporatingC + e.tdK, tdK: e.tdK, feed: e.feed.type },
    })),
    compressors: p.circuits.map((c) => {
      const running = c.compressor.units - c.compressor.standbyUnits;
      // rerateInstalled scales by the first stage's swept volume per W: the same basis here.
      return {
        id: `inst-cp-${c.id}`,
        tag: c.scheduleTags.compressor,
        circuitId: c.id,
        type: c.compressor.type,
        units: c.compressor.units,
        standbyUnits: c.compressor.standbyUnits,
        motorEfficiency: c.compressor.motorEfficiency,
        rating: { by: "swept-volume" as const, sweptVolumeM3sPerUnit: (c.stages[0].sweptVolumeM3s / running) * k },
      };
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
