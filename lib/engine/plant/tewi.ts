/**
 * TEWI (total equivalent warming impact) and the charge-per-room-volume code aid.
 *
 * TEWI, EN 378-1:2016 Annex B (the same formula as the AIRAH/BRA TEWI guideline):
 *
 *   TEWI = GWP·L·n + GWP·m·(1 − α_recovery) + n·E_annual·β
 *          └── leakage ──┘ └─ recovery losses ─┘ └─ energy ─┘
 *
 * GWP the refrigerant's 100-year GWP, L the leakage rate in kg/year (here charge × annual
 * leak fraction), n the operating years, m the charge in kg, α_recovery the fraction of the
 * charge recovered at end of life, E_annual the energy in kWh/year and β the grid's CO2
 * emission per kWh. The first two terms are the direct part, the last the indirect part; all
 * in kg CO2-equivalent.
 *
 * The code aid sets the charge of a circuit beside the volume of the smallest occupied room
 * it serves and a practical limit (kg/m³). It is an aid, not a code check: the locally adopted
 * codes govern and a licensed professional decides.
 */
import type { FluidId } from "../thermo/types";

export interface TewiInput {
  /** 100-year GWP of the refrigerant, kg CO2e per kg. */
  gwp: number;
  chargeKg: number;
  /** Annual leakage as a fraction of the charge per year (0.05 = 5 %/year). */
  leakFractionPerYear: number;
  years: number;
  /** Fraction of the charge recovered at end of life, 0…1. */
  recoveryFraction: number;
  annualKWh: number;
  /** Grid emission factor, kg CO2 per kWh. */
  gridKgCo2PerKWh: number;
}

export interface TewiResult {
  /** GWP·L·n, kg CO2e. */
  leakageKg: number;
  /** GWP·m·(1 − α), kg CO2e. */
  endOfLifeKg: number;
  /** leakage + end of life, kg CO2e. */
  directKg: number;
  /** n·E·β, kg CO2e. */
  indirectKg: number;
  totalKg: number;
  formula: string;
}

export const TEWI_FORMULA = "TEWI = GWP·L·n + GWP·m·(1 − α_recovery) + n·E_annual·β (EN 378-1:2016 Annex B)";

/** TEWI by EN 378-1 Annex B, split into direct (leakage + end-of-life) and indirect (energy) parts. */
export function tewi(i: TewiInput): TewiResult {
  const leakKgPerYear = i.chargeKg * i.leakFractionPerYear;
  const leakageKg = i.gwp * leakKgPerYear * i.years;
  const endOfLifeKg = i.gwp * i.chargeKg * (1 - i.recoveryFraction);
  const indirectKg = i.years * i.annualKWh * i.gridKgCo2PerKWh;
  const directKg = leakageKg + endOfLifeKg;
  return { leakageKg, endOfLifeKg, directKg, indirectKg, totalKg: directKg + indirectKg, formula: TEWI_FORMULA };
}

export interface PracticalLimit {
  kgPerM3: number;
  source: string;
}

const PL_SOURCE = "EN 378-1:2016 Annex C, practical limit (from memory: check the edition your code adopts)";

/**
 * Practical limits in kg/m³ for the refrigerants the engine knows. Every value is from memory
 * of EN 378-1:2016 Annex C (Table C.2) and is marked so; the user confirms or enters their own.
 */
export const PRACTICAL_LIMITS: Record<FluidId, PracticalLimit> = {
  R717: { kgPerM3: 0.00035, source: PL_SOURCE },
  R744: { kgPerM3: 0.1, source: PL_SOURCE },
  R134a: { kgPerM3: 0.25, source: PL_SOURCE },
  R404A: { kgPerM3: 0.52, source: PL_SOURCE },
  R507A: { kgPerM3: 0.53, source: PL_SOURCE },
  R448A: { kgPerM3: 0.39, source: PL_SOURCE },
  R449A: { kgPerM3: 0.36, source: PL_SOURCE },
  R290: { kgPerM3: 0.008, source: PL_SOURCE },
  R1234zeE: { kgPerM3: 0.061, source: PL_SOURCE },
  R513A: { kgPerM3: 0.35, source: PL_SOURCE },
  // A2L blends: 0.2 × the lower flammability limit (EN 378-1 Annex C rule for flammable
  // refrigerants); LFL values from memory of ISO 817 / ASHRAE 34 (R454C 0.291, R455A 0.431 kg/m³).
  R454C: { kgPerM3: 0.058, source: `${PL_SOURCE}; 0.2 × LFL 0.291 kg/m³ (LFL from memory of ISO 817)` },
  R455A: { kgPerM3: 0.086, source: `${PL_SOURCE}; 0.2 × LFL 0.431 kg/m³ (LFL from memory of ISO 817)` },
};

export interface RoomForAid {
  id: string;
  name: string;
  volumeM3: number;
  occupied: boolean;
}

export interface CodeAid {
  circuitId: string;
  refrigerant: FluidId;
  chargeKg: number;
  /** The smallest occupied room the circuit serves (or, when none is occupied, the smallest served; see `occupied`). */
  room?: { id: string; name: string; volumeM3: number; occupied: boolean };
  /** chargeKg / room volume, kg/m³. */
  chargePerVolumeKgM3?: number;
  limit: PracticalLimit;
  /** chargePerVolume ÷ limit: above 1 means over the practical limit. */
  ratio?: number;
  verdict: "within" | "over" | "no-room";
  note: string;
}

/**
 * Charge per room volume of the smallest occupied room a circuit serves beside the practical
 * limit. A circuit that serves no room directly (a cascade's high stage) gets "no-room".
 */
export function codeAid(args: { circuitId: string; refrigerant: FluidId; chargeKg: number; servedRooms: readonly RoomForAid[]; limit?: PracticalLimit }): CodeAid {
  const limit = args.limit ?? PRACTICAL_LIMITS[args.refrigerant];
  const served = [...args.servedRooms].sort((a, b) => a.volumeM3 - b.volumeM3);
  const occupied = served.filter((r) => r.occupied);
  const room = occupied[0] ?? served[0];
  const base = { circuitId: args.circuitId, refrigerant: args.refrigerant, chargeKg: args.chargeKg, limit };
  if (!room) return { ...base, verdict: "no-room", note: "serves no room directly (its charge sits in the machinery room or in a cascade)" };
  const perV = args.chargeKg / room.volumeM3;
  const ratio = perV / limit.kgPerM3;
  return {
    ...base,
    room: { ...room },
    chargePerVolumeKgM3: perV,
    ratio,
    verdict: ratio > 1 ? "over" : "within",
    note: room.occupied ? "smallest occupied room served" : "no occupied room served: the smallest room served is used",
  };
}
