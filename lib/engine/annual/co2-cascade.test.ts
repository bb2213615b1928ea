import { beforeAll, describe, expect, it } from "vitest";
import { facilityModelSchema, type FacilityModelRaw } from "../model";
import { loadFluid } from "../thermo";
import { runAnnual, sineDayYear } from ".";

/**
 * A small invented plant with the arrangements whose temperatures do not simply follow one
 * condenser: a CO2 low stage cascading into an ammonia high stage (the low stage condenses at
 * its set cascade temperature all year; the high stage carries the rooms plus the cascade
 * heat), and a CO2 transcritical circuit (subcritical when the gas-cooler outlet is at least
 * 5 K below the critical temperature, else the gas-cooler pressure chosen for the best COP).
 */
const wall = (o: "N" | "S" | "E" | "W", along: "length" | "width") => ({ kind: "wall" as const, orientation: o, along, otherSide: "outdoors" as const, uValueWm2K: 0.18 });
const room = (id: string, setPointC: number) => ({
  id,
  name: id,
  kind: "storage" as const,
  lengthM: 20,
  widthM: 12,
  heightM: 7,
  setPointC,
  rhPct: 85,
  surfaces: [wall("N", "length"), wall("S", "length"), wall("E", "width"), wall("W", "width"), { kind: "roof" as const, otherSide: "outdoors" as const, uValueWm2K: 0.15 }],
  lights: { powerW: 800, hoursPerDay: 10, startHour: 7 },
});
const RAW: FacilityModelRaw = {
  schemaVersion: 1,
  site: { designDryBulbC: 33, designRH: 40, groundTempC: 12, elevationM: 50 },
  rooms: [room("freezer", -25), room("chill", 2), room("chill-co2", 4)],
  doors: [{ id: "d1", widthM: 2.5, heightM: 3, sides: ["chill", "outdoors"], passagesPerDay: 60, protection: "stripCurtain" }],
  plant: {
    evaporators: [
      { id: "e-fz", tag: "EV-1", roomId: "freezer", circuitId: "low" },
      { id: "e-ch", tag: "EV-2", roomId: "chill", circuitId: "high" },
      { id: "e-co2", tag: "EV-3", roomId: "chill-co2", circuitId: "tc" },
    ],
    circuits: [
      { id: "low", tag: "LT", refrigerant: "R744", compressor: { type: "reciprocating" }, heatRejection: { to: "circuit", circuitId: "high", condensingC: -5, approachK: 5 } },
      { id: "high", tag: "HT", refrigerant: "R717", compressor: { type: "screw", units: 2 }, heatRejection: { to: "condenser", condenserId: "cd" } },
      { id: "tc", tag: "TC", refrigerant: "R744", arrangement: "transcritical", compressor: { type: "reciprocating" }, heatRejection: { to: "condenser", condenserId: "gc" } },
    ],
    condensers: [
      { id: "cd", tag: "CD-1", type: "air-cooled" },
      { id: "gc", tag: "GC-1", type: "air-cooled" },
    ],
  },
};
const WARM = {
  label: "warm invented site",
  meanDryBulbC: [6, 7, 10, 14, 18, 22, 25, 25, 21, 16, 11, 7],
  dailyRangeK: [7, 8, 9, 10, 12, 12, 12, 12, 11, 9, 8, 7],
  meanRhPct: [80, 78, 74, 70, 65, 60, 55, 57, 63, 70, 76, 80],
};

beforeAll(async () => {
  await Promise.all([loadFluid("R717"), loadFluid("R744")]);
});

describe("cascade and transcritical through the year", () => {
  const model = facilityModelSchema.parse(RAW);
  const year = sineDayYear(WARM, 2025);
  it("fast path = direct computation within 0.1 % for each circuit", { timeout: 300_000 }, () => {
    const fast = runAnnual(model, year);
    const direct = runAnnual(model, year, { method: "direct" });
    for (const c of fast.circuits) {
      const d = direct.circuits.find((x) => x.circuitId === c.circuitId)!;
      expect(Math.abs(c.kWh / d.kWh - 1)).toBeLessThan(1e-3);
    }
    expect(Math.abs(fast.facility.kWh / direct.facility.kWh - 1)).toBeLessThan(1e-3);
  });
  it("the low stage condenses at its cascade temperature all year; the high stage carries its heat; CO2 runs both sides of the switch-over", () => {
    const r = runAnnual(model, year);
    const low = r.circuits.find((c) => c.circuitId === "low")!;
    const high = r.circuits.find((c) => c.circuitId === "high")!;
    const tc = r.circuits.find((c) => c.circuitId === "tc")!;
    expect(low.trace.inputs.condensingC).toBe(-5);
    // The high stage's refrigeration = its own room + the low stage's rejected heat (load + work).
    const chill = r.rooms.find((x) => x.roomId === "chill")!.loadKWh;
    const lowWorkKWh = low.split.compressors * 0.93;
    expect(high.loadKWh).toBeGreaterThan(chill + low.loadKWh);
    expect(high.loadKWh).toBeCloseTo(chill + low.loadKWh + lowWorkKWh, -1);
    expect(Number(tc.trace.inputs.transcriticalHours)).toBeGreaterThan(0);
    expect(Number(tc.trace.inputs.transcriticalHours)).toBeLessThan(8760);
    // Seasonal COP below the seasonal Carnot COP for each circuit and the facility.
    for (const f of [r.facility, ...r.circuits]) expect(f.seasonalCOP!).toBeLessThan(f.seasonalCarnotCOP!);
  });
});
