import { route } from "@/lib/api";
import { GWP_SOURCE, listAllFluids } from "@/lib/engine/thermo";

export const GET = route({
  public: true,
  handler: async () => ({
    referenceState: "IIR: h = 200 kJ/kg and s = 1 kJ/(kg·K) for saturated liquid at 0 °C",
    gwpSource: GWP_SOURCE,
    units: { temperature: "K", pressure: "Pa (absolute)", enthalpy: "J/kg", entropy: "J/(kg·K)", density: "kg/m³" },
    fluids: await listAllFluids(),
  }),
});
