/**
 * Commodity library: what the product, respiration and batch-freezing loads need per
 * commodity, with the source of every value. Specific heats and latent heat are derived from
 * the composition by one published model (Chen 1985, with Schwartzberg's bound water), the
 * same model the product load uses, so the library and the ledger never disagree.
 */

/** Latent heat of fusion of water at 0 °C, kJ/kg (ASHRAE Handbook—Refrigeration, thermal properties of foods). */
export const LATENT_HEAT_WATER_KJKG = 333.6;

export type RespirationData =
  /** Becker & Fricke fit `W/kg = (10.7·f/3600)·(9T/5 + 32)^g`, T in °C. */
  | { kind: "fg"; f: number; g: number }
  /** Tabulated heat of respiration, [tempC, mW/kg] pairs in rising temperature. */
  | { kind: "table"; points: ReadonlyArray<readonly [number, number]> };

export interface Commodity {
  id: string;
  name: string;
  group: "fruit" | "vegetable" | "meat" | "poultry" | "fish" | "dairy" | "frozen" | "prepared";
  /** Mass fraction of water, x_wo. */
  waterFraction: number;
  /** Mass fraction of protein, x_p (bound water x_b = 0.4·x_p, Schwartzberg 1976). */
  proteinFraction: number;
  initialFreezingPointC: number;
  /** Specific heat above the initial freezing point, kJ/(kg·K) (Chen 1985). */
  cpAboveKJkgK: number;
  /** Specific heat of the frozen solids-and-ice matrix below freezing, excluding latent release, kJ/(kg·K) (Chen 1985). */
  cpBelowKJkgK: number;
  /** Latent heat if all freezable water froze, L0·(x_wo − x_b), kJ/kg. */
  latentHeatKJkg: number;
  /** Product density (for freezing time), kg/m³. */
  densityKgM3?: number;
  /** Thermal conductivity of the frozen product (for freezing time), W/(m·K). */
  frozenConductivityWmK?: number;
  /** Fresh produce only. */
  respiration?: RespirationData;
  /**
   * Transpiration coefficient k_t, ng/(kg·s·Pa): moisture lost per kg of produce per second and
   * per Pa of vapour-pressure deficit between the produce surface and the room air (fresh
   * produce only; ASHRAE Handbook—Refrigeration, thermal properties of foods, transpiration).
   */
  transpirationNgKgSPa?: number;
  /** Where each value comes from, keyed by field name. */
  sources: Record<string, string>;
}

/** Checked 2026 against published copies of the handbook's tables; see each entry's `check`. */
const T3 = "ASHRAE Handbook—Refrigeration (2006), ch. 9 “Thermal properties of foods”, Table 3 (unfrozen composition, initial freezing point)";
const T3_IP =
  "the same ASHRAE table in I-P units (initial freezing point °F; latent heat of fusion Btu/lb, whose water content is latent heat ÷ 333.6 kJ/kg)";
const NOT_REACHED = "no published copy of the table could be reached to check it";
const SRC_COMPOSITION = `ASHRAE Handbook—Refrigeration, thermal properties of foods table (composition after USDA), from memory; ${NOT_REACHED}`;
const SRC_FREEZING = `ASHRAE Handbook—Refrigeration, thermal properties of foods table, initial freezing point, from memory; ${NOT_REACHED}`;
const SRC_CHEN_ABOVE = "Chen (1985): c_u = 4.19 − 2.30·x_s − 0.628·x_s³ kJ/(kg·K), x_s = 1 − x_wo";
const SRC_CHEN_BELOW = "Chen (1985): frozen matrix 1.55 + 1.26·x_s kJ/(kg·K); latent release added from the ice fraction";
const SRC_LATENT = "L0·(x_wo − x_b), L0 = 333.6 kJ/kg, x_b = 0.4·x_p (Schwartzberg 1976, as in the ASHRAE Handbook)";
const SRC_FG = `Becker & Fricke respiration coefficients f, g, as tabulated in the ASHRAE Handbook—Refrigeration, from memory; ${NOT_REACHED} (cabbage, strawberries and peaches agree with USDA Agriculture Handbook 66 heats of respiration near 0 °C within 30 %)`;
const SRC_KT =
  "ASHRAE Handbook—Refrigeration, thermal properties of foods chapter, table of transpiration coefficients of fruits and vegetables (after Sastry et al. 1978), from memory; check against the table";
const SRC_PHYS = `typical value, from memory of the ASHRAE thermal properties of foods data; ${NOT_REACHED} (check for your product)`;

/** Chen (1985) unfrozen specific heat from the solids fraction, kJ/(kg·K). */
export function chenUnfrozenCpKJkgK(solidsFraction: number): number {
  return 4.19 - 2.3 * solidsFraction - 0.628 * solidsFraction ** 3;
}

/** Chen (1985) frozen-matrix specific heat (no latent part), kJ/(kg·K). */
export function chenFrozenMatrixCpKJkgK(solidsFraction: number): number {
  return 1.55 + 1.26 * solidsFraction;
}

interface Raw {
  id: string;
  name: string;
  group: Commodity["group"];
  waterPct: number;
  proteinPct: number;
  tfC: number;
  densityKgM3?: number;
  frozenConductivityWmK?: number;
  respiration?: RespirationData;
  respirationSource?: string;
  compositionSource?: string;
  /** Transpiration coefficient, ng/(kg·s·Pa). */
  kt?: number;
  transpirationSource?: string;
  /** Where the composition / freezing point were checked, replacing the "from memory" notes. */
  check?: { composition?: string; freezing?: string };
}

const fg = (f: number, g: number): RespirationData => ({ kind: "fg", f, g });

const RAW: Raw[] = [
  // Fruit
  { id: "apples", name: "Apples", group: "fruit", waterPct: 83.9, proteinPct: 0.3, tfC: -1.1, respiration: fg(5.6871e-4, 2.5977), kt: 42, check: { composition: `${T3_IP}: latent heat 120 Btu/lb implies the water content within the table's rounding; protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 30.0 °F` } },
  { id: "pears", name: "Pears", group: "fruit", waterPct: 83.7, proteinPct: 0.4, tfC: -1.6, respiration: fg(6.3614e-5, 3.2037), kt: 80, check: { composition: `${T3_IP}: latent heat 120 Btu/lb implies the water content within the table's rounding; protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 29.1 °F` } },
  { id: "strawberries", name: "Strawberries", group: "fruit", waterPct: 91.6, proteinPct: 0.7, tfC: -0.8, respiration: fg(3.6683e-4, 3.033), check: { composition: `${T3_IP}: latent heat 132 Btu/lb implies 92.0 % water, 0.4 point above the value kept (91.6 %, USDA); protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 30.6 °F` } },
  { id: "grapes", name: "Grapes, table", group: "fruit", waterPct: 81.3, proteinPct: 0.7, tfC: -2.1, respiration: fg(7.056e-5, 3.033), kt: 79 },
  { id: "oranges", name: "Oranges", group: "fruit", waterPct: 82.3, proteinPct: 0.9, tfC: -0.8, respiration: fg(2.805e-4, 2.684), kt: 117, check: { composition: `${T3_IP}: latent heat 118 Btu/lb → 82.3 % water (whole fruit; 86.8 % was remembered before); protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 30.6 °F` } },
  { id: "lemons", name: "Lemons", group: "fruit", waterPct: 89.0, proteinPct: 1.1, tfC: -1.4, respiration: fg(0.011192, 1.774), kt: 186 },
  { id: "limes", name: "Limes", group: "fruit", waterPct: 88.3, proteinPct: 0.7, tfC: -1.6, respiration: fg(2.9834e-8, 4.7329) },
  { id: "grapefruit", name: "Grapefruit", group: "fruit", waterPct: 90.9, proteinPct: 0.6, tfC: -1.1, respiration: fg(0.0035828, 1.9982), kt: 81 },
  { id: "peaches", name: "Peaches", group: "fruit", waterPct: 87.66, proteinPct: 0.9, tfC: -0.9, respiration: fg(1.2996e-5, 3.6417), kt: 572, check: { composition: `${T3_IP}: latent heat 126 Btu/lb → 87.7 % water (88.9 % was remembered before); protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 30.4 °F` } },
  { id: "plums", name: "Plums", group: "fruit", waterPct: 87.2, proteinPct: 0.7, tfC: -0.8, respiration: fg(8.608e-5, 2.972) },
  { id: "blueberries", name: "Blueberries", group: "fruit", waterPct: 84.2, proteinPct: 0.7, tfC: -1.6, respiration: fg(7.252e-5, 3.2584), check: { composition: `${T3_IP}: latent heat 122 Btu/lb implies 85.1 % water, 0.9 point above the value kept (84.2 %, USDA); protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 29.1 °F` } },
  {
    id: "bananas",
    name: "Bananas (green, for ripening)",
    group: "fruit",
    waterPct: 74.3,
    proteinPct: 1.1,
    tfC: -0.8,
    // Converted from CO2 production (10.7 J per mg CO2) of green fruit; a ripening charge
    // respires several times more (see the room's ripening multiplier).
    respiration: { kind: "table", points: [[13, 60], [15, 75], [20, 100]] },
    check: { composition: `${T3_IP}: latent heat 107 Btu/lb implies the water content within the table's rounding; protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 30.6 °F` },
    respirationSource:
      "heat of respiration of green bananas, from memory of USDA Agriculture Handbook 66 / ASHRAE tables; no published copy of the table could be reached to check it; check against supplier data",
  },
  // Vegetables
  { id: "potatoes", name: "Potatoes, mature", group: "vegetable", waterPct: 78.96, proteinPct: 2.07, tfC: -0.6, respiration: fg(0.01709, 1.769), kt: 44, check: { composition: `${T3}: water and protein as tabulated`, freezing: SRC_FREEZING } },
  { id: "carrots", name: "Carrots, topped", group: "vegetable", waterPct: 87.79, proteinPct: 1.03, tfC: -1.4, respiration: fg(0.050018, 1.7926), kt: 1207, check: { composition: `${T3}: water and protein as tabulated`, freezing: `${T3}: as tabulated` } },
  { id: "cabbage", name: "Cabbage", group: "vegetable", waterPct: 92.15, proteinPct: 1.44, tfC: -0.9, respiration: fg(6.0803e-4, 2.6183), kt: 223, check: { composition: `${T3}: water and protein as tabulated`, freezing: `${T3}: as tabulated` } },
  { id: "onions", name: "Onions, dry", group: "vegetable", waterPct: 89.68, proteinPct: 1.16, tfC: -0.9, respiration: fg(3.668e-4, 2.538), kt: 60, check: { composition: `${T3}: water and protein as tabulated`, freezing: SRC_FREEZING } },
  { id: "tomatoes", name: "Tomatoes, mature green", group: "vegetable", waterPct: 93.0, proteinPct: 1.2, tfC: -0.5, respiration: fg(2.0074e-4, 2.835), kt: 140, check: { composition: `${T3}: water and protein as tabulated`, freezing: SRC_FREEZING } },
  { id: "green-peppers", name: "Green peppers", group: "vegetable", waterPct: 92.19, proteinPct: 0.89, tfC: -0.7, respiration: fg(3.5104e-4, 2.7414), check: { composition: `${T3}: water and protein as tabulated`, freezing: SRC_FREEZING } },
  { id: "snap-beans", name: "Snap beans", group: "vegetable", waterPct: 90.27, proteinPct: 1.82, tfC: -0.7, respiration: fg(0.0032828, 2.5077), check: { composition: `${T3}: water and protein as tabulated`, freezing: `${T3}: as tabulated` } },
  { id: "brussels-sprouts", name: "Brussels sprouts", group: "vegetable", waterPct: 86.0, proteinPct: 3.38, tfC: -0.8, respiration: fg(0.0027238, 2.5728), kt: 6150, check: { composition: `${T3}: water and protein as tabulated`, freezing: `${T3}: as tabulated` } },
  { id: "rutabagas", name: "Rutabagas", group: "vegetable", waterPct: 89.66, proteinPct: 1.2, tfC: -1.1, respiration: fg(1.6524e-4, 2.9039), kt: 469, check: { composition: `${T3}: water and protein as tabulated`, freezing: SRC_FREEZING } },
  { id: "lima-beans", name: "Lima beans", group: "vegetable", waterPct: 70.24, proteinPct: 6.84, tfC: -0.6, respiration: fg(9.1051e-4, 2.848), check: { composition: `${T3}: water and protein as tabulated`, freezing: `${T3}: as tabulated` } },
  { id: "green-peas", name: "Green peas (for freezing)", group: "vegetable", waterPct: 78.86, proteinPct: 5.42, tfC: -0.6, densityKgM3: 1000, frozenConductivityWmK: 1.2, check: { composition: `${T3}: water and protein as tabulated`, freezing: `${T3_IP}: 30.9 °F` } },
  // Meat and poultry
  { id: "beef-lean", name: "Beef, lean cuts (sirloin)", group: "meat", waterPct: 71.76, proteinPct: 22.0, tfC: -1.7, densityKgM3: 1050, frozenConductivityWmK: 1.35, check: { composition: `${T3_IP}: sirloin, lean, latent heat 103 Btu/lb → 71.8 % water (73 % was remembered before); protein 22 %: ${NOT_REACHED}`, freezing: `${T3_IP}: 28.9 °F` } },
  { id: "beef-carcass", name: "Beef, carcass (choice)", group: "meat", waterPct: 57.26, proteinPct: 17.32, tfC: -2.2, densityKgM3: 1050, frozenConductivityWmK: 1.3, check: { composition: `${T3_IP}: latent heat 82 Btu/lb → 57.3 % water (62 % was remembered before); protein 17.3 %: ${NOT_REACHED}`, freezing: `${T3_IP}: 28.0 °F (−1.7 °C was remembered before)` } },
  { id: "pork-lean", name: "Pork, lean cuts", group: "meat", waterPct: 72.0, proteinPct: 21.0, tfC: -2.2, densityKgM3: 1050, frozenConductivityWmK: 1.3 },
  { id: "lamb", name: "Lamb", group: "meat", waterPct: 64.0, proteinPct: 17.0, tfC: -1.9, densityKgM3: 1050, frozenConductivityWmK: 1.3 },
  { id: "chicken", name: "Chicken, broiler, whole", group: "poultry", waterPct: 66.0, proteinPct: 18.6, tfC: -2.8, densityKgM3: 1050, frozenConductivityWmK: 1.4 },
  { id: "turkey", name: "Turkey, whole", group: "poultry", waterPct: 70.4, proteinPct: 20.4, tfC: -2.8, densityKgM3: 1050, frozenConductivityWmK: 1.4 },
  // Fish
  { id: "cod", name: "Cod, fillets", group: "fish", waterPct: 81.2, proteinPct: 17.8, tfC: -2.2, densityKgM3: 1050, frozenConductivityWmK: 1.6, check: { composition: `${T3_IP}: latent heat 117 Btu/lb implies 81.6 % water, 0.4 point above the value kept (81.2 %, USDA); protein: ${SRC_COMPOSITION}`, freezing: `${T3_IP}: 28.0 °F` } },
  { id: "salmon", name: "Salmon, Atlantic", group: "fish", waterPct: 68.5, proteinPct: 19.8, tfC: -2.2, densityKgM3: 1050, frozenConductivityWmK: 1.4, check: { composition: SRC_COMPOSITION, freezing: `${T3_IP}: 28.0 °F for pink salmon (Atlantic salmon is not in the table)` } },
  { id: "shrimp", name: "Shrimp", group: "fish", waterPct: 75.9, proteinPct: 20.3, tfC: -2.2, densityKgM3: 1050, frozenConductivityWmK: 1.5 },
  // Dairy and eggs
  { id: "milk-whole", name: "Milk, whole", group: "dairy", waterPct: 87.7, proteinPct: 3.3, tfC: -0.6 },
  { id: "cheese-cheddar", name: "Cheese, cheddar", group: "dairy", waterPct: 36.8, proteinPct: 24.9, tfC: -12.9 },
  { id: "eggs-shell", name: "Eggs, whole in shell", group: "dairy", waterPct: 75.8, proteinPct: 12.6, tfC: -0.6 },
  // Frozen goods
  {
    id: "ice-cream",
    name: "Ice cream, vanilla",
    group: "frozen",
    waterPct: 61.0,
    proteinPct: 3.5,
    tfC: -5.6,
    densityKgM3: 600,
    frozenConductivityWmK: 0.9,
  },
  {
    id: "ready-meals",
    name: "Frozen ready meals (representative)",
    group: "prepared",
    waterPct: 75.0,
    proteinPct: 8.0,
    tfC: -2.0,
    densityKgM3: 1000,
    frozenConductivityWmK: 1.2,
    compositionSource:
      "representative composition of a mixed prepared meal — a Rimeplan assumption, not a measured product; enter your product's own data",
  },
];

function build(raw: Raw): Commodity {
  const xw = raw.waterPct / 100;
  const xp = raw.proteinPct / 100;
  const xs = 1 - xw;
  const xb = 0.4 * xp;
  const composition = raw.compositionSource ?? raw.check?.composition ?? SRC_COMPOSITION;
  const sources: Record<string, string> = {
    waterFraction: composition,
    proteinFraction: composition,
    initialFreezingPointC: raw.compositionSource ?? raw.check?.freezing ?? SRC_FREEZING,
    cpAboveKJkgK: SRC_CHEN_ABOVE,
    cpBelowKJkgK: SRC_CHEN_BELOW,
    latentHeatKJkg: SRC_LATENT,
  };
  if (raw.densityKgM3 !== undefined) sources.densityKgM3 = SRC_PHYS;
  if (raw.frozenConductivityWmK !== undefined) sources.frozenConductivityWmK = SRC_PHYS;
  if (raw.respiration) sources.respiration = raw.respirationSource ?? SRC_FG;
  if (raw.kt !== undefined) sources.transpirationNgKgSPa = raw.transpirationSource ?? SRC_KT;
  return {
    id: raw.id,
    name: raw.name,
    group: raw.group,
    waterFraction: xw,
    proteinFraction: xp,
    initialFreezingPointC: raw.tfC,
    cpAboveKJkgK: chenUnfrozenCpKJkgK(xs),
    cpBelowKJkgK: chenFrozenMatrixCpKJkgK(xs),
    latentHeatKJkg: LATENT_HEAT_WATER_KJKG * Math.max(0, xw - xb),
    densityKgM3: raw.densityKgM3,
    frozenConductivityWmK: raw.frozenConductivityWmK,
    respiration: raw.respiration,
    transpirationNgKgSPa: raw.kt,
    sources,
  };
}

/** A user's own commodity (e.g. stored per workspace), in fractions, with its source. */
export interface CustomCommodityInput {
  id: string;
  name: string;
  group: Commodity["group"];
  waterFraction: number;
  proteinFraction: number;
  initialFreezingPointC: number;
  densityKgM3?: number;
  frozenConductivityWmK?: number;
  respiration?: { f: number; g: number } | { points: Array<[number, number]> };
  /** Transpiration coefficient, ng/(kg·s·Pa). */
  transpirationNgKgSPa?: number;
  /** Where the data come from (lab report, supplier sheet, handbook table …). */
  source: string;
}

/**
 * Builds a library entry from a user's composition data; specific heats and latent heat are
 * derived by the same Chen (1985) / Schwartzberg relations as the built-in commodities.
 */
export function buildCustomCommodity(input: CustomCommodityInput): Commodity {
  const respiration: RespirationData | undefined = input.respiration
    ? "f" in input.respiration
      ? { kind: "fg", f: input.respiration.f, g: input.respiration.g }
      : { kind: "table", points: input.respiration.points }
    : undefined;
  const c = build({
    id: input.id,
    name: input.name,
    group: input.group,
    waterPct: input.waterFraction * 100,
    proteinPct: input.proteinFraction * 100,
    tfC: input.initialFreezingPointC,
    densityKgM3: input.densityKgM3,
    frozenConductivityWmK: input.frozenConductivityWmK,
    respiration,
    kt: input.transpirationNgKgSPa,
    transpirationSource: `user data: ${input.source}`,
    respirationSource: `user data: ${input.source}`,
    compositionSource: `user data: ${input.source}`,
  });
  c.waterFraction = input.waterFraction;
  c.proteinFraction = input.proteinFraction;
  if (c.densityKgM3 !== undefined) c.sources.densityKgM3 = `user data: ${input.source}`;
  if (c.frozenConductivityWmK !== undefined) c.sources.frozenConductivityWmK = `user data: ${input.source}`;
  return c;
}

/** The built-in commodities, by id. */
export const COMMODITIES: ReadonlyMap<string, Commodity> = new Map(RAW.map((r) => [r.id, build(r)]));

/** Looks a commodity up by id; undefined when it is not in the library. */
export function getCommodity(id: string): Commodity | undefined {
  return COMMODITIES.get(id);
}

/** Every built-in commodity, in library order. */
export function listCommodities(): Commodity[] {
  return [...COMMODITIES.values()];
}
