/**
 * Moisture loss (transpiration) of fresh produce in storage, ASHRAE Handbook—Refrigeration,
 * thermal properties of foods chapter, "Transpiration of fresh fruits and vegetables":
 * `ṁ = k_t·(p_s − p_a)` per kg of produce, k_t the transpiration coefficient, p_s the water
 * vapour pressure at the produce surface and p_a that of the room air.
 */
import psychrolib from "psychrolib";
import type { AirState } from "./psychro";

/**
 * Saturation water-vapour pressure at the produce surface, Pa (over liquid water: the sap does
 * not freeze above the produce's initial freezing point; Hyland–Wexler as in ASHRAE
 * Fundamentals). The vapour-pressure lowering of the sap (1–3 %) is neglected, which slightly
 * overstates the loss.
 */
export function surfaceVapourPressurePa(tempC: number): number {
  // psychrolib switches to ice below 0.01 °C; produce above its freezing point holds liquid sap.
  const t = tempC + 273.15;
  // Hyland–Wexler over liquid water (ASHRAE Handbook—Fundamentals, psychrometrics, eq. 6).
  const ln =
    -5.8002206e3 / t + 1.3914993 - 4.8640239e-2 * t + 4.1764768e-5 * t * t - 1.4452093e-8 * t * t * t + 6.5459673 * Math.log(t);
  return Math.exp(ln);
}

/** Water-vapour partial pressure of moist air, Pa: `p_w = p·W/(0.621945 + W)` (ASHRAE Fundamentals). */
export function airVapourPressurePa(air: AirState): number {
  return psychrolib.GetVapPresFromHumRatio(air.humRatio, air.pressurePa);
}

/**
 * Latent heat taken up by water evaporating at t and given back where it condenses, kJ/kg:
 * `h_g − h_f ≈ 2501 − 2.361·t` (ASHRAE Handbook—Fundamentals steam-table fit, 0–60 °C).
 */
export function evaporationHeatKJkg(tempC: number): number {
  return 2501 - 2.361 * tempC;
}

/** Moisture lost by `massKg` of produce at `productTempC` in room air `air`, kg/s (0 when the air is wetter than the surface). */
export function transpirationKgS(ktNgKgSPa: number, massKg: number, productTempC: number, air: AirState): number {
  const deficitPa = surfaceVapourPressurePa(productTempC) - airVapourPressurePa(air);
  return Math.max(0, ktNgKgSPa * 1e-12 * massKg * deficitPa);
}
