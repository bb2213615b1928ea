/** Shape factors of Plank's equation (P, R) and Pham's shape factor E. */
export const SHAPE_FACTORS = {
  slab: { P: 1 / 2, R: 1 / 8, E: 1 },
  cylinder: { P: 1 / 4, R: 1 / 16, E: 2 },
  sphere: { P: 1 / 6, R: 1 / 24, E: 3 },
} as const;

export type FreezingShape = keyof typeof SHAPE_FACTORS;

/**
 * Surface heat-transfer coefficient for air over a product, W/(m²·K): `h = 5.6 + 4.0·v` for
 * v ≤ 5 m/s, `h = 7.2·v^0.78` above (Jürges' flat-plate correlation as quoted by McAdams,
 * from memory). Packaging in the way lowers it; give an override where known.
 */
export function airSurfaceCoefficientWm2K(velocityMS: number): number {
  return velocityMS <= 5 ? 5.6 + 4.0 * velocityMS : 7.2 * Math.pow(velocityMS, 0.78);
}

/** Effective surface coefficient through packaging, `h_eff = 1 / (1/h + R_pack)` (series resistances). */
export function effectiveSurfaceCoefficientWm2K(hWm2K: number, packagingResistanceM2KW: number): number {
  return 1 / (1 / hWm2K + packagingResistanceM2KW);
}

/**
 * Plank's freezing time, `t = (ρ·L/ΔT)·(P·a/h + R·a²/k)` s, ΔT = t_f − t_air, a the slab
 * thickness or the cylinder / sphere diameter (Plank 1913, as given in the ASHRAE Handbook—
 * Refrigeration). Phase change only: pre-cooling and sub-cooling are not included, so it
 * underestimates the whole batch time.
 */
export function plankFreezingTimeS(p: {
  densityKgM3: number;
  latentHeatJkg: number;
  freezingPointC: number;
  airTempC: number;
  thicknessM: number;
  hWm2K: number;
  frozenConductivityWmK: number;
  shape: FreezingShape;
}): number {
  const { P, R } = SHAPE_FACTORS[p.shape];
  const dT = p.freezingPointC - p.airTempC;
  return ((p.densityKgM3 * p.latentHeatJkg) / dT) * ((P * p.thicknessM) / p.hWm2K + (R * p.thicknessM ** 2) / p.frozenConductivityWmK);
}

/**
 * Pham's (1986) simplified freezing time including pre-cooling and sub-cooling, as presented
 * in the ASHRAE Handbook—Refrigeration (cooling and freezing times of foods) and by Singh &
 * Heldman, *Introduction to Food Engineering*:
 * `T_fm = 1.8 + 0.263·T_c + 0.105·T_a`, `ΔH1 = ρ·c_u·(T_i − T_fm)`, `ΔH2 = ρ·[L + c_f·(T_fm − T_c)]`,
 * `ΔT1 = (T_i + T_fm)/2 − T_a`, `ΔT2 = T_fm − T_a`,
 * `t = (d/(E·h))·(ΔH1/ΔT1 + ΔH2/ΔT2)·(1 + Bi/2)`, Bi = h·d/k_f, d the half-thickness or radius.
 */
export function phamFreezingTimeS(p: {
  densityKgM3: number;
  latentHeatJkg: number;
  cpUnfrozenJkgK: number;
  cpFrozenJkgK: number;
  initialTempC: number;
  finalCentreTempC: number;
  airTempC: number;
  thicknessM: number;
  hWm2K: number;
  frozenConductivityWmK: number;
  shape: FreezingShape;
}): { timeS: number; meanFreezingTempC: number } {
  const { E } = SHAPE_FACTORS[p.shape];
  const d = p.thicknessM / 2;
  const tfm = 1.8 + 0.263 * p.finalCentreTempC + 0.105 * p.airTempC;
  const dh1 = p.densityKgM3 * p.cpUnfrozenJkgK * (p.initialTempC - tfm);
  const dh2 = p.densityKgM3 * (p.latentHeatJkg + p.cpFrozenJkgK * (tfm - p.finalCentreTempC));
  const dt1 = (p.initialTempC + tfm) / 2 - p.airTempC;
  const dt2 = tfm - p.airTempC;
  const bi = (p.hWm2K * d) / p.frozenConductivityWmK;
  const timeS = (d / (E * p.hWm2K)) * (dh1 / dt1 + dh2 / dt2) * (1 + bi / 2);
  return { timeS, meanFreezingTempC: tfm };
}
