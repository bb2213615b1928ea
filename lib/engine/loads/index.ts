/**
 * Heat ledger engine — public surface. Pure TypeScript (zod + psychrolib), SI throughout.
 * See README.md in this folder for the input format.
 */
export {
  siteSchema,
  roomSchema,
  doorSchema,
  surfaceSchema,
  productStreamSchema,
  storedProduceSchema,
  batchSchema,
  packagingSchema,
  otherSideSchema,
  ledgerOptionsSchema,
  ledgerInputSchema,
  customCommoditySchema,
  roomKinds,
} from "./schema";
export type {
  SiteInput,
  RoomInput,
  RoomKind,
  DoorInput,
  SurfaceInput,
  ProductStreamInput,
  StoredProduceInput,
  PackagingInput,
  BatchInput,
  LedgerInput,
  LedgerInputRaw,
  LedgerOptions,
  RoomInputRaw,
} from "./schema";
export {
  computeLedger,
  computeRoomLoad,
  buildLedgerContext,
  contextFromParsed,
  ledgerFromContext,
  ledgerFromResults,
  withEvaporatorHeat,
  parseLedgerInput,
  ENGINE_VERSION,
} from "./ledger";
export type { LedgerContext, SiteContext, RoomLoadResult, LedgerResult, LedgerTotals } from "./ledger";
export type { LoadComponent, LoadComponentKind, LoadTrace } from "./types";
export { LoadInputError } from "./errors";
export type { LoadInputIssue } from "./errors";
export { COMMODITIES, getCommodity, listCommodities, buildCustomCommodity, LATENT_HEAT_WATER_KJKG } from "./commodities";
export type { Commodity, RespirationData, CustomCommodityInput } from "./commodities";
export { chenEnthalpyKJkg, iceFraction, productHeatSplit, PACKAGING_CP_KJKGK } from "./product";
export { respirationWPerKg } from "./respiration";
export { plankFreezingTimeS, phamFreezingTimeS, airSurfaceCoefficientWm2K, effectiveSurfaceCoefficientWm2K, SHAPE_FACTORS } from "./freezing";
export { gosneyOlamaFullyOpen, doorwayOpenTimeFactor, defaultFlowFactor, PROTECTION_EFFECTIVENESS, DOCK_SEAL_EFFECTIVENESS } from "./infiltration";
export { uValue, solarAllowanceK, SOLAR_ALLOWANCE_K, INSIDE_FILM_M2KW, OUTSIDE_FILM_M2KW } from "./transmission";
export { sitePressurePa, airFromRH, airFromWetBulb, rhPctFromDewPoint, rhPctFromWetBulb } from "./psychro";
export type { AirState } from "./psychro";
