/**
 * Input contract of the plant engine: evaporators, circuits, condensers and the optional
 * installed plant. SI throughout (°C only where the name says `C`, differences in K, powers
 * in W, volumes in m³/s). Defaults marked "common practice" are rules of the trade
 * (../../../shared DOMAIN.md §2 and §5), not values from a single source; every one can be
 * overridden per item.
 */
import { z } from "zod";
import type { FluidId } from "../thermo/types";

const FLUID_IDS = [
  "R717",
  "R744",
  "R134a",
  "R404A",
  "R507A",
  "R448A",
  "R449A",
  "R290",
  "R1234zeE",
  "R513A",
] as const satisfies readonly FluidId[];

export const fluidIdSchema = z.enum(FLUID_IDS);

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
    superheatK: z.number().min(1).max(20).default(6),
  }),
  z.object({
    type: z.literal("pumped"),
    /** Liquid fed ÷ liquid evaporated (common practice 3–4 for ammonia). */
    circulationRatio: z.number().min(1.5).max(10).default(4),
    /** Pump head, Pa (lifts plus coil and line losses); common practice 150–300 kPa. */
    pumpHeadPa: z.number().min(10_000).max(1_000_000).default(200_000),
    /** Pump and motor efficiency; all pump input ends up in the refrigerant. */
    pumpEfficiency: z.number().min(0.1).max(0.9).default(0.45),
  }),
]);

export const evaporatorSchema = z.object({
  id,
  tag,
  roomId: id,
  circuitId: id,
  /** Number of unit coolers; default from duty and room length. */
  units: z.int().min(1).max(200).optional(),
  /** Design TD = room air − evaporating temperature, K; default by humidity class. */
  tdK: z.number().min(1).max(20).optional(),
  feed: evaporatorFeedSchema.default({ type: "dx", superheatK: 6 }),
  defrost: z
    .object({
      type: defrostTypeSchema,
      /** Electric heater (or hot-gas / water equivalent) per W of cooling duty. */
      heaterWPerWDuty: z.number().min(0).max(3).optional(),
      minutesPerDefrost: z.number().min(0).max(120).optional(),
      defrostsPerDay: z.number().min(0).max(24).optional(),
      /** Share of the defrost heat that ends up in the room (common practice ⅓–½). */
      fractionToRoom: z.number().min(0).max(1).optional(),
    })
    .optional(),
  /** Air side of the unit cooler: the fan power estimate follows from airflow × pressure. */
  fan: z
    .object({
      /** Fan total pressure, Pa (common practice 100–200 Pa for unit coolers). */
      staticPressurePa: z.number().min(20).max(1000).default(150),
      /** Fan and motor efficiency, total-to-electric (common practice 0.4–0.6). */
      efficiency: z.number().min(0.1).max(0.9).default(0.45),
      /** Air temperature drop across the coil as a fraction of TD (common practice 0.5–0.7). */
      airDropFractionOfTd: z.number().min(0.2).max(0.95).default(0.6),
    })
    .default({ staticPressurePa: 150, efficiency: 0.45, airDropFractionOfTd: 0.6 }),
  /** Largest duty per unit cooler, W, used only for the default unit count. */
  maxUnitDutyW: z.number().min(500).max(1_000_000).default(40_000),
});

export const compressorTypeSchema = z.enum(["reciprocating", "screw", "scroll"]);

/**
 * Isentropic-efficiency curve η_is(PR) = peak − curvature·ln(PR/designRatio)², floored at
 * 0.3: highest at the machine's design pressure ratio and falling either side of it.
 */
export const isentropicCurveSchema = z.object({
  peak: z.number().min(0.3).max(0.9),
  designRatio: z.number().min(1.2).max(30),
  curvature: z.number().min(0).max(1),
});

/**
 * Volumetric-efficiency curve η_v(PR) = leakage·(1 − clearance·(PR^(1/n) − 1)), the
 * clearance-re-expansion form of the textbook reciprocating model; a small clearance with
 * a leakage factor describes screws and scrolls over their range.
 */
export const volumetricCurveSchema = z.object({
  clearance: z.number().min(0).max(0.2),
  polytropicExponent: z.number().min(1).max(1.7),
  leakage: z.number().min(0.5).max(1),
});

export const compressorSchema = z.object({
  type: compressorTypeSchema.default("screw"),
  /** A fixed value or a curve over pressure ratio; default by compressor type. */
  isentropic: z.union([z.number().min(0.3).max(0.9), isentropicCurveSchema]).optional(),
  volumetric: z.union([z.number().min(0.3).max(1), volumetricCurveSchema]).optional(),
  motorEfficiency: z.number().min(0.5).max(0.99).default(0.93),
  /**
   * Oil-injected screws: the oil cooler holds the discharge at this temperature and takes
   * the rest of the compression heat (common practice 70–90 °C; default 80 °C). Ignored for other types.
   */
  oilCooledDischargeC: z.number().min(30).max(130).optional(),
  /** Installed units of the set and how many of them are standby (schedule only). */
  units: z.int().min(1).max(50).default(1),
  standbyUnits: z.int().min(0).max(49).default(0),
});

export const heatRejectionSchema = z.discriminatedUnion("to", [
  z.object({ to: z.literal("condenser"), condenserId: id }),
  z.object({
    /** Cascade: this circuit's condenser is the evaporator of another circuit. */
    to: z.literal("circuit"),
    circuitId: id,
    /** This (low-stage) circuit's condensing temperature in the cascade exchanger, °C. */
    condensingC: z.number().min(-50).max(25).default(-5),
    /** Low-stage condensing − high-stage evaporating temperature, K (common practice 3–6 K). */
    approachK: z.number().min(1).max(15).default(5),
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
  suctionLineAllowanceK: z.number().min(0).max(10).default(1),
  /** Superheat at the compressor suction, K; default the DX superheat (0 for pumped feed). */
  superheatK: z.number().min(0).max(40).optional(),
  /** Liquid subcooling at the condenser outlet, K (common practice 2–5 K). */
  subcoolingK: z.number().min(0).max(30).default(3),
  /** Blends: which saturation temperature "evaporating/condensing" means (EN 12900: dew). */
  tempConvention: z.enum(["dew", "bubble", "mean"]).default("dew"),
  heatRejection: heatRejectionSchema,
  /** Two-stage only: intermediate saturation temperature, °C; default the geometric-mean pressure. */
  intermediateC: z.number().min(-40).max(30).optional(),
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
  approachK: z.number().min(1).max(30).optional(),
  /** user-set: the condensing temperature itself, °C. */
  condensingC: z.number().min(-10).max(70).optional(),
  /** water-cooled: entering water, °C; default the wet bulb + 5 K (a cooling tower's approach). */
  waterInC: z.number().min(0).max(50).optional(),
  /** Fan (and spray pump) input per kW rejected, W/kW; default air 20, evaporative 12, water 0. */
  fanPowerWPerKw: z.number().min(0).max(100).optional(),
  units: z.int().min(1).max(50).default(1),
});

const ratedEvaporatorSchema = z.object({
  id,
  tag,
  roomId: id,
  circuitId: id,
  units: z.int().min(1).max(200),
  standbyUnits: z.int().min(0).max(199).default(0),
  /** Capacity of one unit at its rating conditions, W. */
  ratedCapacityWPerUnit: z.number().positive().max(5_000_000),
  rating: z.object({
    /** Air-on temperature at rating, °C. */
    airOnC: z.number().min(-60).max(40),
    /** Rating TD = air-on − evaporating temperature, K. */
    tdK: z.number().min(1).max(25),
    feed: z.enum(["dx", "pumped"]),
  }),
});

const installedCompressorSchema = z.object({
  id,
  tag,
  circuitId: id,
  type: compressorTypeSchema,
  units: z.int().min(1).max(50),
  standbyUnits: z.int().min(0).max(49).default(0),
  motorEfficiency: z.number().min(0.5).max(0.99).default(0.93),
  rating: z.discriminatedUnion("by", [
    z.object({ by: z.literal("swept-volume"), sweptVolumeM3sPerUnit: z.number().positive().max(10) }),
    z.object({
      by: z.literal("rated"),
      capacityWPerUnit: z.number().positive().max(20_000_000),
      shaftPowerWPerUnit: z.number().positive().max(10_000_000),
      evaporatingC: z.number().min(-70).max(20),
      condensingC: z.number().min(-30).max(70),
      superheatK: z.number().min(0).max(40).default(0),
      subcoolingK: z.number().min(0).max(30).default(0),
    }),
  ]),
});

const installedCondenserSchema = z.object({
  id,
  tag,
  condenserId: id,
  units: z.int().min(1).max(50),
  standbyUnits: z.int().min(0).max(49).default(0),
  /** Heat rejection of one unit at the rating approach, W. */
  ratedHeatRejectionWPerUnit: z.number().positive().max(50_000_000),
  /** Condensing − air / wet bulb / water temperature at rating, K. */
  ratingApproachK: z.number().min(1).max(30),
});

export const installedPlantSchema = z.object({
  evaporators: z.array(ratedEvaporatorSchema).default([]),
  compressors: z.array(installedCompressorSchema).default([]),
  condensers: z.array(installedCondenserSchema).default([]),
});

export const plantOptionsSchema = z.object({
  /** Relative tolerance of the fan/defrost fixed point on each room's design duty. */
  fixedPointTolerance: z.number().min(1e-9).max(1e-2).default(1e-6),
  fixedPointMaxIterations: z.int().min(2).max(200).default(30),
  /** Design temperature of the low side at standstill, °C (common practice 32 °C outdoors, 27 °C indoors). */
  lowSideStandstillC: z.number().min(10).max(55).default(32),
  /** High-side design temperature, °C; default 55 °C air-cooled, 43 °C evaporative / water (common practice). */
  highSideDesignC: z.number().min(30).max(75).optional(),
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
        if (!circuits.has(e.circuitId))
          ctx.addIssue({ code: "custom", path: ["installed", "compressors", i, "circuitId"], message: `no circuit "${e.circuitId}"` });
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
