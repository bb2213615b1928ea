import { z } from "zod";
import { route } from "@/lib/api";
import { AppError } from "@/lib/errors";
import { evaluateQuery, fluidIdSchema, loadFluid, stateQuerySchema, ThermoRangeError } from "@/lib/engine/thermo";

/**
 * GET /api/v1/fluids/{id}/state?by=PT&pPa=…&tK=… (also by=PH|PS|satT|satP). SI, IIR reference.
 * Out-of-range inputs answer 400 naming the field and the allowed range.
 */
export const GET = route({
  public: true,
  params: z.object({ id: fluidIdSchema }),
  query: stateQuerySchema,
  handler: async ({ params, query }) => {
    const fluid = await loadFluid(params.id);
    try {
      return { fluid: params.id, query, ...evaluateQuery(fluid, query), range: fluid.range };
    } catch (e) {
      if (e instanceof ThermoRangeError) {
        const a = e.allowed;
        throw new AppError("validation", e.message, e.field, [{ field: e.field, message: `${e.message} (allowed ${a.min ?? "−∞"} to ${a.max ?? "∞"} ${a.unit})` }]);
      }
      throw e;
    }
  },
});
