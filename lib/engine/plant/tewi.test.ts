import { describe, expect, it } from "vitest";
import { codeAid, PRACTICAL_LIMITS, tewi } from "./tewi";

describe("TEWI", () => {
  it("equals the EN 378-1:2016 Annex B formula on a worked case", () => {
    // Worked by hand with TEWI = GWP·L·n + GWP·m·(1 − α) + n·E·β (EN 378-1 Annex B; formula
    // from memory). R404A, GWP 3922 (IPCC AR4), m = 100 kg, 10 %/year leakage → L = 10 kg/year,
    // n = 15 years, α = 0.7, E = 200 000 kWh/year, β = 0.4 kg CO2/kWh:
    //   leakage     3922 × 10 × 15        =   588 300 kg CO2e
    //   end of life 3922 × 100 × (1 − 0.7) =   117 660 kg CO2e
    //   indirect    15 × 200 000 × 0.4     = 1 200 000 kg CO2e
    //   total                              = 1 905 960 kg CO2e
    const r = tewi({ gwp: 3922, chargeKg: 100, leakFractionPerYear: 0.1, years: 15, recoveryFraction: 0.7, annualKWh: 200_000, gridKgCo2PerKWh: 0.4 });
    expect(r.leakageKg).toBeCloseTo(588_300, 6);
    expect(r.endOfLifeKg).toBeCloseTo(117_660, 6);
    expect(r.directKg).toBeCloseTo(705_960, 6);
    expect(r.indirectKg).toBeCloseTo(1_200_000, 6);
    expect(r.totalKg).toBeCloseTo(1_905_960, 6);
    expect(r.formula).toContain("EN 378-1");
  });

  it("gives ammonia (GWP 0) no direct part, whatever the charge", () => {
    const r = tewi({ gwp: 0, chargeKg: 5000, leakFractionPerYear: 0.05, years: 20, recoveryFraction: 0, annualKWh: 1e6, gridKgCo2PerKWh: 0.2 });
    expect(r.directKg).toBe(0);
    expect(r.totalKg).toBeCloseTo(4e6, 6);
  });
});

describe("code aid: charge per room volume", () => {
  const rooms = [
    { id: "big", name: "Store", volumeM3: 12_000, occupied: true },
    { id: "small", name: "Blast", volumeM3: 240, occupied: false },
    { id: "dock", name: "Dock", volumeM3: 2400, occupied: true },
  ];

  it("uses the smallest occupied room the circuit serves and compares with the practical limit", () => {
    // 45.27 kg / 2400 m³ = 0.018862 kg/m³; R717 practical limit 0.00035 kg/m³ (EN 378-1 Annex C, from memory).
    const a = codeAid({ circuitId: "c1", refrigerant: "R717", chargeKg: 45.27, servedRooms: rooms });
    expect(a.room?.id).toBe("dock");
    expect(a.chargePerVolumeKgM3).toBeCloseTo(45.27 / 2400, 12);
    expect(a.ratio).toBeCloseTo(45.27 / 2400 / 0.00035, 9);
    expect(a.verdict).toBe("over");
    expect(a.limit.source).toMatch(/from memory/);
  });

  it("falls back to the smallest room served when none is occupied, and says so", () => {
    const a = codeAid({ circuitId: "c1", refrigerant: "R744", chargeKg: 10, servedRooms: rooms.map((r) => ({ ...r, occupied: false })) });
    expect(a.room?.id).toBe("small");
    expect(a.verdict).toBe("within"); // 10/240 = 0.0417 < 0.1
    expect(a.note).toMatch(/no occupied room/);
  });

  it("takes the user's limit over the table's, and reports a circuit serving no room", () => {
    const a = codeAid({ circuitId: "c1", refrigerant: "R744", chargeKg: 10, servedRooms: rooms, limit: { kgPerM3: 0.001, source: "local code" } });
    expect(a.verdict).toBe("over");
    expect(a.limit.source).toBe("local code");
    expect(codeAid({ circuitId: "hs", refrigerant: "R717", chargeKg: 100, servedRooms: [] }).verdict).toBe("no-room");
    for (const v of Object.values(PRACTICAL_LIMITS)) expect(v.source.length).toBeGreaterThan(10);
  });
});
