import { z } from "zod";
import { MODEL_MAX_BODY_BYTES, route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { calculate, CalcError } from "@/features/calculate/run";

/**
 * Stateless: a facility model (or a heat-ledger input) in, the full ledger (and plant) out.
 * Field-named validation errors (400) and calculation errors (422) name the input.
 */
export const POST = route({
  body: z.unknown(),
  maxBodyBytes: MODEL_MAX_BODY_BYTES,
  handler: async ({ body }) => {
    try {
      return await calculate(body);
    } catch (e) {
      if (e instanceof CalcError) {
        throw new AppError(e.kind === "validation" ? "validation" : "calculation", e.message, e.issues[0]?.field, e.issues);
      }
      throw e;
    }
  },
});
