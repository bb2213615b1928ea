/**
 * Plant engine — public surface. Evaporators sized from the heat ledger, vapour-compression
 * circuits (single-stage, two-stage ammonia with an open flash intercooler, CO2 cascades,
 * transcritical CO2) on the real-fluid property engine, first- and second-law checks,
 * installed-plant re-rating and the equipment schedule. Pure TypeScript, SI throughout;
 * see README.md in this folder for the model and its assumptions. The facility document
 * (ledger + plant) and `computeFacility` live in ../model.ts.
 */
export {
  plantInputSchema,
  evaporatorSchema,
  evaporatorFeedSchema,
  circuitSchema,
  compressorSchema,
  condenserSchema,
  heatRejectionSchema,
  installedPlantSchema,
  plantOptionsSchema,
  fluidIdSchema,
  defrostTypeSchema,
  compressorTypeSchema,
  isentropicCurveSchema,
  volumetricCurveSchema,
} from "./schema";
export type {
  PlantInput,
  PlantInputRaw,
  EvaporatorInput,
  CircuitInput,
  CondenserInput,
  CompressorInput,
  InstalledPlant,
  PlantOptions,
  DefrostType,
  CompressorType,
} from "./schema";
export { PlantError } from "./errors";
export type { PlantErrorCode } from "./errors";
export {
  isentropicEfficiency,
  volumetricEfficiency,
  DEFAULT_ISENTROPIC,
  DEFAULT_VOLUMETRIC,
  DISCHARGE_LIMIT_C,
  PRESSURE_RATIO_LIMIT,
} from "./compressor";
export {
  defaultTdK,
  defaultDefrost,
  sizeRoomEvaporators,
  roomFeedback,
  solveDutyFixedPoint,
} from "./evaporator";
export type { EvaporatorSizing, RoomFeedback, RoomForSizing, FixedPointResult } from "./evaporator";
export { singleStageCycle, twoStageCycle, transcriticalCycle, conventionPressure } from "./cycle";
export type { CycleSpec, CycleResult, StatePoint, StageResult, EntropyComponent, ColdReservoir } from "./cycle";
export { computeCircuits, condenserSink, defaultApproachK, ENERGY_CLOSURE } from "./circuit";
export type { CircuitResult, PlantWarning, WarningCode, DesignPressure, Ambient } from "./circuit";
export { computePlant, fluidsNeeded, systemsOf } from "./plant";
export type { PlantResult, SystemResult, CondenserResult } from "./plant";
export { safetyCaution, SAFETY_GROUP, CODES_NOTICE } from "./safety";
export type { SafetyCaution } from "./safety";
export { buildSchedule, nextTag } from "./schedule";
export type { ScheduleItem, ScheduleItemKind } from "./schedule";
export { rerateInstalled } from "./rerate";
export type { RerateConditions, RerateResult, CircuitRerate, RoomRerate } from "./rerate";
