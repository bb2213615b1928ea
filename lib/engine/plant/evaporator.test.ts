import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { PlantError } from "./errors";
import { defaultDefrost, defaultTdK, feedbackWhPerDayPerW, roomFeedback, sizeRoomEvaporators, solveDutyFixedPoint } from "./evaporator";
import { evaporatorSchema } from "./schema";

const freezer = { id: "f", setPointC: -25, rhPct: 80, lengthM: 60, widthM: 30 };
const ev = (over: Record<string, unknown> = {}) => evaporatorSchema.parse({ id: "e1", tag: "EV-1", roomId: "f", circuitId: "c", ...over });

describe("evaporator defaults", () => {
  it("chooses TD by humidity class", () => {
    // DOMAIN.md §2 (common practice): 4–6 K high-RH produce, 6–8 K general chilled, 5–7 K freezers.
    expect(defaultTdK(2, 95)).toBe(5);
    expect(defaultTdK(2, 87)).toBe(6);
    expect(defaultTdK(-25, 80)).toBe(6);
    expect(defaultTdK(5, 70)).toBe(7);
  });

  it("defrosts chilled rooms off-cycle and freezers with heat", () => {
    // Common practice: rooms at +2 °C and above defrost with room air; a third to a half of
    // heater energy reaches the room (DOMAIN.md §1).
    expect(defaultDefrost(4, undefined).type).toBe("off-cycle");
    const d = defaultDefrost(-25, undefined);
    expect(d.type).toBe("electric");
    expect(d.fractionToRoom).toBeGreaterThanOrEqual(1 / 3);
    expect(d.fractionToRoom).toBeLessThanOrEqual(1 / 2);
  });
});

describe("evaporator sizing", () => {
  it("estimates airflow and fan power from the coil's sensible balance", () => {
    // Hand calculation, standard-air constants (ASHRAE Fundamentals, psychrometrics: R = 287.05
    // J/(kg·K), cp = 1006 J/(kg·K)): room −25 °C → ρ = 101325/(287.05·248.15) = 1.4225 kg/m³;
    // 30 kW over an air drop of 0.6 × 6 K = 3.6 K → V = 30000/(1.4225·1006·3.6) = 5.823 m³/s;
    // fan input 5.823 × 150 Pa / 0.45 = 1941 W.
    const [s] = sizeRoomEvaporators(freezer, [ev({ tdK: 6 })], 30_000);
    expect(s.airflowM3s).toBeCloseTo(5.823, 2);
    expect(s.fanPowerW).toBeCloseTo(1941, -1);
    expect(s.evaporatingC).toBe(-31);
  });

  it("defaults the unit count from duty and room length", () => {
    // 100 kW at 40 kW per unit → 3; a 60 m room at about 25 m air throw → 3 (common practice).
    expect(sizeRoomEvaporators(freezer, [ev()], 100_000)[0].units).toBe(3);
    expect(sizeRoomEvaporators({ ...freezer, lengthM: 90 }, [ev()], 10_000)[0].units).toBe(4);
    expect(sizeRoomEvaporators(freezer, [ev({ units: 7 })], 10_000)[0].units).toBe(7);
  });

  it("folds several evaporators into the ledger's one fan and defrost entry without losing energy", () => {
    const evs = [
      ev({ id: "a", defrost: { type: "electric", minutesPerDefrost: 30, defrostsPerDay: 4, fractionToRoom: 0.5 } }),
      ev({ id: "b", defrost: { type: "hot-gas", minutesPerDefrost: 10, defrostsPerDay: 6, fractionToRoom: 0.3 } }),
    ];
    const sized = sizeRoomEvaporators(freezer, evs, 80_000);
    const fb = roomFeedback(sized);
    const ledgerWh = fb.defrost.heaterW * (fb.defrost.minutesPerDefrost / 60) * fb.defrost.defrostsPerDay * fb.defrost.fractionToRoom;
    const sumWh = sized.reduce((a, s) => a + s.defrost.heaterW * (s.defrost.minutesPerDefrost / 60) * s.defrost.defrostsPerDay * s.defrost.fractionToRoom, 0);
    expect(ledgerWh).toBeCloseTo(sumWh, 6);
    const fanWh = sized.reduce((a, s) => a + s.fanPowerW * s.fanHoursPerDay, 0);
    expect(fb.evaporatorFans.powerW * fb.evaporatorFans.hoursPerDay).toBeCloseTo(fanWh, 6);
    expect(feedbackWhPerDayPerW(freezer, evs) * 80_000).toBeCloseTo(sumWh + fanWh, 3);
  });
});

describe("fan/defrost fixed point", () => {
  const opts = { tolerance: 1e-9, maxIterations: 30, field: "rooms.0" };

  it("solves an affine feedback exactly", () => {
    // x = 1000 + 0.2·x → x = 1000/0.8 = 1250 (algebra).
    const r = solveDutyFixedPoint((x) => 1000 + 0.2 * x, opts);
    expect(r.valueW).toBeCloseTo(1250, 9);
    expect(r.iterations).toBeLessThanOrEqual(3);
  });

  it("converges on any contracting affine feedback within tolerance", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 0.95, noNaN: true }), fc.double({ min: 1, max: 1e7, noNaN: true }), (k, base) => {
        const f = (x: number) => base + k * x;
        const r = solveDutyFixedPoint(f, opts);
        expect(Math.abs(f(r.valueW) - r.valueW)).toBeLessThanOrEqual(1e-9 * r.valueW * 1.0001);
      }),
      { seed: 42, numRuns: 200 },
    );
  });

  it("reports runaway feedback and bad values as NO_CONVERGENCE naming the room", () => {
    for (const f of [(x: number) => 1000 + 1.2 * x, () => Number.NaN]) {
      let err: unknown;
      try {
        solveDutyFixedPoint(f, opts);
      } catch (e) {
        err = e;
      }
      expect(err).toBeInstanceOf(PlantError);
      expect((err as PlantError).code).toBe("NO_CONVERGENCE");
      expect((err as PlantError).field).toBe("rooms.0");
    }
  });
});
