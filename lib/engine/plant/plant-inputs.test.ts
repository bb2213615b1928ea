/**
 * Plant inputs a designer enters that must compute (issue 10 §2): a cascade with a real
 * approach and high-stage superheat, the R744 high-side pressure (set point, optimiser
 * bounds, subcritical switch-over) and a high-lift single-stage ammonia cycle. Each check
 * names its outside source beside it; values "from memory" are marked so.
 */
import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import fc from "fast-check";
import { loadFluid } from "../thermo";
import type { Fluid } from "../thermo/types";
import { computeFacility, facilityModelSchema, type FacilityModel } from "../model";
import { lowestHighSidePa, singleStageCycle, transcriticalCycle, type CycleSpec } from "./cycle";
import { PlantError } from "./errors";
import type { CompressorInput } from "./schema";

const K0 = 273.15;
const root = path.resolve(__dirname, "../../..");
const ledger = JSON.parse(readFileSync(path.join(root, "seeds/data/example-facility.json"), "utf8"));
const plantFixture = JSON.parse(readFileSync(path.join(__dirname, "fixtures/harrowfield-plant.json"), "utf8"));

let nh3: Fluid;
let co2: Fluid;
let r134a: Fluid;
beforeAll(async () => {
  [nh3, co2, r134a] = await Promise.all([loadFluid("R717"), loadFluid("R744"), loadFluid("R134a")]);
});

function model(plant: unknown, site: Record<string, unknown> = {}): FacilityModel {
  const { $comment, ...rest } = ledger;
  void $comment;
  return facilityModelSchema.parse({ schemaVersion: 1, ...rest, site: { ...rest.site, ...site }, plant });
}

function thrown(fn: () => unknown): PlantError {
  try {
    fn();
  } catch (e) {
    if (e instanceof PlantError) return e;
    throw e;
  }
  throw new Error("expected a PlantError");
}

const ideal: CompressorInput = { type: "reciprocating", isentropic: 1, volumetric: 1, motorEfficiency: 0.93, units: 1, standbyUnits: 0 };

/**
 * The natural cascade: CO2 low stage for the freezers condensing at −5 °C in the exchanger,
 * 5 K approach, an ammonia high stage serving only the exchanger with 5 K superheat and the
 * compressor beside the exchanger (no suction-line allowance); the chilled rooms on an
 * ammonia circuit of their own. Before the exchanger was taken at the low stage's stream
 * temperatures this refused with a second-law violation in the high-stage evaporator.
 */
function cascadePlant() {
  const p = structuredClone(plantFixture);
  for (const e of p.evaporators) if (e.circuitId === "mt") e.circuitId = "chill";
  p.circuits = [
    { id: "lt", tag: "C-1", refrigerant: "R744", compressor: { type: "reciprocating" }, heatRejection: { to: "circuit", circuitId: "hs", condensingC: -5, approachK: 5 } },
    { id: "hs", tag: "C-2", refrigerant: "R717", compressor: { type: "reciprocating" }, superheatK: 5, suctionLineAllowanceK: 0, heatRejection: { to: "condenser", condenserId: "cd1" } },
    { id: "chill", tag: "C-3", refrigerant: "R717", compressor: { type: "screw" }, heatRejection: { to: "condenser", condenserId: "cd1" } },
  ];
  return p;
}

describe("cascade exchanger: the low stage's stream as the high stage's heat source", () => {
  it("computes the cascade a designer enters (5 K approach, 5 K high-stage superheat)", () => {
    const res = computeFacility(model(cascadePlant()));
    const lt = res.plant.circuits.find((c) => c.id === "lt")!;
    const hs = res.plant.circuits.find((c) => c.id === "hs")!;
    // The high stage evaporates at −5 − 5 = −10 °C and leaves the exchanger superheated to
    // −5 °C: above the −10 °C a reservoir at its evaporating temperature would stand at, not
    // above the low stage's stream (condensing at −5 °C, desuperheating from its discharge).
    expect(hs.suctionC).toBe(-10);
    expect(hs.superheatK).toBe(5);
    const gen = hs.entropyGeneration.byComponentW_K;
    expect(gen.cascadeExchanger!).toBeGreaterThan(0);
    for (const c of [lt, hs]) for (const v of Object.values(c.entropyGeneration.byComponentW_K)) expect(v).toBeGreaterThanOrEqual(0);
    // The low stage's stream leaves through the exchanger at its own mean temperature: its
    // desuperheating from the discharge lifts Δh/Δs above the −5 °C condensing temperature.
    expect(lt.entropySinkC).toBeGreaterThan(-5);
    expect(lt.entropySinkC).toBeLessThan(lt.dischargeTempC);
    // … and its condenser term is then the oil-free stream measured against itself: zero.
    expect(Math.abs(lt.entropyGeneration.byComponentW_K.condenser!)).toBeLessThan(1e-9 * lt.heatRejectedW);
    // The exchanger's generation is the two streams' entropy changes, counted once:
    // ṁ_L·(s_liquid − s_discharge) + (high stage's share of its refrigerant's gain).
    const lp = new Map(lt.statePoints.map((s) => [s.id, s]));
    const hp = new Map(hs.statePoints.map((s) => [s.id, s]));
    const lowStream = lt.massFlowKgS * (lp.get("3")!.sJkgK - lp.get("2")!.sJkgK);
    const highStream = hs.massFlowKgS * (hp.get("1")!.sJkgK - hp.get("4")!.sJkgK);
    expect(gen.cascadeExchanger!).toBeCloseTo(lowStream + highStream, 6);
  });

  it("closes the chain by the Gouy–Stodola theorem: T0·ΣS_gen = W − W_rev", () => {
    // Gouy–Stodola (Bejan, "Advanced Engineering Thermodynamics", ch. 3; Kotas, "The Exergy
    // Method of Thermal Plant Analysis"): the work lost to irreversibility is T0·S_gen, where
    // W_rev = Σ Q_room·(T0/T_room − 1) is the least work to lift the rooms' heat to the sink T0.
    const res = computeFacility(model(cascadePlant()));
    const sys = res.plant.systems.find((s) => s.circuitId === "hs")!;
    const members = res.plant.circuits.filter((c) => sys.circuitIds.includes(c.id));
    const t0 = members.find((c) => c.id === "hs")!.sinkC + K0;
    let sgen = 0;
    let wRev = 0;
    for (const c of members) {
      sgen += Object.values(c.entropyGeneration.byComponentW_K).reduce((a, b) => a + b, 0);
      wRev += t0 * c.roomEntropyW_K - c.evaporatorRoomDutyW;
    }
    expect(Math.abs(t0 * sgen - (sys.workW - wRev)) / sys.workW).toBeLessThan(2e-3);
    expect(Math.abs(sgen - sys.clausiusW_K) / sys.clausiusW_K).toBeLessThan(1e-6);
  });

  it("takes the mean temperature Δh/Δs of the low stage's stream from the textbook cascade", () => {
    // Çengel & Boles, "Thermodynamics: An Engineering Approach", the two-stage (cascade)
    // R-134a example, lower cycle 0.14 → 0.32 MPa, ideal (from memory, its R-134a tables):
    // discharge h6 = 255.93 kJ/kg at s = s_g(0.14 MPa) = 0.94456 kJ/(kg·K), saturated liquid at
    // 0.32 MPa h7 = 55.16 kJ/kg, s7 = 0.21637 kJ/(kg·K) → T_m = Δh/Δs = 200.77/0.72819 = 275.71 K,
    // 0.1 K above the 2.46 °C saturation temperature at 0.32 MPa.
    const tE = r134a.saturationAtP(0.14e6).vapour.tK;
    const tC = r134a.saturationAtP(0.32e6).vapour.tK;
    const spec: CycleSpec = {
      fluid: r134a,
      convention: "dew",
      evaporatingK: tE,
      condensingK: tC,
      superheatK: 0,
      subcoolingK: 0,
      compressor: ideal,
      loadW: 7180,
      coldReservoirs: [{ heatW: 7180, tK: tE + 5 }],
      sinkK: tC,
      sinkAtStreamMeanT: true,
    };
    const low = singleStageCycle(spec);
    expect(Math.abs(low.sinkK - 275.71)).toBeLessThan(0.15);
    expect(low.sinkK).toBeGreaterThan(tC);
    // The upper cycle (0.32 → 0.8 MPa) evaporating in the exchanger with no approach takes
    // that stream as its source: its exchanger generation is positive (the desuperheating)
    // and small against Q/T.
    const q = low.condenserHeatW;
    const up = singleStageCycle({
      ...spec,
      sinkAtStreamMeanT: false,
      evaporatingK: tC,
      condensingK: r134a.saturationAtP(0.8e6).vapour.tK,
      loadW: q,
      coldReservoirs: [{ heatW: q, tK: low.sinkK, kind: "cascade" }],
      sinkK: 25 + K0,
    });
    expect(up.entropyW_K.cascadeExchanger!).toBeGreaterThan(0);
    expect(up.entropyW_K.cascadeExchanger!).toBeLessThan(0.002 * (q / tC));
    expect(up.entropyW_K.evaporator).toBeUndefined();
  });

  it("either closes both laws over the chain or names an input, over random cascade entries", () => {
    const arb = fc.record({
      approachK: fc.double({ min: 1, max: 15, noNaN: true }),
      superheatK: fc.double({ min: 0, max: 40, noNaN: true }),
      allowanceK: fc.double({ min: 0, max: 3, noNaN: true }),
      subcoolingK: fc.double({ min: 0, max: 10, noNaN: true }),
      condensingC: fc.double({ min: -20, max: 5, noNaN: true }),
      screw: fc.boolean(),
    });
    let computed = 0;
    fc.assert(
      fc.property(arb, (a) => {
        const p = cascadePlant();
        Object.assign(p.circuits[0].heatRejection, { approachK: a.approachK, condensingC: a.condensingC });
        p.circuits[0].subcoolingK = a.subcoolingK;
        if (a.screw) p.circuits[0].compressor = { type: "screw" };
        Object.assign(p.circuits[1], { superheatK: a.superheatK, suctionLineAllowanceK: a.allowanceK });
        let res;
        try {
          res = computeFacility(model(p));
        } catch (e) {
          expect(e).toBeInstanceOf(PlantError);
          expect((e as PlantError).field).toMatch(/^plant\.(circuits|evaporators)\.\d+\./);
          return;
        }
        const sys = res.plant.systems.find((x) => x.circuitId === "hs")!;
        for (const c of res.plant.circuits) for (const v of Object.values(c.entropyGeneration.byComponentW_K)) expect(v).toBeGreaterThanOrEqual(-1e-9 * c.heatRejectedW);
        expect(Math.abs(sys.entropyGenerationW_K - sys.clausiusW_K) / sys.clausiusW_K).toBeLessThan(1e-6);
        expect(sys.cop).toBeLessThan(sys.copCarnot!);
        computed++;
      }),
      { seed: 11, numRuns: 30 },
    );
    // Most of these entries are ordinary designs: they must compute, not fail.
    expect(computed).toBeGreaterThan(20);
  });

  it("names the approach when a cascade exchanger would run heat uphill", () => {
    // 1 K approach; the low stage's gas held at 30 °C by its oil cooler and its liquid
    // subcooled 30 K, so its stream's mean temperature falls below −5 °C; the high stage
    // superheats 40 K, lifting its own mean above that: heat would flow from cold to hot.
    const p = cascadePlant();
    p.circuits[0].heatRejection.approachK = 1;
    p.circuits[0].subcoolingK = 30;
    p.circuits[0].compressor = { type: "screw", oilCooledDischargeC: 30 };
    p.circuits[1].superheatK = 40;
    const e = thrown(() => computeFacility(model(p)));
    expect(e.code).toBe("SECOND_LAW_VIOLATION");
    expect(e.message).toMatch(/cascadeExchanger/);
    expect(e.field).toBe("plant.circuits.0.heatRejection.approachK");
  });
});

describe("transcritical R744: high-side pressure", () => {
  const reciprocating: CompressorInput = { type: "reciprocating", isentropic: 0.7, motorEfficiency: 0.93, units: 1, standbyUnits: 0 };
  const co2Spec = (outC: number, over: Partial<CycleSpec> = {}): CycleSpec => ({
    fluid: co2,
    convention: "dew",
    evaporatingK: -10 + K0,
    condensingK: outC + K0,
    superheatK: 0,
    subcoolingK: 0,
    compressor: reciprocating,
    loadW: 100_000,
    coldReservoirs: [{ heatW: 100_000, tK: K0 }],
    sinkK: outC - 3 + K0,
    switchOverK: 20 + K0,
    ...over,
  });
  const copOf = (r: { loadW: number; shaftPowerW: number }) => r.loadW / r.shaftPowerW;

  it("finds the optimum below the old 1.02·p_crit bound when the gas-cooler outlet is under the critical temperature", () => {
    // Liao, Zhao & Jakobsen (2000): p_opt = (2.778 − 0.0157·t_e)·t_gc + (0.381·t_e − 9.34) bar
    // (from memory): t_e = −10 °C, t_gc = 28 °C → 69.0 bar, below 1.02 × 73.77 = 75.2 bar (CO2
    // critical pressure, Span & Wagner 1996), where the old search began.
    const liaoBar = (2.778 + 0.0157 * 10) * 28 + (0.381 * -10 - 9.34);
    const oldBound = 1.02 * co2.meta.criticalPressurePa;
    expect(liaoBar * 1e5).toBeLessThan(oldBound);
    const r = transcriticalCycle(co2Spec(28));
    expect(r.arrangement).toBe("transcritical");
    expect(r.highSide?.mode).toBe("optimised");
    expect(r.condensingPa).toBeLessThan(oldBound);
    expect(Math.abs(r.condensingPa / 1e5 - liaoBar) / liaoBar).toBeLessThan(0.03);
    // The search starts just above the saturation pressure at 28 °C (68.9 bar; Span & Wagner).
    expect(r.highSide!.searchFromPa! / 1e5).toBeCloseTo(co2.saturationAtT(28 + K0, "dew").pDewPa / 1e5, 0);
    // The optimum beats the old bound's best by more than 2 % in COP …
    const atOld = transcriticalCycle(co2Spec(28, { highSidePa: oldBound }));
    expect(copOf(r)).toBeGreaterThan(1.02 * copOf(atOld));
    // … and is the maximum of a fine scan from the lowest sensible pressure.
    const lowest = lowestHighSidePa(co2, 28 + K0);
    for (let p = lowest; p < 9e6; p += 0.5e5) expect(copOf(transcriticalCycle(co2Spec(28, { highSidePa: p })))).toBeLessThanOrEqual(copOf(r) * (1 + 1e-6));
  });

  it("still agrees with the correlation above the critical temperature", () => {
    // Liao et al. (2000), as above (from memory): 35 °C → 89.6 bar, 40 °C → 104.3 bar.
    for (const [t, bar] of [
      [35, 89.6],
      [40, 104.3],
    ]) {
      const r = transcriticalCycle(co2Spec(t));
      expect(Math.abs(r.condensingPa / 1e5 - bar) / bar).toBeLessThan(0.03);
      expect(r.highSide!.searchFromPa).toBe(co2.meta.criticalPressurePa);
    }
  });

  it("runs at the set point of the high-pressure control and refuses one below the lowest sensible pressure", () => {
    const r = transcriticalCycle(co2Spec(35, { highSidePa: 9.5e6 }));
    expect(r.condensingPa).toBe(9.5e6);
    expect(r.highSide?.mode).toBe("set");
    // At 35 °C (above the 30.98 °C critical temperature) the lowest sensible pressure is the
    // critical pressure 73.77 bar (Span & Wagner 1996).
    const e = thrown(() => transcriticalCycle(co2Spec(35, { highSidePa: 7e6 })));
    expect(e.code).toBe("INPUT_OUT_OF_RANGE");
    expect(e.field).toBe("highSidePa");
    expect(e.allowed!.min).toBe(co2.meta.criticalPressurePa);
  });

  it("never leaves a better pressure unsearched, over random outlets and evaporating temperatures", () => {
    fc.assert(
      fc.property(fc.double({ min: 26.5, max: 45, noNaN: true }), fc.double({ min: -35, max: 0, noNaN: true }), (outC, evapC) => {
        const s = co2Spec(outC, { evaporatingK: evapC + K0, switchOverK: 26 + K0 });
        const best = copOf(transcriticalCycle(s));
        const lowest = lowestHighSidePa(co2, outC + K0);
        for (let i = 0; i <= 12; i++) {
          const p = lowest + ((14e6 - lowest) * i) / 12;
          let at: number;
          try {
            at = copOf(transcriticalCycle({ ...s, highSidePa: p }));
          } catch (e) {
            // A set point too low for any refrigerating effect is refused, naming the set point.
            expect(e).toBeInstanceOf(PlantError);
            expect((e as PlantError).field).toBe("highSidePa");
            continue;
          }
          expect(at).toBeLessThanOrEqual(best * (1 + 1e-6));
        }
      }),
      { seed: 7, numRuns: 25 },
    );
  });

  function co2Plant(over: Record<string, unknown> = {}) {
    const p = structuredClone(plantFixture);
    p.circuits[1] = { id: "mt", tag: "C-2", refrigerant: "R744", arrangement: "transcritical", compressor: { type: "reciprocating" }, heatRejection: { to: "condenser", condenserId: "gc" }, ...over };
    p.condensers.push({ id: "gc", tag: "GC-1", type: "air-cooled" });
    return p;
  }

  it("takes the set point from the circuit and names the field when it is out of range", () => {
    // 32 °C dry bulb + 3 K gas-cooler approach = 35 °C outlet.
    const res = computeFacility(model(co2Plant({ highSidePa: 10e6 })));
    const mt = res.plant.circuits.find((c) => c.id === "mt")!;
    expect(mt.gasCoolerPa).toBe(10e6);
    expect(mt.r744!.highSide).toBe("set");
    const e = thrown(() => computeFacility(model(co2Plant({ highSidePa: 6e6 }))));
    expect(e.field).toBe("plant.circuits.1.highSidePa");
    expect(e.message).toMatch(/73\.8…140 bar\(a\)/);
    const bad = facilityModelSchema.safeParse({ schemaVersion: 1, ...ledger, plant: co2Plant({ highSidePa: 20e6 }) });
    expect(bad.success).toBe(false);
    const issue = bad.error!.issues.find((i) => i.path.join(".") === "plant.circuits.1.highSidePa");
    expect(issue?.message ?? JSON.stringify(bad.error!.issues)).toMatch(/50–140 bar\(a\)/);
    // "optimise" is the explicit form of the default.
    const opt = computeFacility(model(co2Plant({ highSidePa: "optimise" }))).plant.circuits.find((c) => c.id === "mt")!;
    expect(opt.r744!.highSide).toBe("optimised");
  });

  it("condenses with a receiver at a low ambient and shows the switch-over", () => {
    // 18 °C dry bulb + 3 K = 21 °C outlet, below the default switch-over of critical − 5 K =
    // 25.98 °C (critical temperature 30.98 °C, Span & Wagner 1996): subcritical.
    const res = computeFacility(model(co2Plant(), { designDryBulbC: 18, coincidentWetBulbC: 14 }));
    const mt = res.plant.circuits.find((c) => c.id === "mt")!;
    expect(mt.cycle).toBe("subcritical-r744");
    expect(mt.r744!.mode).toBe("subcritical");
    expect(mt.r744!.switchOverC).toBeCloseTo(25.98, 2);
    expect(mt.r744!.switchOverSinkC).toBeCloseTo(22.98, 2);
    // Condensing at 21 °C: saturation pressure 58.7 bar (Span & Wagner 1996 tables, from memory).
    expect(Math.abs(mt.statePoints.find((s) => s.id === "2")!.pPa / 1e5 - 58.7)).toBeLessThan(0.3);
    const w = res.plant.warnings.find((x) => x.ref.id === "mt" && x.code === "SUBCRITICAL_OPERATION");
    expect(w?.message).toMatch(/receiver/);
    expect(w?.message).toMatch(/22\.98|23\.0/);
    // A switch-over set at 20 °C keeps the same day transcritical, searched from just under
    // the critical pressure (saturation at 21 °C).
    const res2 = computeFacility(model(co2Plant({ switchOverC: 20 }), { designDryBulbC: 18, coincidentWetBulbC: 14 }));
    const mt2 = res2.plant.circuits.find((c) => c.id === "mt")!;
    expect(mt2.cycle).toBe("transcritical");
    expect(mt2.r744!.searchFromPa!).toBeLessThan(co2.meta.criticalPressurePa);
    expect(mt2.gasCoolerPa!).toBeGreaterThanOrEqual(mt2.r744!.searchFromPa!);
    expect(res2.plant.warnings.find((x) => x.ref.id === "mt" && x.code === "TRANSCRITICAL_OPERATION")!.message).toMatch(/ambient at or below 17\.0 °C/);
  });
});

describe("high lift: single-stage ammonia far past what a compressor allows", () => {
  it("keeps the ideal-gas heat capacity of the extended range near the published one", () => {
    // NIST Chemistry WebBook, ammonia gas, Shomate equation 298–1400 K (from memory): A 19.99563,
    // B 49.77119, C −15.37599, D 1.921168, E 0.189174; Cp = A + B·t + C·t² + D·t³ + E/t², t = T/1000.
    // The 1993 equation of state's ideal part drifts from it towards its 700 K limit: 0.5 % at
    // 500 K, 2 % at 600 K, 4 % at 700 K are asked (the README states it).
    const shomate = (tK: number) => {
      const t = tK / 1000;
      return 19.99563 + 49.77119 * t - 15.37599 * t * t + 1.921168 * t ** 3 + 0.189174 / (t * t);
    };
    for (const [tK, tol] of [
      [300, 0.005],
      [500, 0.005],
      [600, 0.02],
      [700, 0.04],
    ]) {
      const cp = nh3.statePT(100, tK).cpJkgK! * nh3.meta.molarMassKgMol;
      expect(Math.abs(cp - shomate(tK)) / shomate(tK)).toBeLessThan(tol);
    }
  });

  it("computes a discharge beyond 250 °C and says what a designer needs", () => {
    // Frozen store −25 °C, TD 6 K → −31 °C, suction −32 °C; air-cooled
    // 32 °C + 12 K = 44 °C; one reciprocating stage.
    const p = structuredClone(plantFixture);
    p.evaporators = [{ id: "ev", tag: "EV-9", roomId: "frozen-store", circuitId: "one", tdK: 6, feed: { type: "dx", superheatK: 6 } }];
    p.circuits = [{ id: "one", tag: "C-9", refrigerant: "R717", compressor: { type: "reciprocating" }, heatRejection: { to: "condenser", condenserId: "ac" } }];
    p.condensers = [{ id: "ac", tag: "CD-9", type: "air-cooled" }];
    const res = computeFacility(model(p, {}));
    const c = res.plant.circuits[0];
    expect(c.suctionC).toBe(-32);
    expect(c.dischargeTempC).toBeGreaterThan(250);
    expect(c.energyBalance.relativeError).toBeLessThan(1e-3);
    expect(c.cop).toBeLessThan(c.copCarnot!);
    const w = res.plant.warnings.find((x) => x.code === "DISCHARGE_TEMP_EXTREME")!;
    expect(w.severity).toBe("warning");
    expect(w.message).toMatch(/far above what any compressor and its oil allow/);
    expect(w.message).toMatch(/150 °C/);
    expect(w.message).toMatch(/two-stage compression with an intercooler/);
    // The same rooms on two stages bring the discharge back under the oil's limit.
    p.circuits[0].arrangement = "two-stage";
    const two = computeFacility(model(p, {})).plant;
    expect(two.circuits[0].dischargeTempC).toBeLessThan(150);
    expect(two.warnings.some((x) => x.code === "DISCHARGE_TEMP_EXTREME")).toBe(false);
  });
});
