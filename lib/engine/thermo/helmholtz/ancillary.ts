/**
 * Ancillary saturation equations (the usual published forms, θ = 1 − T/T_r):
 * - "rhoL": ρ' = ρ_r·(1 + Σ nᵢ·θ^tᵢ)
 * - "rhoV": ρ'' = ρ_r·exp(f·Σ nᵢ·θ^tᵢ)
 * - "p":    p = p_r·exp(f·Σ nᵢ·θ^tᵢ)
 * with f = T_r/T when `tauFactor` is set, else 1. They only seed the Maxwell solve; the
 * saturation states the module returns always come from the equation of state itself.
 */
export interface Ancillary {
  kind: "rhoL" | "rhoV" | "p";
  /** Reducing value: kg/m³ for densities, Pa for pressure. */
  reducing: number;
  tReducingK: number;
  n: readonly number[];
  t: readonly number[];
  tauFactor: boolean;
}

/** Evaluates an ancillary equation at temperature tK (K). */
export function evalAncillary(a: Ancillary, tK: number): number {
  const theta = 1 - tK / a.tReducingK;
  let sum = 0;
  for (let i = 0; i < a.n.length; i++) sum += a.n[i] * Math.pow(theta, a.t[i]);
  if (a.kind === "rhoL") return a.reducing * (1 + sum);
  const f = a.tauFactor ? a.tReducingK / tK : 1;
  return a.reducing * Math.exp(f * sum);
}
