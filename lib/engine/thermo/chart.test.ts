import { describe, expect, it } from "vitest";
import { phChart } from "./chart";
import { loadFluid, type FluidId } from "./index";

describe("P–h chart data", () => {
  it("R134a dome passes through the published 0 °C saturation states", async () => {
    const r = await loadFluid("R134a");
    const chart = phChart(r, { pMinPa: 50e3, domePoints: 200 });
    // NIST Chemistry WebBook, R134a at 0 °C (IIR; from memory): 292.80 kPa,
    // h' = 200.00 kJ/kg, h'' = 398.60 kJ/kg. Interpolate the dome lines at that pressure.
    const at = (line: { hJkg: number; pPa: number }[], p: number) => {
      const i = line.findIndex((q) => q.pPa >= p);
      const a = line[i - 1],
        b = line[i];
      return a.hJkg + ((b.hJkg - a.hJkg) * Math.log(p / a.pPa)) / Math.log(b.pPa / a.pPa);
    };
    expect(Math.abs(at(chart.dome.liquid, 292.8e3) - 200e3)).toBeLessThan(0.01 * 200e3);
    expect(Math.abs(at(chart.dome.vapour, 292.8e3) - 398.6e3)).toBeLessThan(0.01 * 398.6e3);
    // the dome closes near the critical pressure 4.0593 MPa (Tillner-Roth & Baehr 1994)
    const top = chart.dome.liquid[chart.dome.liquid.length - 1];
    expect(Math.abs(top.pPa / 4.0593e6 - 1)).toBeLessThan(0.005);
  });

  it.each(["R717", "R744", "R290", "R1234zeE"] as FluidId[])("%s: lines are finite, ordered by pressure, isotherms flat across the dome", async (id) => {
    const f = await loadFluid(id);
    const chart = phChart(f);
    expect(chart.referenceState).toBe("IIR");
    expect(chart.dome.liquid.length).toBeGreaterThan(40);
    expect(chart.isotherms.length).toBeGreaterThan(3);
    expect(chart.isentropes.length).toBe(8);
    for (const line of [chart.dome.liquid, chart.dome.vapour, ...chart.isotherms.map((i) => i.points), ...chart.isentropes.map((i) => i.points)]) {
      for (let i = 0; i < line.length; i++) {
        expect(Number.isFinite(line[i].hJkg) && Number.isFinite(line[i].pPa)).toBe(true);
        if (i > 0) expect(line[i].pPa).toBeGreaterThanOrEqual(line[i - 1].pPa);
      }
    }
    // liquid line left of the vapour line at every pressure
    chart.dome.liquid.forEach((q, i) => expect(q.hJkg).toBeLessThan(chart.dome.vapour[i].hJkg));
    for (const iso of chart.isotherms) {
      if (iso.tK >= f.meta.criticalTempK) continue;
      const sat = f.saturationAtT(iso.tK);
      const onDome = iso.points.filter((q) => q.pPa === sat.pDewPa);
      expect(onDome.length).toBe(2);
    }
  });
});
