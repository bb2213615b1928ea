/**
 * One entry point for "compute this facility JSON", shared by POST /api/v1/calculate and the
 * CLI (`npm run calc`), so both return the same numbers for the same model. A document with
 * `schemaVersion` and `plant` is a full facility model (ledger + plant); one without is a
 * heat-ledger input (ledger only).
 */
import { createHash } from "node:crypto";
import { z } from "zod";
import { canonicalJson } from "@/lib/merge";
import { buildSchedule, computeFacility, facilityFluidsNeeded, facilityModelSchema, PLANT_ENGINE_VERSION, rerateInstalled } from "@/lib/engine/model";
import { contextFromParsed, ledgerFromContext, ledgerInputSchema } from "@/lib/engine/loads";
import { loadFluid } from "@/lib/engine/thermo";

export interface CalcIssue {
  field: string;
  message: string;
}

export class CalcError extends Error {
  constructor(
    message: string,
    public readonly kind: "validation" | "calculation",
    public readonly issues: CalcIssue[],
  ) {
    super(message);
  }
}

function issuesOf(e: z.ZodError): CalcIssue[] {
  return e.issues.map((i) => ({ field: i.path.map(String).join(".") || "(root)", message: i.message }));
}

export function isFacilityModel(raw: unknown): boolean {
  return typeof raw === "object" && raw !== null && "schemaVersion" in raw;
}

export async function calculate(raw: unknown) {
  const facility = isFacilityModel(raw);
  const parsed = (facility ? facilityModelSchema : ledgerInputSchema).safeParse(raw);
  if (!parsed.success) {
    const issues = issuesOf(parsed.error);
    throw new CalcError(`${issues[0].field}: ${issues[0].message}`, "validation", issues);
  }
  const inputHash = createHash("sha256").update(canonicalJson(parsed.data)).digest("hex").slice(0, 16);
  try {
    if (facility) {
      const model = parsed.data as z.output<typeof facilityModelSchema>;
      await Promise.all(facilityFluidsNeeded(model).map((id) => loadFluid(id)));
      const result = computeFacility(model);
      const installed = model.plant.installed;
      const hasInstalled = !!installed && installed.evaporators.length + installed.compressors.length + installed.condensers.length > 0;
      return {
        kind: "facility" as const,
        inputHash,
        engineVersion: result.engineVersion ?? PLANT_ENGINE_VERSION,
        result,
        schedule: buildSchedule(result.plant),
        // The installed plant re-rated at the design conditions, standby units excluded.
        installed: hasInstalled ? rerateInstalled(model) : null,
      };
    }
    // Already validated above: compute from the parsed input without validating again.
    const result = ledgerFromContext(contextFromParsed(parsed.data as z.output<typeof ledgerInputSchema>));
    return { kind: "ledger" as const, inputHash, engineVersion: result.engineVersion, result };
  } catch (e) {
    const err = e as Error & { field?: string; issues?: CalcIssue[] };
    if (e instanceof CalcError) throw e;
    throw new CalcError(err.message, "calculation", err.issues ?? [{ field: err.field ?? "(model)", message: err.message }]);
  }
}
