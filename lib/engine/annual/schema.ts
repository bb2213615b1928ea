/**
 * Input contracts of the annual engine: the facility model's optional `operation` section
 * (schedules, part-load data per circuit, tariff) and the monthly climate a sine-day year is
 * built from. Every default reproduces the design day, so a model without `operation`
 * stays valid and its year is the design day repeated at each hour's weather.
 */
import { z } from "zod";

/** A number in [lo, hi] whose error message states the allowed range (as the ledger's schemas do). */
const range = (lo: number, hi: number, unit = "") => {
  const msg = `must be between ${lo} and ${hi}${unit ? " " + unit : ""}`;
  return z.number(msg).min(lo, msg).max(hi, msg);
};
const intRange = (lo: number, hi: number) => {
  const msg = `must be a whole number between ${lo} and ${hi}`;
  return z.int(msg).min(lo, msg).max(hi, msg);
};

/** Multiplier of the design day's value in one hour (1 = as on the design day). */
const factor = range(0, 10);

/**
 * A week of hourly multipliers: 7 days (0 = Monday … 6 = Sunday) × 24 hours (00:00 … 23:00),
 * each a multiplier of the design day's value at that hour.
 */
export const weekHoursSchema = z
  .array(z.array(factor).length(24, "must list exactly 24 hourly multipliers (00:00 … 23:00)"))
  .length(7, "must list exactly 7 days (Monday … Sunday)");

/** A (fraction, value) curve given as points in increasing fraction. */
const curveSchema = (what: string) =>
  z
    .array(z.tuple([range(0.01, 1), range(0.01, 1.5)]))
    .min(2, `${what}: give at least 2 points`)
    .max(30, `${what}: at most 30 points`)
    .superRefine((pts, ctx) => {
      for (let i = 1; i < pts.length; i++)
        if (!(pts[i][0] > pts[i - 1][0])) ctx.addIssue({ code: "custom", path: [i, 0], message: "fractions must increase from point to point" });
      if (pts[pts.length - 1][0] !== 1) ctx.addIssue({ code: "custom", path: [pts.length - 1, 0], message: "the last point must be at fraction 1 (full load)" });
    });

const onoffSchema = z.object({
  type: z.literal("onoff"),
  /** Cycling degradation coefficient C_d in PLF = 1 − C_d·(1 − PLR). */
  cyclingLossCd: range(0, 0.5).default(0.25),
});
const slideValveSchema = z.object({
  type: z.literal("slide-valve"),
  /** Points (capacity fraction, power fraction); default the generic curve in part-load.ts. */
  curve: curveSchema("slide-valve curve").optional(),
  /** Below the curve's lowest capacity the compressor cycles on/off with this C_d. */
  cyclingLossCd: range(0, 0.5).default(0.25),
});
const variableSpeedSchema = z.object({
  type: z.literal("variable-speed"),
  /** Lowest speed as a fraction of full speed; below it the compressor cycles. */
  minSpeed: range(0.05, 1).default(0.3),
  /** Drive (inverter) efficiency, applied at every speed. */
  driveEfficiency: range(0.8, 1).default(0.97),
  /** Points (speed fraction, compressor efficiency relative to full speed); default in part-load.ts. */
  efficiencyCurve: curveSchema("efficiency curve").optional(),
  cyclingLossCd: range(0, 0.5).default(0.25),
});

export const leadControlSchema = z.discriminatedUnion("type", [onoffSchema, slideValveSchema, variableSpeedSchema]);

const stagedSchema = z.object({
  type: z.literal("staged"),
  /** Equal compressors in the set; default the circuit's units less standby. */
  compressors: intRange(1, 20).optional(),
  /** How the lead (trimming) compressor follows the load; the others run at full load or stop. */
  lead: leadControlSchema.default({ type: "slide-valve", cyclingLossCd: 0.25 }),
});

export const capacityControlSchema = z.discriminatedUnion("type", [onoffSchema, slideValveSchema, variableSpeedSchema, stagedSchema]);

export const circuitOperationSchema = z.object({
  /** Default: screw → slide valve, reciprocating / scroll → on/off; staged when the set has 2+ running units. */
  capacityControl: capacityControlSchema.optional(),
  /** Lowest condensing (or gas-cooler outlet) temperature the controls allow, °C; default 20 (R744: 10). */
  minCondensingC: range(-10, 50, "°C").optional(),
  /** Condenser approach for the year, K; default the condenser's own (or its type's default). */
  approachK: range(1, 30, "K").optional(),
  /** Condenser fans: speed-controlled (fan laws, P ∝ airflow³), staged on/off, or proportional to heat rejected (the design rule). */
  condenserFanControl: z.enum(["speed", "staged", "proportional"]).default("speed"),
  condenserFanStages: intRange(1, 24).default(4),
  /** Lowest fan speed (fraction) before speed-controlled fans cycle. */
  condenserFanMinSpeed: range(0.05, 1).default(0.2),
  /** Oil-cooling pump / fan input per kW of oil-cooler heat, W/kW (0 for thermosyphon). */
  oilCoolingWPerKw: range(0, 100, "W/kW").default(0),
  /** Other auxiliaries running whenever the circuit has load (e.g. condenser water pump), W. */
  auxiliaryW: range(0, 1_000_000, "W").default(0),
});

const dayNight = z.object({
  kind: z.literal("day-night"),
  dayPricePerKWh: range(0, 100),
  nightPricePerKWh: range(0, 100),
  /** Day rate from this hour (inclusive) … */
  dayStartHour: intRange(0, 23).default(7),
  /** … to this hour (exclusive); may wrap past midnight. */
  dayEndHour: intRange(0, 24).default(23),
  demandChargePerKWMonth: range(0, 10_000).default(0),
});
const flat = z.object({
  kind: z.literal("flat"),
  pricePerKWh: range(0, 100),
  /** Charge per kW of each month's peak demand. */
  demandChargePerKWMonth: range(0, 10_000).default(0),
});
export const tariffSchema = z.discriminatedUnion("kind", [flat, dayNight]);

export const operationSchema = z.object({
  /** Door traffic: multipliers of each door's design-day passages by weekday and hour. */
  doorTraffic: z
    .object({
      /** For every door without its own entry; default all 1. */
      all: weekHoursSchema.optional(),
      /** Per door id. */
      byDoor: z.record(z.string().min(1), weekHoursSchema).default({}),
    })
    .default({ byDoor: {} }),
  /** Product intake (products and batches) as multipliers of the design day's intake. */
  productIntake: z
    .object({
      byWeekday: z.array(factor).length(7, "must list exactly 7 days (Monday … Sunday)").optional(),
      byMonth: z.array(factor).length(12, "must list exactly 12 months").optional(),
    })
    .default({}),
  /** Lights and people: multipliers of the design day's hourly value by weekday and hour. */
  lights: weekHoursSchema.optional(),
  people: weekHoursSchema.optional(),
  /**
   * Defrosts per day follow the moisture the air exchange brings in:
   * n_day = n_design·[fixedShare + (1 − fixedShare)·M_day/M_design], at most maxFactor·n_design.
   */
  defrost: z
    .object({
      fixedShare: range(0, 1).default(0.3),
      maxFactor: range(1, 5).default(2),
    })
    .default({ fixedShare: 0.3, maxFactor: 2 }),
  /** Part-load and condenser data per circuit id. */
  circuits: z.record(z.string().min(1), circuitOperationSchema).default({}),
  tariff: tariffSchema.default({ kind: "flat", pricePerKWh: 0, demandChargePerKWMonth: 0 }),
});

export type OperationInput = z.output<typeof operationSchema>;
export type OperationInputRaw = z.input<typeof operationSchema>;
export type CircuitOperation = z.output<typeof circuitOperationSchema>;
export type CapacityControl = z.output<typeof capacityControlSchema>;
export type LeadControl = z.output<typeof leadControlSchema>;
export type Tariff = z.output<typeof tariffSchema>;

const twelve = (lo: number, hi: number, unit: string) =>
  z.array(range(lo, hi, unit)).length(12, "must list exactly 12 months (January … December)");

/**
 * Monthly means a sine-day year is built from: mean dry bulb, mean daily range (max − min)
 * and mean relative humidity, January … December.
 */
export const monthlyClimateSchema = z.object({
  label: z.string().min(1).max(200).default("monthly means"),
  meanDryBulbC: twelve(-50, 50, "°C"),
  dailyRangeK: twelve(0, 30, "K"),
  meanRhPct: twelve(1, 100, "%"),
});
export type MonthlyClimate = z.output<typeof monthlyClimateSchema>;
export type MonthlyClimateRaw = z.input<typeof monthlyClimateSchema>;
