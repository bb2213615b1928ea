/**
 * Refrigerant safety groups (ISO 817 / ASHRAE 34 classifications — facts of the trade) and
 * the cautions a design shows with the refrigerant choice (DOMAIN.md §4). Every caution
 * defers to the locally adopted codes and to licensed practice; none of them is a design
 * rule in itself.
 */
import type { FluidId, SafetyGroup } from "../thermo/types";

export const SAFETY_GROUP: Record<FluidId, SafetyGroup> = {
  R717: "B2L",
  R744: "A1",
  R134a: "A1",
  R404A: "A1",
  R507A: "A1",
  R448A: "A1",
  R449A: "A1",
  R290: "A3",
  R1234zeE: "A2L",
  R513A: "A1",
  R454C: "A2L",
  R455A: "A2L",
};

export const CODES_NOTICE =
  "The design must follow the locally adopted codes and standards (EN 378 / ISO 5149 / ASHRAE 15 / IIAR as applicable) and be checked by a licensed professional.";

export interface SafetyCaution {
  refrigerant: FluidId;
  safetyGroup: SafetyGroup;
  cautions: string[];
  codesNotice: string;
}

/** Cautions for one refrigerant, by its safety group and its pressures (DOMAIN.md §4). */
export function safetyCaution(id: FluidId): SafetyCaution {
  const group = SAFETY_GROUP[id];
  const cautions: string[] = [];
  if (id === "R717")
    cautions.push(
      "Ammonia (B2L) is toxic and mildly flammable: machinery-room, gas-detection, ventilation and emergency-shutdown requirements apply; limit the charge in occupied spaces.",
    );
  if (id === "R744")
    cautions.push(
      "CO2 runs at high pressure: gas-cooler pressures well above 70 bar, and a standstill pressure that rises above the critical pressure at warm ambient; relief protection and a standstill strategy are required.",
    );
  if (group === "A2L")
    cautions.push("A2L (mildly flammable): charge limits per occupied space and ignition-source rules apply.");
  if (group === "A3")
    cautions.push("A3 (highly flammable): strict charge limits, ventilation and ignition-source control apply; large charges belong outdoors or in a special machinery room.");
  if (group === "A1" && id !== "R744")
    cautions.push("A1: non-flammable and low toxicity, but a leak displaces oxygen; charge-per-room limits and leak detection apply.");
  return { refrigerant: id, safetyGroup: group, cautions, codesNotice: CODES_NOTICE };
}
