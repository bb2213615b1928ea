import { beforeAll, describe, expect, it } from "vitest";
import { getFluid, loadFluid } from "../thermo";
import { estimateCharge, CHARGE_DEFAULTS } from "./charge";
import type { CircuitResult } from "./circuit";
import type { EvaporatorSizing } from "./evaporator";

beforeAll(async () => {
  await loadFluid("R717");
});

/** One single-stage DX ammonia circuit: 100 kW at −10 °C evaporating, condensing at +35 °C, 125 kW rejected. */
const circuit = {
  id: "c1",
  tag: "C-1",
  refrigerant: "R717",
  arrangement: "single-stage",
  tempConvention: "dew",
  evaporatorIds: ["e1"],
  pumpedEvaporatorIds: [],
  rejectsTo: { kind: "condenser", id: "cd1" },
  scheduleTags: { compressor: "CP-C-1", intercooler: "IC-C-1", separator: "LPR-C-1", cascadeHx: "CHX-C-1" },
  suctionC: -10,
  condensingC: 35,
  refrigerationW: 100_000,
  heatRejectedW: 125_000,
  dischargeTempC: 110,
} as unknown as CircuitResult;
const evaporator = { id: "e1", tag: "EV-1", roomId: "r1", circuitId: "c1", evaporatingC: -10, dutyW: 100_000, feed: { type: "dx", superheatK: 6 } } as unknown as EvaporatorSizing;

describe("refrigerant charge estimate", () => {
  it("matches a hand calculation of one circuit with the default volumes and fill fractions", () => {
    // Hand calculation. Saturated ammonia densities from the ASHRAE Handbook—Fundamentals R717
    // property table (from memory, to 4 figures): −10 °C ρL 652.1, ρV 2.39 kg/m³; +35 °C ρL 587.4,
    // ρV 10.46 kg/m³. Volumes and fills are CHARGE_DEFAULTS (common practice):
    //   evaporator 0.5 dm³/kW × 100 kW = 0.050 m³ × (0.25·652.1 + 0.75·2.39)  =  8.2409 kg
    //   condenser  0.4 dm³/kW × 125 kW = 0.050 m³ × (0.20·587.4 + 0.80·10.46) =  6.2924 kg
    //   receiver   1.0 dm³/kW × 100 kW = 0.100 m³ × (0.30·587.4 + 0.70·10.46) = 18.3542 kg
    //   liquid line 0.2 dm³/kW × 100 kW = 0.020 m³ × 587.4                     = 11.7480 kg
    //   suction line 1.0 dm³/kW × 100 kW = 0.100 m³ × 2.39                     =  0.2390 kg
    //   discharge line 0.3 dm³/kW × 125 kW = 0.0375 m³ × 10.46                 =  0.3923 kg
    //   total                                                                  = 45.2667 kg
    const est = estimateCharge([circuit], [evaporator], { getFluid });
    const c = est.circuits[0];
    expect(c.parts.map((p) => p.kind)).toEqual(["evaporator", "condenser", "receiver", "liquid-line", "suction-line", "discharge-line"]);
    const mass = Object.fromEntries(c.parts.map((p) => [p.kind, p.massKg]));
    expect(mass.evaporator).toBeCloseTo(8.2409, 1);
    expect(mass.receiver).toBeCloseTo(18.3542, 1);
    expect(mass["liquid-line"]).toBeCloseTo(11.748, 1);
    expect(Math.abs(c.chargeKg / 45.2667 - 1)).toBeLessThan(0.003);
    expect(est.totalKg).toBe(c.chargeKg);
    expect(est.byRefrigerant.R717).toBe(c.chargeKg);
    expect(c.parts.every((p) => p.volumeSource === "default" && p.basis.includes("common practice"))).toBe(true);
  });

  it("takes the user's volume and fill fraction for a part, and only for that part", () => {
    // Receiver of 0.2 m³ half full at +35 °C: 0.2 × (0.5·587.4 + 0.5·10.46) = 59.786 kg (same table).
    const base = estimateCharge([circuit], [evaporator], { getFluid });
    const est = estimateCharge([circuit], [evaporator], { getFluid, overrides: [{ id: "receiver:c1", volumeM3: 0.2, liquidFraction: 0.5 }] });
    const r = est.circuits[0].parts.find((p) => p.kind === "receiver")!;
    expect(r.volumeSource).toBe("user");
    expect(r.fractionSource).toBe("user");
    expect(Math.abs(r.massKg / 59.786 - 1)).toBeLessThan(0.003);
    const others = (e: typeof est) => e.circuits[0].parts.filter((p) => p.kind !== "receiver").map((p) => p.massKg);
    expect(others(est)).toEqual(others(base));
  });

  it("counts a pumped circuit's separator and wet return instead of a dry suction line", () => {
    const pumped = { ...circuit, pumpedEvaporatorIds: ["e1"] } as CircuitResult;
    const ev = { ...evaporator, feed: { type: "pumped", circulationRatio: 4, pumpHeadPa: 2e5, pumpEfficiency: 0.45 } } as EvaporatorSizing;
    const est = estimateCharge([pumped], [ev], { getFluid });
    const kinds = est.circuits[0].parts.map((p) => p.kind);
    expect(kinds).toContain("separator");
    expect(kinds).toContain("wet-return");
    expect(kinds).not.toContain("suction-line");
    const evap = est.circuits[0].parts[0];
    expect(evap.volumeM3).toBeCloseTo((CHARGE_DEFAULTS["evaporator-pumped"].dm3PerKw * 100) / 1000, 12);
    // A pumped plant holds more than the same plant fed DX (common practice: overfeed is charge-heavy).
    expect(est.totalKg).toBeGreaterThan(estimateCharge([circuit], [evaporator], { getFluid }).totalKg);
  });
});
