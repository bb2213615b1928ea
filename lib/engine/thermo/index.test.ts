import { describe, expect, it } from "vitest";
import { FLUID_IDS, getFluid, listAllFluids, listFluids, loadAllFluids, loadFluid, type FluidId } from "./index";

describe("fluid registry", () => {
  it("lists pure-fluid metadata without loading any model", () => {
    const list = listFluids();
    const byId = new Map(list.map((m) => [m.id, m]));
    // Molar masses and critical temperatures of the reference equations of state:
    // Tillner-Roth et al. (1993) NH3 17.03026 g/mol, 405.40 K; Span & Wagner (1996) CO2
    // 44.0098 g/mol, 304.1282 K; Tillner-Roth & Baehr (1994) R134a 102.032 g/mol, 374.18 K;
    // Lemmon et al. (2009) propane 44.09562 g/mol, 369.89 K; Thol & Lemmon (2016)
    // R1234ze(E) 114.0416 g/mol, 382.513 K.
    const expected: [FluidId, number, number][] = [
      ["R717", 0.01703026, 405.4],
      ["R744", 0.0440098, 304.1282],
      ["R134a", 0.102032, 374.18],
      ["R290", 0.04409562, 369.89],
      ["R1234zeE", 0.1140416, 382.513],
    ];
    for (const [id, m, tc] of expected) {
      const meta = byId.get(id)!;
      expect(Math.abs(meta.molarMassKgMol / m - 1)).toBeLessThan(1e-6);
      expect(meta.criticalTempK).toBeCloseTo(tc, 3);
      expect(meta.zeotropic).toBe(false);
    }
    // Safety groups, ISO 817 / ASHRAE 34 (DOMAIN.md §3): R717 B2L, R744 A1, R290 A3,
    // R1234ze(E) A2L, R134a A1.
    expect(byId.get("R717")!.safetyGroup).toBe("B2L");
    expect(byId.get("R744")!.safetyGroup).toBe("A1");
    expect(byId.get("R290")!.safetyGroup).toBe("A3");
    expect(byId.get("R1234zeE")!.safetyGroup).toBe("A2L");
    expect(byId.get("R134a")!.safetyGroup).toBe("A1");
    // GWP100, IPCC AR4 as in Regulation (EU) No 517/2014 Annex I/IV: R134a 1430, CO2 1.
    expect(byId.get("R134a")!.gwp100).toBe(1430);
    expect(byId.get("R744")!.gwp100).toBe(1);
    expect(byId.get("R134a")!.gwpSource).toMatch(/AR4/);
  });

  it("getFluid throws a clear error before loadFluid, then returns the cached model", async () => {
    expect(() => getFluid("R290")).toThrow(/not loaded/);
    const f = await loadFluid("R290");
    expect(getFluid("R290")).toBe(f);
    expect(await loadFluid("R290")).toBe(f);
    // loading one fluid builds only that one
    expect(() => getFluid("R717")).toThrow(/not loaded/);
    expect(() => getFluid("R999" as FluidId)).toThrow(/Unknown fluid/);
    await expect(loadFluid("R999" as FluidId)).rejects.toThrow(/Unknown fluid/);
  });

  it("loads the blends through the mixture module and lists their metadata", { timeout: 60_000 }, async () => {
    const all = await listAllFluids();
    expect(all.map((m) => m.id).sort()).toEqual([...FLUID_IDS].sort());
    const r404a = await loadFluid("R404A");
    expect(r404a.meta.id).toBe("R404A");
    const fluids = await loadAllFluids();
    expect(fluids.map((f) => f.meta.id)).toEqual([...FLUID_IDS]);
  });
});
