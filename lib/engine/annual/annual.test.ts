import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { LoadInputError } from "../loads";
import { computeFacility, facilityModelSchema, parseFacilityModel, type FacilityModel, type FacilityModelRaw } from "../model";
import { PlantError } from "../plant/errors";
import { loadFluid } from "../thermo";
import {
  constantYear,
  parseOperation,
  runAnnual,
  sineDayYear,
  type MonthlyClimateRaw,
  type OperationInputRaw,
  type WeatherYear,
} from ".";

const root = path.resolve(__dirname, "../../..");
const demoRaw = JSON.parse(readFileSync(path.join(root, "seeds/data/harrowfield-model.json"), "utf8"));

/** The demo facility with the demo site's design conditions (given by RH so design and year use one wet-bulb rule). */
function demo(operation?: OperationInputRaw, site: Record<string, unknown> = {}): FacilityModel {
  const { $comment, ...rest } = demoRaw;
  void $comment;
  return facilityModelSchema.parse({
    ...rest,
    site: { ...rest.site, designDryBulbC: 32, designRH: 45, groundTempC: 12, elevationM: 150, ...site },
    operation,
  });
}

const CLIMATE: MonthlyClimateRaw = {
  label: "invented temperate inland site",
  meanDryBulbC: [2, 3, 6, 9, 13, 16, 19, 18, 15, 11, 6, 3],
  dailyRangeK: [6, 7, 8, 10, 11, 11, 12, 11, 10, 8, 6, 6],
  meanRhPct: [85, 82, 78, 74, 72, 70, 68, 70, 75, 80, 85, 87],
};

const shifted = (w: WeatherYear, dK: number): WeatherYear => ({ ...w, dryBulbC: w.dryBulbC.map((t) => t + dK) });

/** Part load and condenser fans reduced to the design engine's linear rules (power ∝ load at fixed temperatures). */
const LINEAR_CIRCUIT = {
  capacityControl: { type: "variable-speed" as const, minSpeed: 0.05, driveEfficiency: 1, efficiencyCurve: [[0.05, 1], [1, 1]] as [number, number][] },
  condenserFanControl: "proportional" as const,
};

beforeAll(async () => {
  await Promise.all([loadFluid("R717"), loadFluid("R744")]);
});

function thrown(fn: () => unknown): Error & { field?: string } {
  try {
    fn();
  } catch (e) {
    return e as Error & { field?: string };
  }
  throw new Error("expected an error");
}

describe("constant-weather year = hours × the design hour (the engine's own definition, compared with computeFacility)", () => {
  // "Design hour" here: the mean hour of the design day — computeFacility's ledger hourly
  // profile (with the plant's fan and defrost heat) averaged over 24 h, served by the design
  // cycle at the design condensing temperature with power proportional to load (the design
  // engine's rule). A year of constant weather equal to the site's design state, every
  // schedule multiplier 1 and that linear part-load rule must give exactly hours × that hour.
  const op: OperationInputRaw = { circuits: { lt: LINEAR_CIRCUIT, mt: LINEAR_CIRCUIT } };
  for (const hours of [8760, 8784]) {
    it(`${hours} hours`, () => {
      const m = demo(op);
      const design = computeFacility(m);
      const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
      let kW = 0;
      let loadKW = 0;
      for (const r of design.ledger.rooms) loadKW += mean(r.hourly) / 1000;
      for (const c of design.plant.circuits) {
        let avg = 0;
        for (const e of design.plant.evaporators.filter((x) => x.circuitId === c.id)) {
          const room = design.ledger.rooms.find((r) => r.roomId === e.roomId)!;
          const n = design.plant.evaporators.filter((x) => x.roomId === e.roomId).length;
          avg += mean(room.hourly) / n;
        }
        kW += (c.electricalW * avg) / c.refrigerationW / 1000;
      }
      for (const e of design.plant.evaporators)
        kW += ((e.fanPowerW * e.fanHoursPerDay) / 24 + (e.defrost.electricW * (e.defrost.minutesPerDefrost / 60) * e.defrost.defrostsPerDay) / 24) / 1000;
      const year = runAnnual(m, constantYear(32, 45, { hours }));
      expect(year.hours).toBe(hours);
      expect(year.facility.kWh / (hours * kW) - 1).toBeCloseTo(0, 9);
      expect(year.facility.loadKWh / (hours * loadKW) - 1).toBeCloseTo(0, 9);
      // Compressors alone, from the design's compressor power.
      const comp = design.plant.circuits.reduce((s, c) => s + c.compressorElectricalW / c.refrigerationW, 0);
      expect(comp).toBeGreaterThan(0);
      expect(year.facility.split.compressors).toBeGreaterThan(0);
    });
  }
});

describe("fast path (cycle table on a condensing-temperature grid) = direct computation", () => {
  it("demo facility, sine-day year with schedules: annual kWh within 0.1 %", { timeout: 180_000 }, () => {
    const weekend = Array.from({ length: 7 }, (_, d) => new Array(24).fill(d >= 5 ? 0.3 : 1.2));
    const m = demo({
      doorTraffic: { all: weekend },
      productIntake: { byWeekday: [1.2, 1.2, 1.2, 1.2, 1.2, 0.5, 0], byMonth: [0.8, 0.8, 1, 1, 1, 1.2, 1.2, 1.2, 1, 1, 0.9, 1.1] },
      lights: weekend,
      people: weekend,
    });
    const w = sineDayYear(CLIMATE, 2025);
    const fast = runAnnual(m, w);
    const direct = runAnnual(m, w, { method: "direct" });
    expect(direct.method).toBe("direct");
    expect(Math.abs(fast.facility.kWh / direct.facility.kWh - 1)).toBeLessThan(1e-3);
    for (const c of fast.circuits) {
      const d = direct.circuits.find((x) => x.circuitId === c.circuitId)!;
      expect(Math.abs(c.kWh / d.kWh - 1)).toBeLessThan(1e-3);
      expect(Math.abs(c.loadKWh / d.loadKWh - 1)).toBeLessThan(1e-6);
    }
    // The schedules reached the result: the same facility without them differs.
    const plain = runAnnual(demo(), w);
    expect(Math.abs(plain.facility.loadKWh / fast.facility.loadKWh - 1)).toBeGreaterThan(1e-3);
  });
});

describe("monotonic", () => {
  const w = sineDayYear(CLIMATE, 2025);
  it("a warmer year never uses less energy", () => {
    const m = demo();
    let last = -Infinity;
    for (const dK of [-4, 0, 3, 6]) {
      const kWh = runAnnual(m, shifted(w, dK)).facility.kWh;
      expect(kWh).toBeGreaterThanOrEqual(last);
      last = kWh;
    }
  });
  it("a higher minimum condensing temperature never uses less", () => {
    let last = -Infinity;
    for (const minC of [10, 15, 20, 25, 30]) {
      const r = runAnnual(demo({ circuits: { lt: { minCondensingC: minC }, mt: { minCondensingC: minC } } }), w);
      expect(r.facility.split.compressors).toBeGreaterThanOrEqual(last);
      last = r.facility.split.compressors;
    }
  });
  it("seasonal COP never above the seasonal Carnot COP (facility and each circuit)", () => {
    for (const dK of [-10, 0, 8]) {
      const r = runAnnual(demo(), shifted(w, dK));
      for (const f of [r.facility, ...r.circuits]) {
        expect(f.seasonalCOP).not.toBeNull();
        expect(f.seasonalCarnotCOP).not.toBeNull();
        expect(f.seasonalCOP!).toBeLessThan(f.seasonalCarnotCOP!);
        expect(f.seasonalSystemCOP!).toBeLessThan(f.seasonalCOP!);
      }
    }
  });
  it("an impossible COP is an error, never a number: a set condensing temperature below the hour's air", () => {
    const m = facilityModelSchema.parse({
      ...demo(),
      plant: { ...demo().plant, condensers: [{ id: "cd1", tag: "CD-1", type: "user-set", condensingC: 30 }] },
    });
    const hot = constantYear(20, 50);
    hot.dryBulbC[5000] = 31;
    const e = thrown(() => runAnnual(m, hot));
    expect(e).toBeInstanceOf(PlantError);
    expect((e as PlantError).code).toBe("SECOND_LAW_VIOLATION");
    expect(e.field).toBe("plant.condensers.0.condensingC");
    expect(e.message).toMatch(/Jul 28/);
  });
});

describe("results", () => {
  it("split, months, peak, benchmarks and cost add up", () => {
    const m = demo({
      tariff: { kind: "day-night", dayPricePerKWh: 0.3, nightPricePerKWh: 0.1, dayStartHour: 7, dayEndHour: 23, demandChargePerKWMonth: 10 },
    });
    const r = runAnnual(m, sineDayYear(CLIMATE, 2025));
    const f = r.facility;
    const sum = Object.values(f.split).reduce((a, b) => a + b, 0);
    expect(sum).toBeCloseTo(f.kWh, 6);
    expect(f.monthly.reduce((a, x) => a + x.kWh, 0)).toBeCloseTo(f.kWh, 6);
    expect(r.circuits.reduce((a, c) => a + c.kWh, 0)).toBeCloseTo(f.kWh, 6);
    const vol = m.rooms.reduce((a, x) => a + x.lengthM * x.widthM * x.heightM, 0);
    expect(f.kWhPerM3).toBeCloseTo(f.kWh / vol, 9);
    expect(f.kWhPerTonne).toBeGreaterThan(0);
    // The peak comes in the warm half of the year and names its hour.
    expect(f.peakHour.month).toBeGreaterThanOrEqual(5);
    expect(f.peakHour.month).toBeLessThanOrEqual(8);
    expect(f.peakHour.label).toMatch(/^[A-Z][a-z]{2} \d{1,2} \([A-Z][a-z]{2}\) \d\d:00$/);
    expect(f.peakKWe).toBeGreaterThan(sum / 8760);
    // Day and night prices: energy cost between all-night and all-day prices.
    expect(f.cost.energy).toBeGreaterThan(0.1 * f.kWh);
    expect(f.cost.energy).toBeLessThan(0.3 * f.kWh);
    expect(f.cost.demand).toBeGreaterThan(12 * 10 * (sum / 8760));
    expect(f.cost.total).toBeCloseTo(f.cost.energy + f.cost.demand, 9);
    // Condensing-temperature histogram: two circuits on the evaporative condenser, every hour counted.
    expect(f.hoursAtCondensingC.reduce((a, b) => a + b.hours, 0)).toBe(2 * 8760);
    expect(f.hoursAtCondensingC[0].fromC).toBe(20);
    expect(r.weather.label).toMatch(/approximation/);
  });
});

describe("bad input names the field and the range", () => {
  it("operation", () => {
    const e = thrown(() => parseOperation({ circuits: { mt: { minCondensingC: 80 } } }));
    expect(e).toBeInstanceOf(LoadInputError);
    expect(e.field).toBe("operation.circuits.mt.minCondensingC");
    expect(e.message).toMatch(/between -10 and 50/);
    const e2 = thrown(() => parseOperation({ lights: [[1]] }));
    expect(e2.field).toMatch(/^operation\.lights/);
    const e3 = thrown(() => parseOperation({ circuits: { nope: {} } }, demo()));
    expect(e3.field).toBe("operation.circuits.nope");
    const e4 = thrown(() => parseOperation({ tariff: { kind: "flat", pricePerKWh: -1 } }));
    expect(e4.field).toBe("operation.tariff.pricePerKWh");
    expect(e4.message).toMatch(/between 0 and 100/);
    // Through the facility document as well.
    const raw = { ...demoRaw, site: { ...demoRaw.site, designDryBulbC: 32, designRH: 45, groundTempC: 12, elevationM: 150 } } as FacilityModelRaw;
    const e5 = thrown(() => parseFacilityModel({ ...raw, operation: { defrost: { fixedShare: 2 } } }));
    expect(e5.field).toBe("operation.defrost.fixedShare");
  });
  it("a door-traffic multiplier that would hold a door open more than the hour", () => {
    const busy = Array.from({ length: 7 }, () => new Array(24).fill(10));
    const e = thrown(() => runAnnual(demo({ doorTraffic: { byDoor: { "d-fs": busy } } }), constantYear(20, 60)));
    expect(e.field).toMatch(/^operation\.doorTraffic\.byDoor\.d-fs\./);
  });
  it("weather year", () => {
    const short = constantYear(10, 50);
    short.dryBulbC = short.dryBulbC.slice(0, 8000);
    expect(thrown(() => runAnnual(demo(), short)).field).toBe("weather.dryBulbC");
    const wet = constantYear(10, 50);
    wet.rhPct[123] = 101;
    const e = thrown(() => runAnnual(demo(), wet));
    expect(e.field).toBe("weather.rhPct.123");
    expect(e.message).toMatch(/between 0 and 100/);
    const nan = constantYear(10, 50);
    nan.dryBulbC[7] = Number.NaN;
    expect(thrown(() => runAnnual(demo(), nan)).field).toBe("weather.dryBulbC.7");
  });
  it("monthly climate", () => {
    const e = thrown(() => sineDayYear({ ...CLIMATE, meanRhPct: CLIMATE.meanRhPct.map((x, i) => (i === 3 ? 120 : x)) }, 2025));
    expect(e.field).toBe("monthly.meanRhPct.3");
    expect(e.message).toMatch(/between 1 and 100/);
    expect(thrown(() => sineDayYear({ ...CLIMATE, dailyRangeK: [1, 2] }, 2025)).field).toBe("monthly.dailyRangeK");
  });
});
