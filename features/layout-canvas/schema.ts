import { z } from "zod";
import type { z as zt } from "zod";
import type { roomSchema, doorSchema } from "@/lib/engine/loads/schema";
import type { circuitSchema, condenserSchema, evaporatorSchema } from "@/lib/engine/plant/schema";

/** Entities of the stored model document as the canvas edits them (input shape: defaults optional). */
export type RoomDoc = zt.input<typeof roomSchema>;
export type DoorDoc = zt.input<typeof doorSchema>;
export type EvaporatorDoc = zt.input<typeof evaporatorSchema>;
export type CircuitDoc = zt.input<typeof circuitSchema>;
export type CondenserDoc = zt.input<typeof condenserSchema>;

/** The facility's model document without the site (see features/facilities/engine-model.ts). */
export interface CanvasDoc {
  schemaVersion: number;
  rooms: RoomDoc[];
  doors: DoorDoc[];
  plant: {
    evaporators?: EvaporatorDoc[];
    circuits?: CircuitDoc[];
    condensers?: CondenserDoc[];
    [k: string]: unknown;
  };
  [k: string]: unknown;
}

export const NODE_KINDS = ["room", "door", "evaporator", "circuit", "condenser", "outdoors"] as const;
export type NodeKind = (typeof NODE_KINDS)[number];

const point = z.object({
  x: z.number().refine(Number.isFinite, "x must be a finite number").refine((v) => Math.abs(v) <= 1e6, "x must be within ±1 000 000"),
  y: z.number().refine(Number.isFinite, "y must be a finite number").refine((v) => Math.abs(v) <= 1e6, "y must be within ±1 000 000"),
});

/** Canvas node ids: `<kind>:<entity id>` or `outdoors`. */
const nodeKey = z
  .string()
  .max(220, "node id must be at most 220 characters")
  .regex(/^(outdoors|(room|door|evaporator|circuit|condenser):.+)$/, "node id must be outdoors or <kind>:<id>");

/** PUT …/layout: node positions and viewport, apart from the engineering revisions. */
export const layoutPutSchema = z.object({
  positions: z
    .record(nodeKey, point)
    .refine((r) => Object.keys(r).length <= 5000, "at most 5000 node positions"),
  viewport: z
    .object({ x: point.shape.x, y: point.shape.y, zoom: z.number().min(0.05, "zoom must be at least 0.05").max(8, "zoom must be at most 8") })
    .nullable()
    .optional(),
  /** Width the site-plan background is drawn at, in metres of the plan (10 canvas px per m). */
  backgroundWidthM: z.int("background width must be a whole number of metres").min(10, "background width must be between 10 and 5000 m").max(5000, "background width must be between 10 and 5000 m").optional(),
});
export type LayoutPut = z.infer<typeof layoutPutSchema>;

export interface LayoutDto {
  positions: Record<string, { x: number; y: number }>;
  viewport: { x: number; y: number; zoom: number } | null;
  background: { mime: string; widthM: number; updatedAt: string } | null;
}

/** Largest site-plan upload, bytes. */
export const MAX_BACKGROUND_BYTES = 5 * 1024 * 1024;
