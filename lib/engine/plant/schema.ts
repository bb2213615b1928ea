/**
 * Input contract of the plant engine: evaporators, circuits, condensers and the optional
 * installed plant. SI throughout (°C only where the name says `C`, differences in K, powers
 * in W, volumes in m³/s). Defaults marked "common practice" are rules of the trade
 * (../../../shared DOMAIN.md §2 and §5), not values from a single source; every one can be
 * overridden per item.
 */
import { z } from "zod";

export { fluidIdSchema } from "../thermo/schema";
import { fluidIdSchema } from "../thermo/schema";

/** A number in [lo, hi] whose error message states the allowed range (as the ledger's schemas do). */
const range = (lo: number, hi: number, unit = "") => {
  const msg = `must be between ${lo} and ${hi}${unit ? " " + unit : ""}`;
  return z.number(msg).min(lo, msg).max(hi, msg);
};

/** A number above 0 and at most hi. */
const positive = (hi: number, unit = "") => {
  const msg = `must be greater than 0 and at most ${hi}${unit ? " " + unit : ""}`;
  return z.number(msg).gt(0, msg).max(hi, msg);
};
/** A whole number in [lo, hi]. */
const intRange = (lo: number, hi: number) => {
  const msg = `must be a whole number between ${lo} and ${hi}`;
  return z.int(msg).min(lo, msg).max(hi, msg);
};

const HIGH_SIDE_MSG = 'must be "optimise" or a pressure between 5000000 and 14000000 Pa (50–140 bar(a))';

const id = z.string().min(1, "must not be empty").max(100);
/** Stable schedule tag stored with the item ("EV-1", "CP-3" …); never renumbered. */
const tag = z
  .string()
  .min(1, "must not be empty")
  .max(40)
  .regex(/^[A-Za-z0-9][A-Za-z0-9 ._/-]*$/, "letters, digits and . _ / - only");

export const defrostTypeSchema = z.enum(["electric", "hot-gas", "off-cycle", "water"]);

export const evaporatorFeedSchema = z.discriminatedUnion("type", [
  z.object({
    type: z.literal("dx"),
    /** Superheat at the evaporator outlet, K (common practice 4–8 K). */
    superheatK: range(1, 20, "K").default(6),
  }),
  z.object({
    type: z.literal("pumped"),
    /** Liquid fed ÷ liquid evaporated (common practice 3–4 for ammonia). */
    circulationRatio: range(1.5, 10).default(4),
    /** Pump head, Pa (lifts plus coil and line losses); common practice 150–300 kPa. */
    pumpHeadPa: range(10_000, 1_000_000, "Pa").default(200_000),
    /** Pump and motor efficiency; all pump input ends up in the refrigerant. */
    pumpEfficiency: range(0.1, 0.9).default(0.45),
  }),
]);

export const evaporatorSchema = z.object({
  id,
  tag,
  roomId: id,
  circuitId: id,
  /** Number of unit coolers; default from duty and room length. */
  units: intRange(1, 200).optional(),
  /** Design TD = room air − evaporating temperature, K; default by humidity class. */
  tdK: range(1, 20, "K").optional(),
  feed: evaporatorFeedSchema.default({ type: "dx", superheatK: 6 }),
  defrost: z
    .object({
      type: defrostTypeSchema,
      /** Electric heater (or hot-gas / water equivalent) per W of cooling duty. */
      heaterWPerWDuty: range(0, 3, "W/W").optional(),
      minutesPerDefrost: range(0, 120, "min").optional(),
      defrostsPerDay: range(0, 24, "per day").optional(),
      /** Share of the defrost heat that ends up in the room (common practice ⅓–½). */
      fractionToRoom: range(0, 1).optional(),
    })
    .optional(),
  /** Air side of the unit cooler: the fan power estimate follows from airflow × pressure. */
  fan: z
    .object({
      /** Fan total pressure, Pa (common practice 100–200 Pa for unit coolers). */
      staticPressurePa: range(20, 1000, "Pa").default(150),
      /** Fan and motor efficiency, total-to-electric (common practice 0.4–0.6). */
      efficiency: range(0.1, 0.9).default(0.45),
      /** Air temperature drop across the coil as a fraction of TD (common practice 0.5–0.7). */
      airDropFractionOfTd: range(0.2, 0.95).default(0.6),
    })
    .default({ staticPressurePa: 150, efficiency: 0.45, airDropFractionOfTd: 0.6 }),
  /** Largest duty per unit cooler, W, used only for the default unit count. */
  maxUnitDutyW: range(500, 1_000_000, "W").default(40_000),
});

export const compressorTypeSchema = z.enum(["reciprocating", "screw", "scroll"]);

/**
 * Isentropic-efficiency curve η_is(PR) = peak − curvature·ln(PR/designRatio)², floored at
 * 0.3: highest at the machine's design pressure ratio and falling either side of it.
 */
export const isentropicCurveSchema = z.object({
  peak: range(0.3, 0.9),
  designRatio: range(1.2, 30),
  curvature: range(0, 1),
});

/**
 * Volumetric-efficiency curve η_v(PR) = leakage·(1 − clearance·(PR^(1/n) − 1)), the
 * clearance-re-expansion form of the textbook reciprocating model; a small clearance with
 * a leakage factor describes screws and scrolls over their range.
 */
export const volumetricCurveSchema = z.object({
  clearance: range(0, 0.2),
  polytropicExponent: range(1, 1.7),
  leakage: range(0.5, 1),
});

export const compressorSchema = z.object({
  type: compressorTypeSchema.default("screw"),
  /** A fixed value or a curve over pressure ratio; default by compressor type. */
  isentropic: z.union([range(0.3, 0.9), isentropicCurveSchema]).optional(),
  volumetric: z.union([range(0.3, 1), volumetricCurveSchema]).optional(),
  motorEfficiency: range(0.5, 0.99).default(0.93),
  /**
   * Oil-injected screws: the oil cooler holds the discharge at this temperature and takes
   * the rest of the compression heat (common practice 70–90 °C; default 80 °C). Ignored for other types.
   */
  oilCooledDischargeC: range(30, 130, "°C").optional(),
  /** Installed units of the set and how many of them are standby (schedule only). */
  units: intRange(1, 50).default(1),
  standbyUnits: intRange(0, 49).default(0),
});

export const heatRejectionSchema = z.discriminatedUnion("to", [
  z.object({ to: z.literal("condenser"), condenserId: id }),
  z.object({
    /** Cascade: this circuit's condenser is the evaporator of another circuit. */
    to: z.literal("circuit"),
    circuitId: id,
    /** This (low-stage) circuit's condensing temperature in the cascade exchanger, °C. */
    condensingC: range(-50, 25, "°C").default(-5),
    /** Low-stage condensing − high-stage evaporating temperature, K (common practice 3–6 K). */
    approachK: range(1, 15, "K").default(5),
  }),
]);

export const circuitSchema = z.object({
  id,
  tag,
  refrigerant: fluidIdSchema,
  /**
   * single-stage; two-stage with an open flash intercooler at the geometric-mean pressure;
   * transcritical (R744 only: gas-cooler pressure chosen for the best COP, subcritical
   * when the gas-cooler outlet allows condensing).
   */
  arrangement: z.enum(["single-stage", "two-stage", "transcritical"]).default("single-stage"),
  compressor: compressorSchema.default({ type: "screw", motorEfficiency: 0.93, units: 1, standbyUnits: 0 }),
  /** Saturated-temperature drop from the coldest evaporator to the compressor, K. */
  suctionLineAllowanceK: range(0, 10, "K").default(1),
  /** Superheat at the compressor suction, K; default the DX superheat (0 for pumped feed). */
  superheatK: range(0, 40, "K").optional(),
  /** Liquid subcooling at the condenser outlet, K (common practice 2–5 K). */
  subcoolingK: range(0, 30, "K").default(3),
  /** Blends: which saturation temperature "evaporating/condensing" means (EN 12900: dew). */
  tempConvention: z.enum(["dew", "bubble", "mean"]).default("dew"),
  heatRejection: heatRejectionSchema,
  /** Two-stage only: intermediate saturation temperature, °C; default the geometric-mean pressure. */
  intermediateC: range(-40, 30, "°C").optional(),
  /**
   * Transcritical R744 only: set point of the high-pressure control (gas-cooler pressure), Pa
   * absolute, or "optimise" (the default) for the pressure of best COP. At design the
   * computation also refuses a set point below the lowest sensible pressure for the
   * gas-cooler outlet (its saturation pressure, or the critical pressure above 31 °C).
   */
  highSidePa: z
    .union([
      z.literal("optimise"),
      z
        .number(HIGH_SIDE_MSG)
        .min(5e6, HIGH_SIDE_MSG)
        .max(14e6, HIGH_SIDE_MSG),
    ])
    .optional(),
  /**
   * Transcritical R744 only: gas-cooler outlet temperature at or below which the circuit
   * runs subcritical (condensing, with a liquid receiver), °C; default the critical
   * temperature − 5 K ≈ 26 °C (common practice).
   */
  switchOverC: range(5, 30, "°C").optional(),
  /**
   * Stable tags of the circuit's own schedule items; when absent they are derived from the
   * circuit tag (CP-<tag>, IC-<tag>, LPR-<tag>, CHX-<tag>), so they stay put either way.
   */
  tags: z
    .object({ compressor: tag.optional(), intercooler: tag.optional(), separator: tag.optional(), cascadeHx: tag.optional() })
    .optional(),
});

export const condenserSchema = z.object({
  id,
  tag,
  type: z.enum(["air-cooled", "evaporative", "water-cooled", "user-set"]),
  /**
   * Condensing − design air / wet bulb / entering water temperature, K. Defaults (common
   * practice): air-cooled 12 K over dry bulb, evaporative 10 K over wet bulb, water-cooled
   * 8 K over the entering water. For R744 gas coolers: outlet − dry bulb (default 3 K).
   */
  approachK: range(1, 30, "K").optional(),
  /** user-set: the condensing temperature itself, °C. */
  condensingC: range(-10, 70, "°C").optional(),
  /** water-cooled: entering water, °C; default the wet bulb + 5 K (a cooling tower's approach). */
  waterInC: range(0, 50, "°C").optional(),
  /** Fan (and spray pump) input per kW rejected, W/kW; default air 20, evaporative 12, water 0. */
  fanPowerWPerKw: range(0, 100, "W/kW").optional(),
  units: intRange(1, 50).default(1),
});

const ratedEvaporatorSchema = z.object({
  id,
  tag,
  roomId: id,
  circuitId: id,
  units: intRange(1, 200),
  standbyUnits: intRange(0, 199).default(0),
  /** Capacity of one unit at its rating conditions, W. */
  ratedCapacityWPerUnit: positive(5_000_000, "W"),
  rating: z.object({
    /** Air-on temperature at rating, °C. */
    airOnC: range(-60, 40, "°C"),
    /** Rating TD = air-on − evaporating temperature, K. */
    tdK: range(1, 25, "K"),
    /** Feed the unit was rated with (catalogues: DX, or pumped / flooded). */
    feed: z.enum(["dx", "pumped"]),
    /** Air-on relative humidity at rating, %; default 85 % (the EN 328 wet standard conditions, from memory). */
    rhPct: range(0, 100, "%").optional(),
  }),
  /** Feed on site when it differs from the design evaporator's in this room (default: that, else the rating's). */
  siteFeed: z.enum(["dx", "pumped"]).optional(),
  /**
   * Mean capacity lost to frost over a defrost cycle, fraction of the clean-coil capacity;
   * default 0.1 for a coil below 0 °C, 0 above (common practice).
   */
  frostCapacityLoss: range(0, 0.5).optional(),
});

const installedCompressorSchema = z.object({
  id,
  tag,
  circuitId: id,
  /**
   * Which stage of a two-stage circuit the set serves: "low" (booster, suction to intermediate)
   * or "high" (intermediate to condensing). Default "low"; ignored on single-stage circuits.
   */
  stage: z.enum(["low", "high"]).optional(),
  type: compressorTypeSchema,
  units: intRange(1, 50),
  standbyUnits: intRange(0, 49).default(0),
  motorEfficiency: range(0.5, 0.99).default(0.93),
  rating: z.discriminatedUnion("by", [
    z.object({ by: z.literal("swept-volume"), sweptVolumeM3sPerUnit: positive(10, "m³/s") }),
    z.object({
      by: z.literal("rated"),
      capacityWPerUnit: positive(20_000_000, "W"),
      shaftPowerWPerUnit: positive(10_000_000, "W"),
      evaporatingC: range(-70, 20, "°C"),
      condensingC: range(-30, 70, "°C"),
      superheatK: range(0, 40, "K").default(0),
      subcoolingK: range(0, 30, "K").default(0),
    }),
  ]),
});

const installedCondenserSchema = z.object({
  id,
  tag,
  condenserId: id,
  units: intRange(1, 50),
  standbyUnits: intRange(0, 49).default(0),
  /** Heat rejection of one unit at the rating approach, W. */
  ratedHeatRejectionWPerUnit: positive(50_000_000, "W"),
  /** Condensing − air / wet bulb / water temperature at rating, K. */
  ratingApproachK: range(1, 30, "K"),
});

export const installedPlantSchema = z.object({
  evaporators: z.array(ratedEvaporatorSchema).default([]),
  compressors: z.array(installedCompressorSchema).default([]),
  condensers: z.array(installedCondenserSchema).default([]),
});

export const plantOptionsSchema = z.object({
  /** Relative tolerance of the fan/defrost fixed point on each room's design duty. */
  fixedPointTolerance: range(1e-9, 1e-2).default(1e-6),
  fixedPointMaxIterations: intRange(2, 200).default(30),
  /** Design temperature of the low side at standstill, °C (common practice 32 °C outdoors, 27 °C indoors). */
  lowSideStandstillC: range(10, 55, "°C").default(32),
  /** High-side design temperature, °C; default 55 °C air-cooled, 43 °C evaporative / water (common practice). */
  highSideDesignC: range(30, 75, "°C").optional(),
  /** The site's electrical supply as the schedule should state it, e.g. "400 V 3~ 50 Hz". */
  electricalSupply: z.string().max(60, "must be at most 60 characters").optional(),
});

function duplicates(values: string[]): string[] {
  const seen = new Set<string>();
  const dup = new Set<string>();
  for (const v of values) (seen.has(v) ? dup : seen).add(v);
  return [...dup];
}

export const plantInputSchema = z
  .object({
    evaporators: z.array(evaporatorSchema).default([]),
    circuits: z.array(circuitSchema).default([]),
    condensers: z.array(condenserSchema).default([]),
    installed: installedPlantSchema.optional(),
    options: plantOptionsSchema.default({
      fixedPointTolerance: 1e-6,
      fixedPointMaxIterations: 30,
      lowSideStandstillC: 32,
    }),
  })
  .superRefine((plant, ctx) => {
    const lists = [
      ["evaporators", plant.evaporators],
      ["circuits", plant.circuits],
      ["condensers", plant.condensers],
    ] as const;
    for (const [key, items] of lists) {
      for (const d of duplicates(items.map((x) => x.id)))
        ctx.addIssue({ code: "custom", path: [key], message: `duplicate id "${d}"` });
    }
    const allTags = [...plant.evaporators, ...plant.circuits, ...plant.condensers].map((x) => x.tag);
    for (const d of duplicates(allTags))
      ctx.addIssue({ code: "custom", path: ["evaporators"], message: `duplicate tag "${d}" (tags must be unique)` });

    const circuits = new Map(plant.circuits.map((c) => [c.id, c]));
    const condensers = new Set(plant.condensers.map((c) => c.id));
    plant.evaporators.forEach((e, i) => {
      if (!circuits.has(e.circuitId))
        ctx.addIssue({ code: "custom", path: ["evaporators", i, "circuitId"], message: `no circuit "${e.circuitId}"` });
    });
    plant.circuits.forEach((c, i) => {
      const hr = c.heatRejection;
      if (hr.to === "condenser" && !condensers.has(hr.condenserId))
        ctx.addIssue({
          code: "custom",
          path: ["circuits", i, "heatRejection", "condenserId"],
          message: `no condenser "${hr.condenserId}"`,
        });
      if (hr.to === "circuit") {
        if (!circuits.has(hr.circuitId))
          ctx.addIssue({
            code: "custom",
            path: ["circuits", i, "heatRejection", "circuitId"],
            message: `no circuit "${hr.circuitId}"`,
          });
        // A cascade must end at a condenser: follow the chain and refuse loops.
        const seen = new Set([c.id]);
        let next = circuits.get(hr.circuitId);
        while (next && next.heatRejection.to === "circuit") {
          if (seen.has(next.id)) {
            ctx.addIssue({
              code: "custom",
              path: ["circuits", i, "heatRejection", "circuitId"],
              message: "cascade loop: the chain of circuits never reaches a condenser",
            });
            break;
          }
          seen.add(next.id);
          next = circuits.get(next.heatRejection.circuitId);
        }
      }
      if (c.arrangement === "transcritical" && c.refrigerant !== "R744")
        ctx.addIssue({
          code: "custom",
          path: ["circuits", i, "arrangement"],
          message: "transcritical is allowed for R744 only",
        });
      if (c.compressor.standbyUnits >= c.compressor.units)
        ctx.addIssue({
          code: "custom",
          path: ["circuits", i, "compressor", "standbyUnits"],
          message: `must be less than units (${c.compressor.units})`,
        });
    });
    const inst = plant.installed;
    if (inst) {
      const items = [
        ["evaporators", inst.evaporators],
        ["compressors", inst.compressors],
        ["condensers", inst.condensers],
      ] as const;
      for (const [key, list] of items) {
        list.forEach((x, i) => {
          if (x.standbyUnits >= x.units)
            ctx.addIssue({
              code: "custom",
              path: ["installed", key, i, "standbyUnits"],
              message: `must be less than units (${x.units})`,
            });
        });
      }
      inst.evaporators.forEach((e, i) => {
        if (!circuits.has(e.circuitId))
          ctx.addIssue({ code: "custom", path: ["installed", "evaporators", i, "circuitId"], message: `no circuit "${e.circuitId}"` });
      });
      inst.compressors.forEach((e, i) => {
        const c = circuits.get(e.circuitId);
        if (!c) ctx.addIssue({ code: "custom", path: ["installed", "compressors", i, "circuitId"], message: `no circuit "${e.circuitId}"` });
        else if (e.stage !== undefined && c.arrangement !== "two-stage")
          ctx.addIssue({ code: "custom", path: ["installed", "compressors", i, "stage"], message: `circuit "${c.id}" is ${c.arrangement}: a stage ("low" | "high") applies to two-stage circuits only` });
      });
      inst.condensers.forEach((e, i) => {
        if (!condensers.has(e.condenserId))
          ctx.addIssue({ code: "custom", path: ["installed", "condensers", i, "condenserId"], message: `no condenser "${e.condenserId}"` });
      });
    }
  });

export type PlantInput = z.output<typeof plantInputSchema>;
export type PlantInputRaw = z.input<typeof plantInputSchema>;
export type EvaporatorInput = z.output<typeof evaporatorSchema>;
export type CircuitInput = z.output<typeof circuitSchema>;
export type CondenserInput = z.output<typeof condenserSchema>;
export type CompressorInput = z.output<typeof compressorSchema>;
export type InstalledPlant = z.output<typeof installedPlantSchema>;
export type PlantOptions = z.output<typeof plantOptionsSchema>;
export type DefrostType = z.output<typeof defrostTypeSchema>;
export type CompressorType = z.output<typeof compressorTypeSchema>;
export type IsentropicCurve = z.output<typeof isentropicCurveSchema>;
export type VolumetricCurve = z.output<typeof volumetricCurveSchema>;
