/**
 * The heat ledger's input contract (zod 4, SI). Forms, the HTTP API, the OpenAPI document
 * and the CLI all validate with these schemas; the engine computes only parsed input.
 * No transforms are used, so every schema converts to JSON Schema as written.
 */
import { z } from "zod";

/**
 * A number in [lo, hi] whose error message states the allowed range and unit. One check per
 * number instead of a min/max pair (validation time matters: the ledger re-runs on every
 * edit); the bounds are put into the JSON Schema through `meta`.
 */
const range = (lo: number, hi: number, unit = "") => {
  const message = `must be between ${lo} and ${hi}${unit ? " " + unit : ""}`;
  return z
    .number()
    .refine((v) => v >= lo && v <= hi, message)
    .meta({ minimum: lo, maximum: hi });
};
/** A number > 0 and ≤ hi. */
const positive = (hi: number, unit = "") => {
  const message = `must be greater than 0 and at most ${hi}${unit ? " " + unit : ""}`;
  return z
    .number()
    .refine((v) => v > 0 && v <= hi, message)
    .meta({ exclusiveMinimum: 0, maximum: hi });
};

const tempC = range(-80, 80, "°C");
const hoursPerDay = range(0, 24, "h/day");
const fraction = range(0, 1);
const powerW = range(0, 1e8, "W");
const hourOfDay = z.number().int("must be a whole hour 0–23").min(0, "must be between 0 and 23").max(23, "must be between 0 and 23");
/**
 * 24 non-negative values, one per hour starting at 00:00. Checked in one pass over the array
 * (not per element) because door and arrival schedules dominate validation time otherwise.
 */
const byHour = (unit: string) =>
  z
    .array(z.number())
    .length(24, "must list exactly 24 hourly values (00:00 … 23:00)")
    .superRefine((values, ctx) => {
      for (let h = 0; h < values.length; h++) {
        const v = values[h];
        if (!(v >= 0 && v <= 1e9)) ctx.addIssue({ code: "custom", path: [h], message: `must be between 0 and 1e9 ${unit}` });
      }
    });

export const siteSchema = z
  .object({
    name: z.string().optional(),
    designDryBulbC: range(-40, 60, "°C"),
    coincidentWetBulbC: range(-40, 60, "°C").optional(),
    /** Design relative humidity, percent. */
    designRH: range(0, 100, "%").optional(),
    groundTempC: range(-30, 40, "°C"),
    elevationM: range(-500, 5000, "m"),
    /** Temperature a heated slab under a freezer is held at; +10 °C is common practice. */
    heatedSlabTempC: range(-10, 30, "°C").default(10),
    /** Which way the sun-facing (equator-facing) walls point for the solar allowance. */
    hemisphere: z.enum(["north", "south"]).default("north"),
  })
  .superRefine((s, ctx) => {
    if (s.coincidentWetBulbC === undefined && s.designRH === undefined) {
      ctx.addIssue({ code: "custom", path: ["coincidentWetBulbC"], message: "give coincidentWetBulbC or designRH (0–100 %)" });
    }
    if (s.coincidentWetBulbC !== undefined && s.coincidentWetBulbC > s.designDryBulbC) {
      ctx.addIssue({
        code: "custom",
        path: ["coincidentWetBulbC"],
        message: `must not exceed designDryBulbC (${s.designDryBulbC} °C)`,
      });
    }
  });

const layerSchema = z.object({
  material: z.string().optional(),
  thicknessM: positive(2, "m"),
  conductivityWmK: positive(400, "W/(m·K)"),
});

export const otherSideSchema = z.union([
  z.enum(["outdoors", "ground", "heatedSlab"]),
  z.object({ roomId: z.string().min(1, "must name a room id") }),
]);

export const surfaceSchema = z
  .object({
    id: z.string().optional(),
    label: z.string().optional(),
    kind: z.enum(["wall", "roof", "ceiling", "floor"]),
    /** Compass direction a wall faces (solar allowance); roofs are horizontal. */
    orientation: z.enum(["N", "NE", "E", "SE", "S", "SW", "W", "NW"]).optional(),
    /** Which room dimension a wall runs along, when `areaM2` is not given (area = that × height). */
    along: z.enum(["length", "width"]).optional(),
    areaM2: positive(1e6, "m²").optional(),
    uValueWm2K: positive(20, "W/(m²·K)").optional(),
    layers: z.array(layerSchema).optional(),
    /** Inside surface resistance, m²·K/W; default 0.12 (still air, common practice). */
    insideFilmM2KW: range(0, 1, "m²·K/W").optional(),
    /** Outside surface resistance; default 0.04 outdoors, 0.12 to another room, 0 to ground. */
    outsideFilmM2KW: range(0, 1, "m²·K/W").optional(),
    colour: z.enum(["light", "medium", "dark"]).default("medium"),
    /** Overrides the tabulated solar allowance, K. */
    solarAllowanceK: range(0, 30, "K").optional(),
    otherSide: otherSideSchema,
    /** Overrides the other side's temperature (e.g. a shaded yard, a plant room). */
    otherSideTempC: tempC.optional(),
  })
  .superRefine((s, ctx) => {
    if (s.uValueWm2K === undefined && (s.layers === undefined || s.layers.length === 0)) {
      ctx.addIssue({ code: "custom", path: ["uValueWm2K"], message: "give uValueWm2K (> 0) or at least one layer" });
    }
    if (s.uValueWm2K !== undefined && s.layers !== undefined && s.layers.length > 0) {
      ctx.addIssue({ code: "custom", path: ["layers"], message: "give either uValueWm2K or layers, not both" });
    }
    if (s.kind === "wall" && s.areaM2 === undefined && s.along === undefined) {
      ctx.addIssue({ code: "custom", path: ["along"], message: 'a wall needs areaM2 or along ("length" | "width")' });
    }
  });

export const packagingSchema = z.object({
  kind: z.enum(["cardboard", "plastic", "wood", "steel", "aluminium", "glass"]),
  /** Packaging mass as a fraction of the product mass (e.g. 0.08), or … */
  massFractionOfProduct: range(0, 5).optional(),
  /** … an absolute packaging mass per day. */
  massKgPerDay: range(0, 1e8, "kg/day").optional(),
  /** Overrides the tabulated specific heat, kJ/(kg·K). */
  specificHeatKJkgK: positive(5, "kJ/(kg·K)").optional(),
});

export const productStreamSchema = z.object({
  id: z.string().optional(),
  commodityId: z.string().min(1),
  massKgPerDay: range(0, 1e8, "kg/day"),
  enteringTempC: tempC,
  /** Default: the room set point. */
  finalTempC: tempC.optional(),
  pullDownHours: positive(168, "h"),
  packaging: packagingSchema.optional(),
  /** Share of the day's mass arriving in each hour (any scale; normalised). Default: evenly. */
  arrivalsByHour: byHour("share").optional(),
});

export const storedProduceSchema = z
  .object({
    commodityId: z.string().min(1),
    massKg: range(0, 1e9, "kg").optional(),
    palletPositions: range(0, 1e6, "pallets").optional(),
    kgPerPallet: range(0, 5000, "kg").optional(),
  })
  .superRefine((s, ctx) => {
    const byPallet = s.palletPositions !== undefined || s.kgPerPallet !== undefined;
    if (s.massKg === undefined && !(s.palletPositions !== undefined && s.kgPerPallet !== undefined)) {
      ctx.addIssue({ code: "custom", path: ["massKg"], message: "give massKg or both palletPositions and kgPerPallet" });
    }
    if (s.massKg !== undefined && byPallet) {
      ctx.addIssue({ code: "custom", path: ["massKg"], message: "give massKg or pallet positions, not both" });
    }
  });

const scheduledLoad = {
  hoursPerDay,
  /** First hour of a contiguous run; without it the energy is spread evenly over the day. */
  startHour: hourOfDay.optional(),
};

export const batchSchema = z.object({
  commodityId: z.string().min(1),
  massKg: positive(1e7, "kg"),
  /** Slab thickness, or cylinder / sphere diameter, m. */
  thicknessM: positive(2, "m"),
  shape: z.enum(["slab", "cylinder", "sphere"]).default("slab"),
  enteringTempC: tempC,
  /** Final product (centre) temperature the batch is frozen to, e.g. −18 °C. */
  finalTempC: tempC,
  /** Default: the room set point. */
  airTempC: tempC.optional(),
  airVelocityMS: range(0, 30, "m/s").default(3),
  /** Overrides the surface coefficient found from the air velocity, W/(m²·K). */
  surfaceHeatTransferWm2K: positive(500, "W/(m²·K)").optional(),
  /** Thermal resistance of cartons / wrapping in the heat path, m²·K/W: h_eff = 1/(1/h + R). */
  packagingResistanceM2KW: range(0, 5, "m²·K/W").default(0),
  densityKgM3: positive(3000, "kg/m³").optional(),
  frozenConductivityWmK: positive(5, "W/(m·K)").optional(),
  freezingTimeMethod: z.enum(["pham", "plank"]).default("pham"),
  /** Overrides the computed batch time, h. */
  batchHours: positive(168, "h").optional(),
  batchesPerDay: positive(48, "batches/day").default(1),
  startHour: hourOfDay.default(0),
  packaging: packagingSchema.optional(),
  /** Batch (tunnel / trolley) fans not counted in evaporatorFans, W while a batch runs. */
  fanPowerW: powerW.default(0),
});

export const roomKinds = ["storage", "blast", "ripening", "dock", "ca", "processing", "anteroom"] as const;

export const roomSchema = z.object({
  id: z.string().min(1, "must not be empty"),
  name: z.string().min(1, "must not be empty"),
  kind: z.enum(roomKinds),
  lengthM: positive(1000, "m"),
  widthM: positive(1000, "m"),
  heightM: positive(100, "m"),
  setPointC: range(-60, 40, "°C"),
  rhPct: range(0, 100, "%"),
  /** Allowed compressor run time; 18–20 h/day where defrost stops the coil (common practice). */
  runHoursPerDay: positive(24, "h/day").default(20),
  /** Fraction added to the 24-h energy, e.g. 0.1 (common practice). */
  safetyFactor: range(0, 1).default(0.1),
  surfaces: z.array(surfaceSchema).default([]),
  products: z.array(productStreamSchema).default([]),
  storedProduce: z.array(storedProduceSchema).default([]),
  people: z.object({ count: range(0, 1000), ...scheduledLoad }).optional(),
  lights: z
    .object({ powerW: powerW.optional(), wPerM2: range(0, 100, "W/m²").optional(), ...scheduledLoad })
    .refine((l) => (l.powerW === undefined) !== (l.wPerM2 === undefined), {
      message: "give powerW or wPerM2 (one of them)",
      path: ["powerW"],
    })
    .optional(),
  machinery: z.array(z.object({ label: z.string().default("machinery"), powerW, ...scheduledLoad })).default([]),
  forklifts: z.object({ count: range(0, 500), powerWEach: powerW, ...scheduledLoad }).optional(),
  /** Heat released by battery charging inside the room. */
  batteryCharging: z.object({ heatW: powerW, ...scheduledLoad }).optional(),
  heaters: z
    .array(
      z.object({
        kind: z.enum(["doorFrame", "antiSweat", "drainLine", "underFloor", "other"]),
        label: z.string().optional(),
        powerW,
        hoursPerDay: hoursPerDay.default(24),
        /** Share of the heater's power that reaches the room (under-floor: often small). */
        fractionToRoom: fraction.default(1),
      }),
    )
    .default([]),
  /** Evaporator fan motors inside the room; the plant engine replaces this field. */
  evaporatorFans: z.object({ powerW, hoursPerDay }).default({ powerW: 0, hoursPerDay: 24 }),
  /** Electric / hot-gas defrost heat; the plant engine replaces this field. */
  defrost: z
    .object({
      heaterW: powerW,
      minutesPerDefrost: range(0, 240, "min"),
      defrostsPerDay: range(0, 48, "defrosts/day"),
      /** Share of the defrost heat that ends up in the room; a third to a half (common practice). */
      fractionToRoom: fraction,
    })
    .default({ heaterW: 0, minutesPerDefrost: 0, defrostsPerDay: 0, fractionToRoom: 0.5 }),
  /** Deliberate fresh-air exchange (ripening, CA rooms) at the outdoor design state. */
  ventilation: z
    .object({
      airChangesPerHour: range(0, 100, "1/h").optional(),
      flowM3PerH: range(0, 1e7, "m³/h").optional(),
      ...scheduledLoad,
    })
    .refine((v) => (v.airChangesPerHour === undefined) !== (v.flowM3PerH === undefined), {
      message: "give airChangesPerHour or flowM3PerH (one of them)",
      path: ["airChangesPerHour"],
    })
    .optional(),
  ripening: z
    .object({
      /** A ripening charge (ethylene-triggered) respires several times faster than storage. */
      chargeActive: z.boolean().default(true),
      respirationMultiplier: range(1, 20).default(3),
      /** Heaters of the room's heat mode that run on the design day (their heat ends up in the room). */
      heating: z.object({ powerW, ...scheduledLoad }).optional(),
    })
    .optional(),
  batch: batchSchema.optional(),
});

export const doorSchema = z
  .object({
    id: z.string().min(1, "must not be empty"),
    name: z.string().optional(),
    widthM: positive(20, "m"),
    heightM: positive(20, "m"),
    /** The two spaces the door joins: room ids or "outdoors". */
    sides: z.tuple([z.string().min(1), z.string().min(1)]),
    passagesPerDay: range(0, 1e5, "passages/day").optional(),
    passagesByHour: byHour("passages").optional(),
    /** Door open-close time per passage, θp; 15–25 s is typical (from memory of the handbook). */
    openCloseSecondsPerPassage: range(0, 600, "s").default(20),
    /** Minutes the door simply stands open per day, θo. */
    minutesHeldOpenPerDay: range(0, 1440, "min/day").default(0),
    protection: z.enum(["none", "stripCurtain", "airCurtain", "vestibule", "fastDoor"]).default("none"),
    /** Overrides the protection's default effectiveness E (0 … <1). */
    protectionEffectiveness: range(0, 0.99).optional(),
    /** Overrides the doorway flow factor Df (0.8 above ~11 K, 1.1 below, from memory). */
    flowFactor: range(0.1, 1.5).optional(),
    /**
     * The wall the door sits in: a room the door joins and the index of a wall in that room's
     * `surfaces`. The door's area is taken out of that wall's area (in both rooms when the
     * wall is shared) and counted at the door leaf's own U-value.
     */
    wall: z
      .object({
        roomId: z.string().min(1, "must name one of the two rooms the door joins"),
        surfaceIndex: z.number().int("must be a whole number (the wall's position in the room's surfaces, from 0)").min(0, "must be 0 or more"),
      })
      .optional(),
    /** Door leaf U-value, W/(m²·K) (films included); default: the wall's own U-value. */
    uValueWm2K: positive(20, "W/(m²·K)").optional(),
    dock: z
      .object({
        seal: z.enum(["none", "seal", "shelter"]),
        /** Share of the openings made with a trailer docked against the seal/shelter. */
        dockedShare: fraction,
        sealEffectiveness: range(0, 0.99).optional(),
      })
      .optional(),
  })
  .superRefine((d, ctx) => {
    if (d.sides[0] === d.sides[1]) {
      ctx.addIssue({ code: "custom", path: ["sides"], message: "a door must join two different spaces" });
    }
    if (d.passagesPerDay !== undefined && d.passagesByHour !== undefined) {
      ctx.addIssue({ code: "custom", path: ["passagesByHour"], message: "give passagesPerDay or passagesByHour, not both" });
    }
  });

export const ledgerOptionsSchema = z.object({
  /**
   * Heat flowing from the room to a colder other side (neighbour room, ground, cool air):
   * "ignore" counts it as zero (conservative), "credit" subtracts it.
   */
  colderNeighbour: z.enum(["ignore", "credit"]).default("ignore"),
  /**
   * A product pull-down shorter than a day on the 24-h basis: "rate" carries the pull-down
   * rate over the whole day (sizing practice), "dailyEnergy" uses the actual daily energy.
   */
  pullDownBasis: z.enum(["rate", "dailyEnergy"]).default("rate"),
});

/** A user's own commodity; it overrides a built-in one with the same id. */
export const customCommoditySchema = z
  .object({
    id: z.string().min(1, "must not be empty"),
    name: z.string().min(1, "must not be empty"),
    group: z.enum(["fruit", "vegetable", "meat", "poultry", "fish", "dairy", "frozen", "prepared"]),
    waterFraction: range(0.01, 0.99),
    proteinFraction: range(0, 0.9),
    initialFreezingPointC: range(-40, -0.05, "°C"),
    densityKgM3: positive(3000, "kg/m³").optional(),
    frozenConductivityWmK: positive(5, "W/(m·K)").optional(),
    /** Becker–Fricke constants, or tabulated [tempC, mW/kg] points in rising temperature. */
    respiration: z
      .union([
        z.object({ f: positive(10), g: range(0, 10) }),
        z.object({ points: z.array(z.tuple([range(-5, 40, "°C"), positive(5000, "mW/kg")])).min(1, "give at least one point") }),
      ])
      .optional(),
    /** Transpiration coefficient k_t, ng/(kg·s·Pa) (fresh produce: moisture loss in storage). */
    transpirationNgKgSPa: range(0, 100_000, "ng/(kg·s·Pa)").optional(),
    source: z.string().min(1, "name where the data come from"),
  })
  .superRefine((c, ctx) => {
    if (0.4 * c.proteinFraction >= c.waterFraction) {
      ctx.addIssue({ code: "custom", path: ["proteinFraction"], message: "bound water 0.4·protein must be below the water fraction" });
    }
    if (c.respiration && "points" in c.respiration) {
      const pts = c.respiration.points;
      for (let i = 1; i < pts.length; i++) {
        if (!(pts[i][0] > pts[i - 1][0])) ctx.addIssue({ code: "custom", path: ["respiration", "points", i, 0], message: "temperatures must rise from point to point" });
      }
    }
  });

export const ledgerInputSchema = z
  .object({
    site: siteSchema,
    rooms: z.array(roomSchema),
    doors: z.array(doorSchema).default([]),
    /** Commodities of the workspace, added to (or overriding) the built-in library. */
    commodities: z.array(customCommoditySchema).default([]),
    options: ledgerOptionsSchema.default({ colderNeighbour: "ignore", pullDownBasis: "rate" }),
  })
  .superRefine((input, ctx) => {
    const ids = new Set<string>();
    input.rooms.forEach((r, i) => {
      if (r.id === "outdoors") ctx.addIssue({ code: "custom", path: ["rooms", i, "id"], message: '"outdoors" is reserved' });
      if (ids.has(r.id)) ctx.addIssue({ code: "custom", path: ["rooms", i, "id"], message: `duplicate room id "${r.id}"` });
      ids.add(r.id);
      if (r.setPointC >= input.site.designDryBulbC) {
        ctx.addIssue({
          code: "custom",
          path: ["rooms", i, "setPointC"],
          message: `a cooled room's set point must be below the site design dry bulb (${input.site.designDryBulbC} °C)`,
        });
      }
    });
    input.rooms.forEach((r, i) =>
      r.surfaces.forEach((s, j) => {
        if (typeof s.otherSide === "object") {
          if (!ids.has(s.otherSide.roomId)) {
            ctx.addIssue({
              code: "custom",
              path: ["rooms", i, "surfaces", j, "otherSide", "roomId"],
              message: `no room with id "${s.otherSide.roomId}"`,
            });
          } else if (s.otherSide.roomId === r.id) {
            ctx.addIssue({ code: "custom", path: ["rooms", i, "surfaces", j, "otherSide", "roomId"], message: "a surface cannot face its own room" });
          }
        }
      }),
    );
    input.doors.forEach((d, i) => {
      if (!d.wall) return;
      const at = ["doors", i, "wall"];
      if (!d.sides.includes(d.wall.roomId)) {
        ctx.addIssue({ code: "custom", path: [...at, "roomId"], message: `must be one of the rooms the door joins (${d.sides.filter((x) => x !== "outdoors").join(", ")})` });
        return;
      }
      const room = input.rooms.find((r) => r.id === d.wall!.roomId);
      if (!room) return;
      const surface = room.surfaces[d.wall.surfaceIndex];
      if (!surface) {
        ctx.addIssue({ code: "custom", path: [...at, "surfaceIndex"], message: `room "${room.id}" has ${room.surfaces.length} surfaces: must be between 0 and ${room.surfaces.length - 1}` });
      } else if (surface.kind !== "wall") {
        ctx.addIssue({ code: "custom", path: [...at, "surfaceIndex"], message: `surface ${d.wall.surfaceIndex} of room "${room.id}" is a ${surface.kind}: a door sits in a wall` });
      }
    });
    input.doors.forEach((d, i) =>
      d.sides.forEach((side, k) => {
        if (side !== "outdoors" && !ids.has(side)) {
          ctx.addIssue({ code: "custom", path: ["doors", i, "sides", k], message: `no room with id "${side}" (or use "outdoors")` });
        }
      }),
    );
  });

export type SiteInput = z.output<typeof siteSchema>;
export type SurfaceInput = z.output<typeof surfaceSchema>;
export type ProductStreamInput = z.output<typeof productStreamSchema>;
export type StoredProduceInput = z.output<typeof storedProduceSchema>;
export type PackagingInput = z.output<typeof packagingSchema>;
export type BatchInput = z.output<typeof batchSchema>;
export type RoomInput = z.output<typeof roomSchema>;
export type RoomKind = RoomInput["kind"];
export type DoorInput = z.output<typeof doorSchema>;
export type LedgerOptions = z.output<typeof ledgerOptionsSchema>;
/** A room as a caller writes it (defaulted fields optional). */
export type RoomInputRaw = z.input<typeof roomSchema>;
/** A parsed facility model (defaults filled in). */
export type LedgerInput = z.output<typeof ledgerInputSchema>;
/** What a caller writes: the same model with defaulted fields optional. */
export type LedgerInputRaw = z.input<typeof ledgerInputSchema>;
