import { z } from "zod";
import { route } from "@/lib/api";
import { fluidIdSchema, loadFluid, phChart } from "@/lib/engine/thermo";

/** Pressure–enthalpy chart data (saturation dome, isotherms, isentropes) for one fluid. */
export const GET = route({
  public: true,
  params: z.object({ id: fluidIdSchema }),
  handler: async ({ params }) => ({ fluid: params.id, chart: phChart(await loadFluid(params.id)) }),
});
