/**
 * The stocking-check input: what a scenario changes in one or more rooms (SI). Shared by the
 * form, the API and the engine; the ranges are the heat ledger's own (lib/engine/loads/schema).
 */
import { z } from "zod";

const range = (lo: number, hi: number, unit: string) =>
  z.number().refine((v) => v >= lo && v <= hi, `must be between ${lo} and ${hi} ${unit}`);
const positive = (hi: number, unit: string) =>
  z.number().refine((v) => v > 0 && v <= hi, `must be greater than 0 and at most ${hi} ${unit}`);

export const STOCK_FIELDS = ["commodityId", "tonnesPerDay", "enteringTempC", "finalTempC", "pullDownHours", "storedMassKg", "setPointC"] as const;

export const roomChangeSchema = z
  .object({
    roomId: z.string().min(1, "choose a room"),
    /** New commodity of the room's product stream and stored stock (library id). */
    commodityId: z.string().min(1).optional(),
    /** Product arriving per day, t/day (the ledger's massKgPerDay / 1000). */
    tonnesPerDay: range(0, 100_000, "t/day").optional(),
    enteringTempC: range(-80, 80, "°C").optional(),
    /** Temperature the product is pulled down to; default the room set point. */
    finalTempC: range(-80, 80, "°C").optional(),
    pullDownHours: positive(168, "h").optional(),
    /** Stock held in the room (respiration of produce), kg. */
    storedMassKg: range(0, 1e9, "kg").optional(),
    /** Re-purposes the room: a new set point. */
    setPointC: range(-60, 40, "°C").optional(),
  })
  .refine((c) => STOCK_FIELDS.some((k) => c[k] !== undefined), { message: "change at least one value in this room", path: ["roomId"] });

export const scenarioChangesSchema = z
  .object({
    rooms: z.array(roomChangeSchema).min(1, "change at least one room").max(50, "at most 50 rooms"),
    /**
     * Where the safety factor sits: inside the new load (required = 24-h energy × (1 + SF) / run
     * hours) or in the headroom (required without it). Never both.
     */
    safetyFactorPlacement: z.enum(["load", "headroom"]).default("load"),
  })
  .superRefine((s, ctx) => {
    const seen = new Set<string>();
    s.rooms.forEach((r, i) => {
      if (seen.has(r.roomId)) ctx.addIssue({ code: "custom", path: ["rooms", i, "roomId"], message: "this room is already changed above" });
      seen.add(r.roomId);
    });
  });

export type RoomChange = z.output<typeof roomChangeSchema>;
export type ScenarioChanges = z.output<typeof scenarioChangesSchema>;
export type ScenarioChangesInput = z.input<typeof scenarioChangesSchema>;
