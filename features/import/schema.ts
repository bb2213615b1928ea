import { z } from "zod";
import type { ImportPreview, PreviewRow, RowError } from "./plans";

export const importModeSchema = z.enum(["preview", "commit"], { error: "mode must be preview or commit" });
export const importNameSchema = z.string().trim().min(1, "Name the stocking check (1 to 120 characters)").max(120, "Name must be at most 120 characters");

export interface ImportResultDto {
  kind: "rooms" | "stocking";
  fileName: string;
  format: "xlsx" | "csv";
  rows: PreviewRow[];
  errors: RowError[];
  notes: string[];
  /** Items the commit writes (rooms added/updated, or rooms a stocking check changes). */
  itemCount: number;
  committed: null | { version?: number; scenarioId?: string };
}

export type { ImportPreview, PreviewRow, RowError };
