import { LATENT_HEAT_WATER_KJKG, chenFrozenMatrixCpKJkgK, chenUnfrozenCpKJkgK } from "./commodities";

/** Reference temperature of Chen's enthalpy (H = 0 at −40 °C). */
export const CHEN_REFERENCE_TEMP_C = -40;

/** The composition a food-enthalpy calculation needs. */
export interface FoodComposition {
  waterFraction: number;
  proteinFraction: number;
  initialFreezingPointC: number;
}

/**
 * Ice mass fraction below the initial freezing point, `x_ice = (x_wo − x_b)·(1 − t_f/t)`
 * (freezing-point-depression form, as implied by Chen's enthalpy equation; bound water
 * x_b = 0.4·x_p after Schwartzberg 1976). Zero at or above t_f.
 */
export function iceFraction(food: FoodComposition, tempC: number): number {
  const tf = food.initialFreezingPointC;
  if (tempC >= tf) return 0;
  const xb = 0.4 * food.proteinFraction;
  return Math.max(0, food.waterFraction - xb) * (1 - tf / tempC);
}

/**
 * Specific enthalpy of a food relative to −40 °C, kJ/kg, by Chen (1985) as given in the
 * ASHRAE Handbook—Refrigeration (thermal properties of foods):
 * below t_f `H = (t − t_r)·[1.55 + 1.26·x_s − (x_wo − x_b)·L0·t_f/(t_r·t)]`, t_r = −40 °C,
 * L0 = 333.6 kJ/kg; above t_f `H = H_f + (t − t_f)·(4.19 − 2.30·x_s − 0.628·x_s³)`.
 * The unfrozen water below t_f is what makes a frozen product keep releasing latent heat.
 */
export function chenEnthalpyKJkg(food: FoodComposition, tempC: number): number {
  const tf = food.initialFreezingPointC;
  const xs = 1 - food.waterFraction;
  const xb = 0.4 * food.proteinFraction;
  const tr = CHEN_REFERENCE_TEMP_C;
  const frozen = (t: number) =>
    (t - tr) * (chenFrozenMatrixCpKJkgK(xs) - (Math.max(0, food.waterFraction - xb) * LATENT_HEAT_WATER_KJKG * tf) / (tr * t));
  if (tempC <= tf) return frozen(tempC);
  return frozen(tf) + (tempC - tf) * chenUnfrozenCpKJkgK(xs);
}

/** Heat removed per kg along a temperature path, split the way a ledger shows it, kJ/kg. */
export interface ProductHeatSplit {
  sensibleAboveKJkg: number;
  latentKJkg: number;
  sensibleBelowKJkg: number;
  totalKJkg: number;
}

/**
 * Heat removed from 1 kg cooled from `fromC` to `toC` (negative when warmed), split into
 * sensible heat above freezing, latent heat of the ice formed, and sensible heat of the frozen
 * matrix. The three parts add up to `H(from) − H(to)` of {@link chenEnthalpyKJkg}; only the
 * parts the temperature path crosses are non-zero.
 */
export function productHeatSplit(food: FoodComposition, fromC: number, toC: number): ProductHeatSplit {
  const tf = food.initialFreezingPointC;
  const xs = 1 - food.waterFraction;
  const sensibleAboveKJkg = chenUnfrozenCpKJkgK(xs) * (Math.max(fromC, tf) - Math.max(toC, tf));
  const sensibleBelowKJkg = chenFrozenMatrixCpKJkgK(xs) * (Math.min(fromC, tf) - Math.min(toC, tf));
  const latentKJkg = LATENT_HEAT_WATER_KJKG * (iceFraction(food, toC) - iceFraction(food, fromC));
  return { sensibleAboveKJkg, latentKJkg, sensibleBelowKJkg, totalKJkg: sensibleAboveKJkg + latentKJkg + sensibleBelowKJkg };
}

/**
 * Specific heat of packaging and pallet materials, kJ/(kg·K) (general engineering property
 * tables, from memory; override per stream).
 */
export const PACKAGING_CP_KJKGK = {
  cardboard: 1.34,
  plastic: 1.9,
  wood: 1.7,
  steel: 0.46,
  aluminium: 0.9,
  glass: 0.84,
} as const;

/** Sensible heat of packaging, `Q = m·c·(T_in − T_final)` kJ. */
export function packagingHeatKJ(massKg: number, cpKJkgK: number, fromC: number, toC: number): number {
  return massKg * cpKJkgK * (fromC - toC);
}
