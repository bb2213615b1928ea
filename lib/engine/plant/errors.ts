/**
 * Typed errors of the plant engine. Each names the input that caused it (a dotted path into
 * the facility model, e.g. "plant.circuits.2.heatRejection.condensingC") so the UI can link
 * the message to the field; numbers that would be physically impossible are never returned.
 */

export type PlantErrorCode =
  /** An input that validates on its own but cannot be computed (e.g. below the fluid's range). */
  | "INPUT_OUT_OF_RANGE"
  /** A result that violates the second law (COP above Carnot, negative entropy generation). */
  | "SECOND_LAW_VIOLATION"
  /** Q_cond ≠ Q_evap + W beyond the closure tolerance. */
  | "ENERGY_BALANCE"
  /** The fan / defrost fixed point did not converge within the iteration cap. */
  | "NO_CONVERGENCE"
  /** A fluid was not loaded before a synchronous computation asked for it. */
  | "FLUID_NOT_LOADED";

export class PlantError extends Error {
  constructor(
    public readonly code: PlantErrorCode,
    message: string,
    /** Dotted path of the input that caused it, in the ledger's style (e.g. "plant.circuits.2.subcoolingK"). */
    public readonly field: string,
    /** Allowed range where one applies. */
    public readonly allowed?: { min?: number; max?: number; unit: string },
  ) {
    super(message);
    this.name = "PlantError";
  }
}
