import { beforeAll, describe, expect, it } from "vitest";
import { computeFacility, facilityModelSchema, type FacilityModel, type FacilityModelRaw } from "../model";
import { loadFluid } from "../thermo";
import { runAnnual, sineDayYear, type WeatherYear } from ".";

/**
 * The bin method (ASHRAE Handbook—Fundamentals, chapter "Energy Estimating and Modeling
 * Methods", the bin method): the year's hours grouped in 1 K dry-bulb bins; for each bin the
 * load at the bin's mean temperature, the plant's input at the bin's condensing temperature
 * and part load, times the hours in the bin. Worked here by hand for one freezer room (five
 * outside surfaces with the sun allowance, a heated slab, lights, evaporator fans and
 * defrost) on one single-stage ammonia circuit with an air-cooled condenser, on/off
 * compressor with C_d = 0.25 (the AHRI 210/240 part-load-factor form). Only the cycle itself
 * — shaft work and swept volume per W at the bin's condensing temperature — comes from the
 * plant engine (`computeFacility` at a site whose design dry bulb gives that condensing
 * temperature); the loads, capacity, part load and fans are written out below.
 */
const RAW: FacilityModelRaw = {
  schemaVersion: 1,
  site: { designDryBulbC: 30, designRH: 40, groundTempC: 10, elevationM: 0 },
  rooms: [
    {
      id: "fz",
      name: "Freezer",
      kind: "storage",
      lengthM: 20,
      widthM: 10,
      heightM: 6,
      setPointC: -20,
      rhPct: 90,
      surfaces: [
        { kind: "wall", orientation: "N", along: "length", otherSide: "outdoors", uValueWm2K: 0.15 },
        { kind: "wall", orientation: "S", along: "length", otherSide: "outdoors", uValueWm2K: 0.15 },
        { kind: "wall", orientation: "E", along: "width", otherSide: "outdoors", uValueWm2K: 0.15 },
        { kind: "wall", orientation: "W", along: "width", otherSide: "outdoors", uValueWm2K: 0.15 },
        { kind: "roof", otherSide: "outdoors", uValueWm2K: 0.12 },
        { kind: "floor", otherSide: "heatedSlab", uValueWm2K: 0.2 },
      ],
      lights: { powerW: 1000, hoursPerDay: 24 },
    },
  ],
  doors: [],
  plant: {
    evaporators: [{ id: "e1", tag: "EV-1", roomId: "fz", circuitId: "c1" }],
    circuits: [{ id: "c1", tag: "C-1", refrigerant: "R717", compressor: { type: "reciprocating" }, heatRejection: { to: "condenser", condenserId: "cd" } }],
    condensers: [{ id: "cd", tag: "CD-1", type: "air-cooled" }],
  },
  operation: { circuits: { c1: { capacityControl: { type: "onoff", cyclingLossCd: 0.25 }, condenserFanControl: "proportional", minCondensingC: 20 } } },
};

const CLIMATE = {
  label: "bin-test climate (invented)",
  meanDryBulbC: [0, 1, 5, 9, 14, 18, 21, 20, 16, 11, 5, 1],
  dailyRangeK: [6, 7, 9, 10, 12, 12, 13, 12, 10, 8, 6, 6],
  meanRhPct: [85, 82, 78, 74, 70, 68, 66, 68, 74, 80, 85, 87],
};

beforeAll(async () => {
  await loadFluid("R717");
});

function binsOf(w: WeatherYear): Map<number, { hours: number; meanC: number }> {
  const bins = new Map<number, { hours: number; sum: number }>();
  for (const t of w.dryBulbC) {
    const b = Math.floor(t);
    const x = bins.get(b) ?? { hours: 0, sum: 0 };
    x.hours++;
    x.sum += t;
    bins.set(b, x);
  }
  return new Map([...bins].map(([b, x]) => [b, { hours: x.hours, meanC: x.sum / x.hours }]));
}

/** The bin calculation by hand (see the file comment); kWh a year. */
function binMethodKWh(model: FacilityModel, w: WeatherYear): number {
  const design = computeFacility(model);
  const ev = design.plant.evaporators[0];
  const c = design.plant.circuits[0];
  const sweptDesign = c.stages[0].sweptVolumeM3s;
  // Constant parts of the room load, W: heated slab, lights, fans, defrost heat in the room.
  const fansW = (ev.fanPowerW * ev.fanHoursPerDay) / 24;
  const defrostRoomW = (ev.defrost.heaterW * (ev.defrost.minutesPerDefrost / 60) * ev.defrost.defrostsPerDay * ev.defrost.fractionToRoom) / 24;
  const constantW = 0.2 * 200 * (10 - -20) + 1000 + fansW + defrostRoomW;
  // Outside surfaces: U·A and the sun allowance (medium colour: S +3 K, E/W +4 K, roof +9 K).
  const outside: [number, number][] = [
    [0.15 * 120, 0],
    [0.15 * 120, 3],
    [0.15 * 60, 4],
    [0.15 * 60, 4],
    [0.12 * 200, 9],
  ];
  let kWh = 0;
  for (const { hours, meanC } of binsOf(w).values()) {
    const q = constantW + outside.reduce((s, [ua, sol]) => s + ua * (meanC + sol - -20), 0);
    const tc = Math.max(meanC + 12, 20);
    const at = computeFacility(facilityModelSchema.parse({ ...RAW, site: { ...RAW.site, designDryBulbC: tc - 12 } })).plant.circuits[0];
    const shaftPerW = at.shaftPowerW / at.refrigerationW;
    const capW = sweptDesign / (at.stages[0].sweptVolumeM3s / at.refrigerationW);
    const plr = q / capW;
    const plf = 1 - 0.25 * (1 - plr);
    const shaftW = (q * shaftPerW) / plf;
    // Fans proportional to the airflow needed: heat rejected ÷ design, × design approach ÷ the
    // hour's condensing − air difference (more than the approach when held at the minimum).
    const condFanW = ((c.condenserFanW * (q + shaftW)) / c.heatRejectedW) * (12 / (tc - meanC));
    kWh += (hours * (shaftW / c.compressor.motorEfficiency + condFanW)) / 1000;
  }
  kWh += (8760 * (ev.fanPowerW * ev.fanHoursPerDay + ev.defrost.electricW * (ev.defrost.minutesPerDefrost / 60) * ev.defrost.defrostsPerDay)) / 24 / 1000;
  return kWh;
}

describe("bin method (ASHRAE Handbook—Fundamentals, energy estimating: bin method) against the hourly engine", () => {
  const model = facilityModelSchema.parse(RAW);
  const year = sineDayYear(CLIMATE, 2025);
  it("on the same bins (each hour at its bin's mean temperature): within 1 % — in fact to the table's interpolation", () => {
    const bins = binsOf(year);
    const binned: WeatherYear = { ...year, dryBulbC: year.dryBulbC.map((t) => bins.get(Math.floor(t))!.meanC) };
    const byHand = binMethodKWh(model, year);
    const hourly = runAnnual(model, binned).facility.kWh;
    expect(Math.abs(hourly / byHand - 1)).toBeLessThan(1e-4);
  });
  it("on the real hours: within 1 %", () => {
    const byHand = binMethodKWh(model, year);
    const hourly = runAnnual(model, year).facility.kWh;
    expect(Math.abs(hourly / byHand - 1)).toBeLessThan(0.01);
  });
});
