import { z } from "zod";
import { scenarioChangesSchema } from "@/lib/engine/stocking/schema";
import { installedPlantSchema } from "@/lib/engine/plant/schema";
import { versionNumber } from "@/features/facilities/schema";
import type { InstalledPlantRaw } from "./installed";
import type { StockingCheckResult, Verdict } from "@/lib/engine/stocking";

export { scenarioChangesSchema };

export const scenarioParams = z.object({
  ws: z.string().min(1),
  id: z.string().uuid("Facility id must be a UUID"),
  sid: z.string().uuid("Stocking check id must be a UUID"),
});

export const createScenarioSchema = z.object({
  name: z.string().trim().min(1, "Name the stocking check (1 to 120 characters)").max(120, "Name must be at most 120 characters"),
  changes: scenarioChangesSchema,
});

export const emailScenarioSchema = z.object({
  to: z
    .array(z.email("Each recipient must be an e-mail address"))
    .min(1, "Give at least one recipient")
    .max(10, "At most 10 recipients"),
  note: z.string().max(1000, "The note must be at most 1000 characters").optional(),
});

export interface ScenarioDto {
  id: string;
  name: string;
  baseVersion: number;
  changes: z.output<typeof scenarioChangesSchema>;
  result: StockingCheckResult | null;
  verdict: Verdict | null;
  author: { name: string; email: string } | null;
  createdAt: string;
  acceptedAt: string | null;
  appliedAt: string | null;
  appliedRevision: number | null;
}

/** A room as the check form shows it now (SI). */
export interface RoomOption {
  id: string;
  name: string;
  setPointC: number;
  product: { commodityId: string; tonnesPerDay: number; enteringTempC: number; finalTempC: number | null; pullDownHours: number } | null;
  stored: { commodityId: string; massKg: number } | null;
}
export interface CommodityOption {
  id: string;
  name: string;
  group: string;
}

export type CreateScenarioInput = z.input<typeof createScenarioSchema>;

export const installedQuery = z.object({
  margin: z.coerce.number().min(0, "margin must be between 0 and 100 %").max(1, "margin must be between 0 and 100 %").optional(),
});

export const saveInstalledSchema = z.object({
  baseVersion: versionNumber("baseVersion"),
  installed: installedPlantSchema,
});

export interface InstalledDto {
  version: number;
  /** As recorded in the model, or null. */
  installed: InstalledPlantRaw | null;
  /** From the design at the requested selection margin (not saved). */
  proposed: InstalledPlantRaw;
  margin: number;
  rooms: Record<string, string>;
  circuits: Record<string, string>;
  /** Ids of the two-stage circuits, whose compressor sets are assigned to a stage. */
  twoStageCircuits?: string[];
}
