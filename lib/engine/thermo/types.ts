/**
 * The contract every refrigerant model implements. Callers (plant engine, charts, API) use
 * only this interface, so a better model can replace a weaker one without touching them.
 *
 * Units (SI, explicit in names): temperature K, pressure Pa (absolute), specific enthalpy
 * J/kg, specific entropy J/(kg·K), density kg/m³, cp J/(kg·K), speed of sound m/s.
 * Reference state: IIR — h = 200 kJ/kg and s = 1 kJ/(kg·K) for saturated liquid at 0 °C.
 */

export type FluidId =
  | "R717"
  | "R744"
  | "R134a"
  | "R404A"
  | "R507A"
  | "R448A"
  | "R449A"
  | "R290"
  | "R1234zeE"
  | "R513A"
  | "R454C"
  | "R455A";

export type SafetyGroup = "A1" | "A2L" | "A2" | "A3" | "B1" | "B2L" | "B2" | "B3";

/** Which temperature of a zeotropic blend's two-phase range a "saturation temperature" means. */
export type TempConvention = "dew" | "bubble" | "mean";

export interface FluidMeta {
  id: FluidId;
  /** Display name, e.g. "R717 (ammonia)". */
  name: string;
  molarMassKgMol: number;
  criticalTempK: number;
  criticalPressurePa: number;
  criticalDensityKgM3: number;
  normalBoilingPointK: number;
  safetyGroup: SafetyGroup;
  /** 100-year GWP and the IPCC report it is taken from. */
  gwp100: number;
  gwpSource: string;
  odp: number;
  /** Mass fractions for blends (component id → fraction); absent for pure fluids. */
  composition?: Record<string, number>;
  /** true for zeotropic blends (non-zero glide). */
  zeotropic: boolean;
  /** Name of the equation of state / model used. */
  model: string;
}

export interface ValidityRange {
  tMinK: number;
  tMaxK: number;
  pMaxPa: number;
}

export interface SaturationState {
  tBubbleK: number;
  tDewK: number;
  pBubblePa: number;
  pDewPa: number;
  /** Saturated liquid (bubble point) and saturated vapour (dew point) properties. */
  liquid: PhaseProps;
  vapour: PhaseProps;
  /** Temperature glide at this pressure (dew − bubble), K; 0 for pure fluids and azeotropes. */
  glideK: number;
}

export interface PhaseProps {
  tK: number;
  pPa: number;
  densityKgM3: number;
  hJkg: number;
  sJkgK: number;
  cpJkgK?: number;
  speedOfSoundMs?: number;
}

export type Phase = "liquid" | "vapour" | "two-phase" | "supercritical";

export interface State extends PhaseProps {
  phase: Phase;
  /** Vapour mass fraction inside the dome (0…1); undefined outside it. */
  quality?: number;
}

export interface Fluid {
  meta: FluidMeta;
  range: ValidityRange;
  /**
   * Saturation at a temperature. For zeotropic blends `convention` says which temperature
   * `tK` is (default "dew", as compressor and evaporator ratings use).
   */
  saturationAtT(tK: number, convention?: TempConvention): SaturationState;
  /** Saturation at a pressure. */
  saturationAtP(pPa: number): SaturationState;
  statePT(pPa: number, tK: number): State;
  statePH(pPa: number, hJkg: number): State;
  statePS(pPa: number, sJkgK: number): State;
}

/** Thrown for any input outside a model's validity range (never NaN, never extrapolation). */
export class ThermoRangeError extends Error {
  constructor(
    message: string,
    /** The argument that is out of range, e.g. "tK" or "pPa". */
    public readonly field: string,
    public readonly allowed: { min?: number; max?: number; unit: string },
  ) {
    super(message);
    this.name = "ThermoRangeError";
  }
}
