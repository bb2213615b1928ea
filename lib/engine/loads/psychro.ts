import psychrolib from "psychrolib";
import { fail } from "./errors";

// The one place the unit system is set: psychrolib keeps it as module state.
psychrolib.SetUnitSystem(psychrolib.SI);

/** Moist-air state at one dry-bulb temperature and humidity, per kg of dry air. */
export interface AirState {
  tempC: number;
  /** kg water / kg dry air */
  humRatio: number;
  /** J per kg dry air, ASHRAE reference (dry air at 0 °C, liquid water at 0 °C). */
  enthalpyJkg: number;
  /** kg moist air per m³. */
  densityKgM3: number;
  pressurePa: number;
}

/**
 * Barometric pressure of the standard atmosphere at an elevation,
 * `p = 101325·(1 − 2.25577e-5·Z)^5.2559` Pa (ASHRAE Handbook—Fundamentals, psychrometrics
 * chapter, via psychrolib `GetStandardAtmPressure`).
 */
export function sitePressurePa(elevationM: number): number {
  return psychrolib.GetStandardAtmPressure(elevationM);
}

function state(tempC: number, humRatio: number, pressurePa: number): AirState {
  return {
    tempC,
    humRatio,
    enthalpyJkg: psychrolib.GetMoistAirEnthalpy(tempC, humRatio),
    densityKgM3: psychrolib.GetMoistAirDensity(tempC, humRatio, pressurePa),
    pressurePa,
  };
}

/**
 * Moist air from dry bulb and relative humidity (percent). Saturation over ice below 0.01 °C,
 * over water above (Hyland–Wexler as in ASHRAE Handbook—Fundamentals, via psychrolib);
 * enthalpy `h = 1.006·t + W·(2501 + 1.86·t)` kJ/kg; density `(1 + W)/v` with
 * `v = R_da·T·(1 + 1.607858·W)/p`.
 */
export function airFromRH(tempC: number, rhPct: number, pressurePa: number, field = "rhPct"): AirState {
  if (!(rhPct >= 0 && rhPct <= 100)) fail(field, `relative humidity must be between 0 and 100 % (got ${rhPct})`);
  if (!(tempC >= -100 && tempC <= 200)) fail(field, `temperature must be between −100 and 200 °C (got ${tempC})`);
  const w = psychrolib.GetHumRatioFromRelHum(tempC, rhPct / 100, pressurePa);
  return state(tempC, w, pressurePa);
}

/**
 * Moist air from dry bulb and thermodynamic wet bulb (ASHRAE Handbook—Fundamentals
 * psychrometric equations for W from t and t*, via psychrolib `GetHumRatioFromTWetBulb`).
 */
export function airFromWetBulb(tempC: number, wetBulbC: number, pressurePa: number, field = "coincidentWetBulbC"): AirState {
  if (!(wetBulbC <= tempC)) fail(field, `wet bulb must not exceed the dry bulb ${tempC} °C (got ${wetBulbC})`);
  const w = psychrolib.GetHumRatioFromTWetBulb(tempC, wetBulbC, pressurePa);
  if (!(w >= 0)) fail(field, `wet bulb ${wetBulbC} °C is too low for dry bulb ${tempC} °C (negative humidity ratio)`);
  return state(tempC, w, pressurePa);
}

/** Moist air at a temperature with a known humidity ratio (psychrolib enthalpy and density). */
export function airFromHumRatio(tempC: number, humRatio: number, pressurePa: number): AirState {
  return state(tempC, humRatio, pressurePa);
}

/** Relative humidity (percent) of a state, for reporting (psychrolib `GetRelHumFromHumRatio`). */
export function relativeHumidityPct(air: AirState): number {
  return 100 * psychrolib.GetRelHumFromHumRatio(air.tempC, air.humRatio, air.pressurePa);
}

/**
 * Relative humidity (percent) from dry bulb and dew point: `RH = p_ws(t_dp) / p_ws(t)`
 * (ASHRAE Handbook—Fundamentals psychrometric equations, via psychrolib
 * `GetRelHumFromTDewPoint`). The dew point must not exceed the dry bulb.
 */
export function rhPctFromDewPoint(tempC: number, dewPointC: number): number {
  return 100 * psychrolib.GetRelHumFromTDewPoint(tempC, dewPointC);
}

/**
 * Relative humidity (percent) from dry bulb and thermodynamic wet bulb at a pressure
 * (ASHRAE Handbook—Fundamentals, via psychrolib `GetRelHumFromTWetBulb`).
 */
export function rhPctFromWetBulb(tempC: number, wetBulbC: number, pressurePa: number): number {
  return 100 * psychrolib.GetRelHumFromTWetBulb(tempC, wetBulbC, pressurePa);
}
