/** What a component was computed from, so the UI can explain the number. */
export interface LoadTrace {
  /** The method family, e.g. "Gosney–Olama door infiltration". */
  method: string;
  /** Where the method and its constants come from. */
  source: string;
  inputs: Record<string, number | string>;
  formula: string;
}

export type LoadComponentKind =
  | "transmission"
  | "infiltration"
  | "ventilation"
  | "product"
  | "packaging"
  | "batch"
  | "respiration"
  | "moisture"
  | "people"
  | "lights"
  | "machinery"
  | "forklifts"
  | "batteryCharging"
  | "heater"
  | "evaporatorFans"
  | "defrost";

/** One line of a room's heat ledger. */
export interface LoadComponent {
  kind: LoadComponentKind;
  label: string;
  /** The surface, door, product stream … this line belongs to, where there is one. */
  sourceId?: string;
  /** 24-hour average on the ledger's stated basis, W. */
  powerW: number;
  energyKWhPerDay: number;
  /** Air-side sensible part of powerW, W. */
  sensibleW: number;
  /** Air-side latent part of powerW (moisture condensed or frosted on the coil), W. */
  latentW: number;
  trace: LoadTrace;
}
