import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { calculate, CalcError } from "@/features/calculate/run";

/**
 * Stateless: a facility model (or a heat-ledger input) in, the full ledger (and plant) out.
 * Field-named validation errors (400) and calculation errors (422) name the input.
 */
export const POST = route({
  handler: async ({ req }) => {
    let raw: unknown;
    try {
      raw = await req.json();
    } catch {
      throw new AppError("validation", "The request body must be a JSON facility model.", "(body)");
    }
    try {
      return await calculate(raw);
    } catch (e) {
      if (e instanceof CalcError) {
        throw new AppError(e.kind === "validation" ? "validation" : "calculation", e.message, e.issues[0]?.field, e.issues);
      }
      throw e;
    }
  },
});
