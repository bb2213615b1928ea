import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { LoadInputError, computeLedger, type LedgerInputRaw } from "./index";

type RawRoom = LedgerInputRaw["rooms"][number];
type RawDoor = NonNullable<LedgerInputRaw["doors"]>[number];

const site = { designDryBulbC: 30, designRH: 50, groundTempC: 10, elevationM: 0 };

function room(extra: Partial<RawRoom> = {}): RawRoom {
  return { id: "r1", name: "Room 1", kind: "storage", lengthM: 10, widthM: 10, heightM: 5, setPointC: 0, rhPct: 90, ...extra };
}

function ledger(rooms: RawRoom[], doors: RawDoor[] = [], options: LedgerInputRaw["options"] = undefined, s: object = site) {
  return computeLedger({ site: s as LedgerInputRaw["site"], rooms, doors, options });
}

function fieldOf(fn: () => unknown): string {
  try {
    fn();
  } catch (e) {
    if (e instanceof LoadInputError) return e.field;
    throw e;
  }
  throw new Error("no error thrown");
}

describe("people", () => {
  it("272 − 6·t W per person against the handbook's occupancy table", () => {
    // ASHRAE Handbook—Refrigeration, heat equivalent of occupancy (from memory):
    // 10 °C 210 W, 0 °C 270 W, −10 °C 330 W, −25 °C 420 W per person; the formula 272 − 6·t
    // reproduces them within 1 %.
    for (const [t, table] of [[10, 210], [0, 270], [-10, 330], [-25, 420]] as const) {
      const r = ledger([room({ setPointC: t, people: { count: 1, hoursPerDay: 24 } })]);
      const people = r.rooms[0].components.find((c) => c.kind === "people")!;
      expect(people.powerW).toBeCloseTo(272 - 6 * t, 9);
      expect(Math.abs(people.powerW / table - 1)).toBeLessThan(0.01);
    }
  });
});

describe("room ledger sums", () => {
  it("design capacity = 24-h energy × (1 + SF) / run hours, peak from the hourly profile", () => {
    // Hand calculation: wall U 0.2 × 100 m² × (30 − 0) K = 600 W (no sun: north-facing);
    // 2 people at 0 °C for 12 h from 08:00: 2·272 = 544 W while present, 272 W averaged;
    // average 872 W → 20.928 kWh/day; SF 0.1 at 20 h: 872·24·1.1/20 = 1151.04 W.
    // Peak hour (08:00–19:00): 600 + 544 = 1144 W → × 1.1 = 1258.4 W.
    const r = ledger([
      room({
        surfaces: [{ kind: "wall", orientation: "N", areaM2: 100, uValueWm2K: 0.2, otherSide: "outdoors" }],
        people: { count: 2, hoursPerDay: 12, startHour: 8 },
      }),
    ]).rooms[0];
    expect(r.averageLoadW).toBeCloseTo(872, 6);
    expect(r.totalEnergyKWhPerDay).toBeCloseTo(20.928, 6);
    expect(r.requiredCapacityW).toBeCloseTo(1151.04, 6);
    expect(r.peakHourW).toBeCloseTo(1144, 6);
    expect(r.peakHour).toBe(8);
    expect(r.hourly[7]).toBeCloseTo(600, 6);
    expect(r.requiredPeakCapacityW).toBeCloseTo(1258.4, 6);
  });

  it("colder neighbour: ignored by default, credited when asked", () => {
    // Wall U 0.25 × 50 m² to a −20 °C neighbour from a 0 °C room: 0.25·50·(−20 − 0) = −250 W.
    const rooms = [
      room({ surfaces: [{ kind: "wall", areaM2: 50, uValueWm2K: 0.25, otherSide: { roomId: "cold" } }] }),
      room({ id: "cold", name: "Cold", setPointC: -20 }),
    ];
    expect(ledger(rooms).rooms[0].averageLoadW).toBe(0);
    const credited = ledger(rooms, [], { colderNeighbour: "credit" });
    expect(credited.rooms[0].averageLoadW).toBeCloseTo(-250, 6);
    expect(credited.options.statements.join(" ")).toMatch(/credited/);
  });
});

describe("shared surfaces are entered once and counted on both sides", () => {
  // Wall U 0.25 × 50 m² between a 0 °C room and a −20 °C room: 0.25·50·20 = 250 W flows from
  // the warm room into the cold one (q = U·A·ΔT, ASHRAE Handbook—Refrigeration).
  const rooms = [
    room({ surfaces: [{ id: "w", kind: "wall", areaM2: 50, uValueWm2K: 0.25, otherSide: { roomId: "cold" } }] }),
    room({ id: "cold", name: "Cold", setPointC: -20 }),
  ];

  it("the colder room gains what the warmer room loses", () => {
    const credited = ledger(rooms, [], { colderNeighbour: "credit" });
    const gain = credited.rooms[1].components.find((c) => c.kind === "transmission" && c.label.includes("shared with room r1"))!;
    expect(gain.powerW).toBeCloseTo(250, 9);
    expect(gain.trace.inputs.enteredIn).toBe("rooms.0.surfaces.0 (room r1)");
    expect(credited.rooms[0].averageLoadW + credited.rooms[1].averageLoadW).toBeCloseTo(0, 9);
    // ignored on the warm side by default, still counted on the cold side
    const byDefault = ledger(rooms);
    expect(byDefault.rooms[0].averageLoadW).toBe(0);
    expect(byDefault.rooms[1].averageLoadW).toBeCloseTo(250, 9);
  });

  it("the same surface entered in both rooms is refused, naming the second entry", () => {
    const twice = [rooms[0], room({ id: "cold", name: "Cold", setPointC: -20, surfaces: [{ kind: "wall", areaM2: 50, uValueWm2K: 0.25, otherSide: { roomId: "r1" } }] })];
    expect(fieldOf(() => ledger(twice))).toBe("rooms.1.surfaces.0.otherSide");
  });
});

describe("product pull-down on the 24-hour basis", () => {
  // 1000 kg/day of apples 20 → 2 °C: 1000·3.8171·18 = 68 707 kJ/day (Chen c_u, see product.test.ts).
  const apples = (arrivals?: number[]) =>
    room({
      setPointC: 2,
      products: [{ commodityId: "apples", massKgPerDay: 1000, enteringTempC: 20, pullDownHours: 12, ...(arrivals ? { arrivalsByHour: arrivals } : {}) }],
    });

  const productW = (r: { components: { kind: string; powerW: number }[] }) =>
    r.components.filter((c) => c.kind === "product").reduce((a, c) => a + c.powerW, 0);

  it("rate basis carries the 12-h pull-down rate over the day", () => {
    // 68 707 kJ / (12·3600 s) = 1590.4 W.
    const r = ledger([apples()]).rooms[0];
    expect(productW(r)).toBeCloseTo(1590.4, 0);
    expect(r.components[0].label).toMatch(/sensible above freezing/);
  });

  it("daily-energy basis spreads the same energy over 24 h", () => {
    // 68 707 kJ / 86 400 s = 795.2 W.
    const r = ledger([apples()], [], { pullDownBasis: "dailyEnergy" });
    expect(productW(r.rooms[0])).toBeCloseTo(795.2, 0);
    expect(r.options.pullDownBasis).toBe("dailyEnergy");
  });

  it("respiration of the warm intake during the pull-down", () => {
    // Becker–Fricke for apples (f 5.6871e-4, g 2.5977, from memory) at the mean pull-down
    // temperature (20 + 2)/2 = 11 °C = 51.8 °F: 1.6903e-6·51.8^2.5977 = 0.048005 W/kg; at the
    // 2 °C room (35.6 °F): 0.018121 W/kg; excess 0.029884 W/kg × 1000 kg × 12 h / 24 h = 14.94 W.
    const r = ledger([apples()]).rooms[0];
    const resp = r.components.find((c) => c.label.includes("respiration during pull-down"))!;
    expect(resp.powerW).toBeCloseTo(14.94, 1);
  });

  it("arrivals by hour make a peak hour above the daily average", () => {
    // 1000 kg/day of lean beef (sirloin: x_wo 0.7176, x_p 0.22) chilled 20 → 2 °C, all arriving
    // at 06:00, 12-h pull-down: Chen c_u = 4.19 − 2.30·0.2824 − 0.628·0.2824³ = 3.5263 kJ/(kg·K)
    // → 63 474 kJ/day; 06:00–17:00 carry 63 474/(12·3.6) = 1469.3 W each, the other hours
    // nothing; daily average 734.7 W.
    const arrivals = new Array(24).fill(0);
    arrivals[6] = 1;
    const r = ledger(
      [room({ setPointC: 2, products: [{ commodityId: "beef-lean", massKgPerDay: 1000, enteringTempC: 20, pullDownHours: 12, arrivalsByHour: arrivals }] })],
      [],
      { pullDownBasis: "dailyEnergy" },
    ).rooms[0];
    expect(r.averageLoadW).toBeCloseTo(734.7, 0);
    expect(r.peakHourW).toBeCloseTo(1469.3, 0);
    expect(r.hourly[5]).toBeCloseTo(0, 9);
    expect(r.hourly[17]).toBeCloseTo(1469.3, 0);
    expect(r.hourly[18]).toBeCloseTo(0, 9);
    expect(r.peakHourW).toBeGreaterThan(r.averageLoadW);
  });

  it("produce frozen in a freezer carries no pull-down respiration", () => {
    // Strawberries 10 → −18 °C in a −25 °C room: respiration stops as the fruit freezes, so the
    // stream is heat of cooling and freezing only.
    const r = ledger([room({ setPointC: -25, products: [{ commodityId: "strawberries", massKgPerDay: 500, enteringTempC: 10, finalTempC: -18, pullDownHours: 6 }] })]).rooms[0];
    expect(r.components.some((c) => c.kind === "respiration")).toBe(false);
    expect(r.components.filter((c) => c.kind === "product").length).toBe(3);
    const stored = ledger([room({ setPointC: -25, storedProduce: [{ commodityId: "strawberries", massKg: 10000 }] })]).rooms[0];
    expect(stored.components.length).toBe(0);
  });

  it("product cannot end colder than the room air", () => {
    const bad = room({ setPointC: 2, products: [{ commodityId: "apples", massKgPerDay: 1, enteringTempC: 20, finalTempC: 0, pullDownHours: 12 }] });
    expect(fieldOf(() => ledger([bad]))).toBe("rooms.0.products.0.finalTempC");
  });

  it("heat flowing to a colder side is reported as heat outflow", () => {
    // Floor U 0.4 × 72 m² to ground at 10 °C from a 14 °C ripening room: 0.4·72·(10 − 14) = −115.2 W,
    // ignored in the ledger, reported as 115.2 W of outflow; ripening heaters 2 kW for 3 h = 250 W average.
    const r = ledger([
      room({
        kind: "ripening",
        lengthM: 12,
        widthM: 6,
        setPointC: 14,
        surfaces: [{ kind: "floor", uValueWm2K: 0.4, otherSide: "ground" }],
        ripening: { chargeActive: true, respirationMultiplier: 3, heating: { powerW: 2000, hoursPerDay: 3, startHour: 5 } },
      }),
    ]).rooms[0];
    expect(r.heatOutflowW).toBeCloseTo(115.2, 6);
    expect(r.averageLoadW).toBeCloseTo(250, 6);
    expect(r.peakHour).toBe(5);
  });

  it("freezing case: lean beef +5 → −18 °C in a freezer", () => {
    // Lean beef (sirloin, x_wo 0.7176, x_p 0.22, t_f −1.7 °C): Chen split as in product.test.ts —
    // above 3.5263·6.7 = 23.63, latent 333.6·(0.7176 − 0.088)·(1 − 1.7/18) = 190.20, below
    // (1.55 + 1.26·0.2824)·16.3 = 31.06 → 244.89 kJ/kg; 1000 kg/day over 24 h = 2834.4 W, of
    // which latent 2201.4 W.
    const r = ledger([
      room({ setPointC: -25, products: [{ commodityId: "beef-lean", massKgPerDay: 1000, enteringTempC: 5, finalTempC: -18, pullDownHours: 24 }] }),
    ]).rooms[0];
    expect(r.averageLoadW).toBeCloseTo(2834.4, 0);
    const latent = r.components.find((c) => c.label.includes("latent heat of freezing"))!;
    expect(latent.powerW).toBeCloseTo(2201.4, 0);
  });

  it("packaging adds m·c·ΔT", () => {
    // 1000 kg apples with 8 % wooden packaging: 80 kg·1.7 kJ/(kg·K)·18 K = 2448 kJ/day
    // (wood c from general property tables, from memory) → 2448e3/86400 = 28.33 W daily basis.
    const r = ledger(
      [room({ setPointC: 2, products: [{ commodityId: "apples", massKgPerDay: 1000, enteringTempC: 20, pullDownHours: 12, packaging: { kind: "wood", massFractionOfProduct: 0.08 } }] })],
      [],
      { pullDownBasis: "dailyEnergy" },
    ).rooms[0];
    expect(r.components.find((c) => c.kind === "packaging")!.powerW).toBeCloseTo(28.33, 1);
  });
});

describe("batch, respiration and ventilation in the ledger", () => {
  it("batch freezer load = batch heat / batch time", () => {
    // 1000 kg lean beef +5 → −18 °C: 244 889 kJ (above) over a stated 10 h batch → 6802.5 W.
    const r = ledger([
      room({
        kind: "blast",
        setPointC: -35,
        batch: { commodityId: "beef-lean", massKg: 1000, thicknessM: 0.1, enteringTempC: 5, finalTempC: -18, batchHours: 10 },
      }),
    ]).rooms[0];
    expect(r.components.find((c) => c.kind === "batch")!.powerW).toBeCloseTo(6802.5, 0);
  });

  it("a batch longer than a day, every other day", () => {
    // 1000 kg lean beef, 244 889 kJ per batch (above) over a stated 30 h, one batch every two
    // days (0.5/day): daily energy 0.5·244 889/3.6 = 34 012 Wh → hourly mean 1417.2 W on the
    // physical profile; the rate basis carries 244 889e3/(30·3600) = 2267.5 W.
    const r = ledger([
      room({
        kind: "blast",
        setPointC: -35,
        batch: { commodityId: "beef-lean", massKg: 1000, thicknessM: 0.3, enteringTempC: 5, finalTempC: -18, batchHours: 30, batchesPerDay: 0.5 },
      }),
    ]).rooms[0];
    expect(r.hourly.reduce((a, b) => a + b, 0) / 24).toBeCloseTo(1417.2, 0);
    expect(r.components.find((c) => c.kind === "batch")!.powerW).toBeCloseTo(2267.5, 0);
  });

  it("respiration from pallet positions, and the ripening multiplier", () => {
    // 25 pallets × 400 kg = 10 t apples at 0 °C × 0.013737 W/kg (respiration.test.ts) = 137.4 W.
    const stored = [{ commodityId: "apples", palletPositions: 25, kgPerPallet: 400 }];
    const r = ledger([room({ storedProduce: stored })]).rooms[0];
    expect(r.averageLoadW).toBeCloseTo(137.4, 0);
    const rip = ledger([room({ kind: "ripening", storedProduce: stored, ripening: { chargeActive: true, respirationMultiplier: 3 } })]).rooms[0];
    expect(rip.averageLoadW).toBeCloseTo(3 * 137.4, 0);
  });

  it("ventilation by the moist-air enthalpy difference", () => {
    // 360 m³/h of outdoor air 30 °C / 50 % RH into a 0 °C / 90 % RH room, 24 h.
    // Hand calculation (ASHRAE moist-air equations, p_ws(30 °C) = 4246.9 Pa, p_ws(0 °C) = 611.2 Pa):
    // W_o = 0.621945·2123.5/(101325 − 2123.5) = 0.013313, h_o = 30.18 + 0.013313·2556.8 = 64.22 kJ/kg,
    // ρ_o = 101325/(287.042·303.15·1.021405)·1.013313 = 1.1552 kg/m³;
    // W_r = 0.621945·550.1/(101325 − 550.1) = 0.003395, h_r = 8.49 kJ/kg;
    // ṁ_da = 0.1 m³/s·1.1552/1.013313 = 0.11400 kg/s → q = 0.11400·(64.22 − 8.49) = 6.353 kW.
    const r = ledger([room({ ventilation: { flowM3PerH: 360, hoursPerDay: 24 } })]).rooms[0];
    const v = r.components.find((c) => c.kind === "ventilation")!;
    expect(v.powerW / 1000).toBeCloseTo(6.353, 1);
    expect(v.latentW).toBeGreaterThan(0);
  });
});

describe("a workspace's own commodity", () => {
  it("is used for product and respiration, with properties derived from its composition", () => {
    // Chen c_u for x_wo = 0.90 (x_s = 0.10): 4.19 − 0.230 − 0.000628 = 3.9594 kJ/(kg·K);
    // 100 kg/day 15 → 5 °C = 3959.4 kJ/day → 3959.4e3/86400 = 45.83 W on the daily basis.
    // Respiration with the strawberry constants f 3.6683e-4, g 3.0330 at 5 °C: 0.08494 W/kg
    // (respiration.test.ts) × 2000 kg = 169.9 W.
    const r = computeLedger({
      site,
      rooms: [
        room({
          setPointC: 5,
          products: [{ commodityId: "test-berry", massKgPerDay: 100, enteringTempC: 15, pullDownHours: 24 }],
          storedProduce: [{ commodityId: "test-berry", massKg: 2000 }],
        }),
      ],
      commodities: [
        {
          id: "test-berry",
          name: "Test berry",
          group: "fruit",
          waterFraction: 0.9,
          proteinFraction: 0,
          initialFreezingPointC: -1,
          respiration: { f: 3.6683e-4, g: 3.033 },
          source: "test data",
        },
      ],
      options: { pullDownBasis: "dailyEnergy" },
    }).rooms[0];
    const product = r.components.find((c) => c.kind === "product")!;
    expect(product.powerW).toBeCloseTo(45.83, 1);
    const stored = r.components.find((c) => c.label === "Test berry: respiration")!;
    expect(stored.powerW).toBeCloseTo(169.9, 0);
    expect(stored.trace.source).toMatch(/user data/);
  });
});

describe("door infiltration in the ledger", () => {
  it("charges the colder room with the stated door's load", () => {
    // The stated door of infiltration.test.ts, now at 25 °C / 50 % RH design, −20 °C / 90 % RH
    // room: 604.2 kW fully open × D_t 0.023148 × D_f 0.8 (ΔT 45 K > 11 K) = 11.19 kW.
    const r = ledger(
      [room({ setPointC: -20, rhPct: 90 })],
      [{ id: "d1", widthM: 3, heightM: 4, sides: ["r1", "outdoors"], passagesPerDay: 100, openCloseSecondsPerPassage: 20 }],
      undefined,
      { designDryBulbC: 25, designRH: 50, groundTempC: 10, elevationM: 0 },
    ).rooms[0];
    const inf = r.components.find((c) => c.kind === "infiltration")!;
    expect(inf.powerW / 1000).toBeCloseTo(11.19, 1);
    expect(inf.trace.method).toBe("Gosney–Olama door infiltration");
    expect(inf.latentW / inf.powerW).toBeCloseTo(0.332, 2);
  });

  it("protection and a docked trailer reduce the exchange by (1 − E)", () => {
    // E for a shelter (0.8 default) on 50 % of openings and no door protection: E = 0.5·0.8 = 0.4.
    const door = { id: "d1", widthM: 3, heightM: 3, sides: ["r1", "outdoors"] as [string, string], passagesPerDay: 50 };
    const bare = ledger([room()], [door]).rooms[0].averageLoadW;
    const docked = ledger([room()], [{ ...door, dock: { seal: "shelter", dockedShare: 0.5 } }]).rooms[0].averageLoadW;
    expect(docked / bare).toBeCloseTo(0.6, 9);
    const curtain = ledger([room()], [{ ...door, protection: "stripCurtain", protectionEffectiveness: 0.9 }]).rooms[0].averageLoadW;
    expect(curtain / bare).toBeCloseTo(0.1, 9);
  });

  it("a door open longer than the hour is an error naming the field", () => {
    // 3600 s in an hour: 200 passages × 20 s = 4000 s cannot fit.
    const passages = new Array(24).fill(0);
    passages[9] = 200;
    expect(fieldOf(() => ledger([room()], [{ id: "d1", widthM: 3, heightM: 3, sides: ["r1", "outdoors"], passagesByHour: passages }]))).toBe(
      "doors.0.passagesByHour.9",
    );
  });
});

describe("bad input names the field", () => {
  it("negative size", () => {
    expect(fieldOf(() => ledger([room({ lengthM: -3 })]))).toBe("rooms.0.lengthM");
  });
  it("set point above the design ambient for a cooled room", () => {
    expect(fieldOf(() => ledger([room({ setPointC: 35 })]))).toBe("rooms.0.setPointC");
  });
  it("RH outside 0–100 %", () => {
    expect(fieldOf(() => ledger([room({ rhPct: 120 })]))).toBe("rooms.0.rhPct");
    expect(fieldOf(() => ledger([room()], [], undefined, { ...site, designRH: -5 }))).toBe("site.designRH");
  });
  it("pull-down time 0", () => {
    const bad = room({ products: [{ commodityId: "apples", massKgPerDay: 1000, enteringTempC: 20, pullDownHours: 0 }] });
    expect(fieldOf(() => ledger([bad]))).toBe("rooms.0.products.0.pullDownHours");
    try {
      ledger([bad]);
    } catch (e) {
      expect((e as Error).message).toMatch(/greater than 0/);
    }
  });
  it("unknown commodity, unknown door side, missing humidity", () => {
    expect(fieldOf(() => ledger([room({ products: [{ commodityId: "unobtainium", massKgPerDay: 1, enteringTempC: 5, pullDownHours: 4 }] })]))).toBe(
      "rooms.0.products.0.commodityId",
    );
    expect(fieldOf(() => ledger([room()], [{ id: "d", widthM: 2, heightM: 2, sides: ["r1", "nowhere"] }]))).toBe("doors.0.sides.1");
    expect(fieldOf(() => ledger([room()], [], undefined, { designDryBulbC: 30, groundTempC: 10, elevationM: 0 }))).toBe("site.coincidentWetBulbC");
  });
  it("a batch whose air cannot freeze it", () => {
    expect(
      fieldOf(() =>
        ledger([room({ kind: "blast", setPointC: -35, batch: { commodityId: "beef-lean", massKg: 100, thicknessM: 0.1, enteringTempC: 5, finalTempC: -40 } })]),
      ),
    ).toBe("rooms.0.batch.finalTempC");
  });
});

describe("invariants (fast-check)", () => {
  const door = (passagesPerDay: number): RawDoor => ({ id: "d1", widthM: 3, heightM: 3.5, sides: ["r1", "outdoors"], passagesPerDay, flowFactor: 0.8 });
  const wall = { kind: "wall" as const, orientation: "E" as const, areaM2: 120, uValueWm2K: 0.18, otherSide: "outdoors" as const };

  it("load grows with the temperature difference", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 10, max: 44, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        fc.double({ min: -35, max: 5, noNaN: true }),
        (dryBulb, rise, setPoint) => {
          const at = (t: number) =>
            ledger([room({ setPointC: setPoint, surfaces: [wall], people: { count: 1, hoursPerDay: 8 } })], [door(80)], undefined, { ...site, designDryBulbC: t }).rooms[0]
              .averageLoadW;
          return at(dryBulb + rise) >= at(dryBulb);
        },
      ),
      { seed: 42, numRuns: 60 },
    );
  });

  it("load grows with door passages", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2000 }), fc.integer({ min: 1, max: 500 }), (p, more) => {
        const at = (n: number) => ledger([room({ surfaces: [wall] })], [door(n)]).rooms[0].averageLoadW;
        return at(p + more) > at(p);
      }),
      { seed: 42, numRuns: 60 },
    );
  });

  const internalKinds = new Set(["transmission", "people", "lights", "machinery", "forklifts", "batteryCharging", "heater", "evaporatorFans", "defrost"]);

  it("no doors → no infiltration; an empty room is transmission + internal only", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -30, max: 10, noNaN: true }),
        fc.integer({ min: 0, max: 10 }),
        fc.double({ min: 0, max: 20000, noNaN: true }),
        fc.double({ min: 0, max: 30, noNaN: true }),
        (setPoint, people, fanW, lightsWm2) => {
          const r = ledger([
            room({
              setPointC: setPoint,
              surfaces: [wall, { kind: "floor", uValueWm2K: 0.3, otherSide: "ground" }],
              people: { count: people, hoursPerDay: 10, startHour: 6 },
              lights: { wPerM2: lightsWm2, hoursPerDay: 12 },
              evaporatorFans: { powerW: fanW, hoursPerDay: 22 },
            }),
          ]).rooms[0];
          const sum = r.components.reduce((a, c) => a + c.powerW, 0);
          return (
            r.components.every((c) => internalKinds.has(c.kind)) &&
            !r.components.some((c) => c.kind === "infiltration") &&
            r.latentW === 0 &&
            Math.abs(sum - r.averageLoadW) < 1e-9 * Math.max(1, sum)
          );
        },
      ),
      { seed: 42, numRuns: 80 },
    );
  });

  it("units round-trip: W ↔ kWh/day, sensible + latent, hourly mean = daily average", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 400 }),
        fc.integer({ min: 0, max: 23 }),
        fc.double({ min: 100, max: 20000, noNaN: true }),
        (passages, arrivalHour, massKg) => {
          const arrivals = new Array(24).fill(0);
          arrivals[arrivalHour] = 1;
          const r = ledger(
            [
              room({
                setPointC: -5,
                surfaces: [wall],
                products: [{ commodityId: "cod", massKgPerDay: massKg, enteringTempC: 4, finalTempC: -5, pullDownHours: 10, arrivalsByHour: arrivals }],
                people: { count: 2, hoursPerDay: 6, startHour: 20 },
              }),
            ],
            [door(passages)],
            { pullDownBasis: "dailyEnergy" },
          ).rooms[0];
          const mean = r.hourly.reduce((a, b) => a + b, 0) / 24;
          return (
            r.components.every(
              (c) => Math.abs((c.energyKWhPerDay * 1000) / 24 - c.powerW) < 1e-9 * Math.max(1, c.powerW) && Math.abs(c.sensibleW + c.latentW - c.powerW) < 1e-9 * Math.max(1, c.powerW),
            ) &&
            Math.abs(mean - r.averageLoadW) < 1e-6 * r.averageLoadW &&
            Math.abs(r.totalEnergyKWhPerDay - (r.averageLoadW * 24) / 1000) < 1e-9 * r.totalEnergyKWhPerDay
          );
        },
      ),
      { seed: 42, numRuns: 60 },
    );
  });
});
