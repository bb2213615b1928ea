import type { AirState } from "./psychro";

/** Standard gravity, m/s². */
const G_MS2 = 9.80665;

/**
 * Default effectiveness E of doorway protection when new and well kept (DOMAIN.md §1 ranges,
 * from memory of the handbook; effectiveness degrades with age and traffic — override per door).
 */
export const PROTECTION_EFFECTIVENESS = {
  none: 0,
  stripCurtain: 0.85,
  airCurtain: 0.7,
  vestibule: 0.9,
  fastDoor: 0.9,
} as const;

/**
 * Default share of the doorway exchange a dock seal or shelter stops while a trailer is docked
 * (common practice; override with `dock.sealEffectiveness`).
 */
export const DOCK_SEAL_EFFECTIVENESS = { none: 0, seal: 0.95, shelter: 0.8 } as const;

/**
 * Doorway flow factor Df: 0.8 for a temperature difference above about 11 K, 1.1 below
 * (ASHRAE Handbook—Refrigeration, after Hendrix et al.; from memory). The rule is a step, so
 * the default jumps at 11 K; give `flowFactor` to hold it fixed.
 */
export function defaultFlowFactor(deltaTK: number): number {
  return Math.abs(deltaTK) > 11 ? 0.8 : 1.1;
}

export interface FullyOpenDoorResult {
  /** Sensible + latent heat gain of the fully open door, q_t, W. */
  qtW: number;
  /** Density factor F_m. */
  densityFactor: number;
  /** Dry-air mass flow that carries q_t, kg/s (q_t / Δh). */
  dryAirKgS: number;
}

/**
 * Gosney & Olama (1975) infiltration through a fully open doorway, as given in the ASHRAE
 * Handbook—Refrigeration:
 * `q_t = 0.221·A·(h_i − h_r)·ρ_r·(1 − ρ_i/ρ_r)^0.5·(g·H)^0.5·F_m` kW (A m², h kJ/kg, ρ kg/m³,
 * H m), with `F_m = (2 / (1 + (ρ_r/ρ_i)^(1/3)))^1.5`. i is the warm (infiltrating) side, r the
 * refrigerated room. Returns zero when the warm air is not lighter or carries no more enthalpy.
 */
export function gosneyOlamaFullyOpen(widthM: number, heightM: number, warm: AirState, cold: AirState): FullyOpenDoorResult {
  const dhKJkg = (warm.enthalpyJkg - cold.enthalpyJkg) / 1000;
  const rhoI = warm.densityKgM3;
  const rhoR = cold.densityKgM3;
  if (!(dhKJkg > 0) || !(rhoR > rhoI)) return { qtW: 0, densityFactor: 0, dryAirKgS: 0 };
  const densityFactor = Math.pow(2 / (1 + Math.cbrt(rhoR / rhoI)), 1.5);
  const qtKW =
    0.221 * widthM * heightM * dhKJkg * rhoR * Math.sqrt(1 - rhoI / rhoR) * Math.sqrt(G_MS2 * heightM) * densityFactor;
  return { qtW: qtKW * 1000, densityFactor, dryAirKgS: qtKW / dhKJkg };
}

/**
 * Doorway open-time factor, `D_t = (P·θ_p + 60·θ_o) / (3600·θ_d)` (Gosney–Olama method as
 * given in the ASHRAE Handbook—Refrigeration): P passages in the period, θ_p open-close
 * seconds per passage, θ_o minutes held open, θ_d the period in hours.
 */
export function doorwayOpenTimeFactor(passages: number, openCloseSeconds: number, minutesOpen: number, periodHours: number): number {
  return (passages * openCloseSeconds + 60 * minutesOpen) / (3600 * periodHours);
}

/**
 * Sensible / latent split of an air exchange: sensible `ṁ·(1.006 + 1.86·W_i)·(t_i − t_r)`,
 * latent `ṁ·(W_i − W_r)·(2501 + 1.86·t_r)` kJ/s — the two parts of the ASHRAE moist-air
 * enthalpy `h = 1.006·t + W·(2501 + 1.86·t)`, so they add up to `ṁ·(h_i − h_r)`.
 */
export function splitAirExchange(dryAirKgS: number, warm: AirState, cold: AirState): { sensibleW: number; latentW: number } {
  const sensibleW = 1000 * dryAirKgS * (1.006 + 1.86 * warm.humRatio) * (warm.tempC - cold.tempC);
  const latentW = 1000 * dryAirKgS * (warm.humRatio - cold.humRatio) * (2501 + 1.86 * cold.tempC);
  return { sensibleW, latentW };
}
