/**
 * The blend components, imported statically (the blend module carries all seven equations:
 * R32, R125, R143a, R1234yf from their data modules; R134a, R1234ze(E), R744 from the pure
 * refrigerants' modules).
 */
import { data as r134a } from "../fluids/r134a";
import { data as r1234zeE } from "../fluids/r1234zeE";
import { data as r744 } from "../fluids/r744";
import { component as r125 } from "../fluids/r125";
import { component as r143a } from "../fluids/r143a";
import { component as r1234yf } from "../fluids/r1234yf";
import { component as r32 } from "../fluids/r32";
import type { ComponentData, ComponentId } from "./component";

function fromPure(
  id: ComponentId,
  d: typeof r134a,
  omega: number,
  paper: string,
): ComponentData {
  return {
    id,
    name: d.meta.name,
    paper,
    omega,
    criticalPressurePa: d.meta.criticalPressurePa,
    tTripleK: d.range.tMinK,
    eos: d.eos,
    ancillaries: d.ancillaries,
  };
}

/** Acentric factors (Wilson starting guesses only): the papers' values as CoolProp's files list them. */
export const COMPONENTS: Record<ComponentId, ComponentData> = {
  R32: r32,
  R125: r125,
  R143a: r143a,
  R1234yf: r1234yf,
  R134a: fromPure("R134a", r134a, 0.32684, "Tillner-Roth & Baehr (1994)"),
  R1234zeE: fromPure("R1234zeE", r1234zeE, 0.313, "Thol & Lemmon (2016)"),
  R744: fromPure("R744", r744, 0.22394, "Span & Wagner (1996)"),
};
