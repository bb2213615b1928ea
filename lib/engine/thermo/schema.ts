/**
 * Input contract for state queries (the fluids API and any other caller that receives a
 * state request from outside): which fluid, and which pair of properties fixes the state.
 * SI units; `z.coerce` so that URL query strings parse. Range checks beyond "a finite,
 * positive number" stay with the fluid model, which throws ThermoRangeError naming the field
 * and the allowed range.
 */
import { z } from "zod";
import type { Fluid, FluidId, SaturationState, State } from "./types";

/** Every fluid id the engine knows, pure fluids first: the one list the schemas and registry use. */
export const FLUID_IDS = [
  "R717",
  "R744",
  "R134a",
  "R290",
  "R1234zeE",
  "R404A",
  "R507A",
  "R448A",
  "R449A",
  "R513A",
  "R454C",
  "R455A",
] as const satisfies readonly FluidId[];

export const fluidIdSchema = z.enum(FLUID_IDS);

const finite = z.coerce.number().refine(Number.isFinite, "must be a finite number");
const positive = finite.refine((x) => x > 0, "must be greater than 0");

/** One state query; `by` names the independent pair. */
export const stateQuerySchema = z.discriminatedUnion("by", [
  z.object({ by: z.literal("PT"), pPa: positive, tK: positive }),
  z.object({ by: z.literal("PH"), pPa: positive, hJkg: finite }),
  z.object({ by: z.literal("PS"), pPa: positive, sJkgK: finite }),
  z.object({
    by: z.literal("satT"),
    tK: positive,
    convention: z.enum(["dew", "bubble", "mean"]).default("dew"),
  }),
  z.object({ by: z.literal("satP"), pPa: positive }),
]);

export type StateQuery = z.infer<typeof stateQuerySchema>;

export type StateAnswer = { kind: "state"; state: State } | { kind: "saturation"; saturation: SaturationState };

/** Evaluates a parsed query on a loaded fluid (errors outside the model's range propagate). */
export function evaluateQuery(fluid: Fluid, q: StateQuery): StateAnswer {
  switch (q.by) {
    case "PT":
      return { kind: "state", state: fluid.statePT(q.pPa, q.tK) };
    case "PH":
      return { kind: "state", state: fluid.statePH(q.pPa, q.hJkg) };
    case "PS":
      return { kind: "state", state: fluid.statePS(q.pPa, q.sJkgK) };
    case "satT":
      return { kind: "saturation", saturation: fluid.saturationAtT(q.tK, q.convention) };
    case "satP":
      return { kind: "saturation", saturation: fluid.saturationAtP(q.pPa) };
  }
}
