import type { LedgerInputRaw } from "./schema";

type RawRoom = LedgerInputRaw["rooms"][number];
type RawDoor = NonNullable<LedgerInputRaw["doors"]>[number];

/**
 * A synthetic facility of `roomCount` rooms (freezers, chill rooms, ripening rooms, docks
 * and a blast freezer every tenth room) with surfaces, doors, product and internal loads —
 * for benchmarks and load tests, not a real site.
 */
export function generateFacility(roomCount: number): LedgerInputRaw {
  const rooms: RawRoom[] = [];
  const doors: RawDoor[] = [];
  const panel = (mm: number) => [{ material: "PIR", thicknessM: mm / 1000, conductivityWmK: 0.023 }];
  for (let i = 0; i < roomCount; i++) {
    const kind = i % 10 === 9 ? "blast" : i % 5 === 0 ? "dock" : i % 7 === 3 ? "ripening" : "storage";
    const setPointC = kind === "blast" ? -35 : kind === "dock" ? 5 : kind === "ripening" ? 14 : i % 2 === 0 ? -25 : 2;
    const id = `room-${i}`;
    const neighbour = i > 0 ? `room-${i - 1}` : undefined;
    const hourly = Array.from({ length: 24 }, (_, h) => (h >= 6 && h < 18 ? 1 + (h % 3) : 0));
    const r: RawRoom = {
      id,
      name: `Room ${i}`,
      kind,
      lengthM: 20 + (i % 7) * 3,
      widthM: 12 + (i % 5) * 2,
      heightM: 8,
      setPointC,
      rhPct: 90,
      surfaces: [
        { kind: "wall", orientation: "N", along: "length", otherSide: "outdoors", layers: panel(setPointC < 0 ? 200 : 100) },
        { kind: "wall", orientation: "E", along: "width", otherSide: "outdoors", colour: "dark", layers: panel(150) },
        { kind: "wall", along: "length", otherSide: neighbour ? { roomId: neighbour } : "outdoors", orientation: neighbour ? undefined : "S", uValueWm2K: 0.2 },
        { kind: "wall", orientation: "W", along: "width", otherSide: "outdoors", layers: panel(150) },
        { kind: "roof", otherSide: "outdoors", layers: panel(200) },
        { kind: "floor", otherSide: setPointC < 0 ? "heatedSlab" : "ground", uValueWm2K: 0.2 },
      ],
      people: { count: 2, hoursPerDay: 8, startHour: 7 },
      lights: { wPerM2: 4, hoursPerDay: 12, startHour: 6 },
      forklifts: { count: 1, powerWEach: 5000, hoursPerDay: 6, startHour: 8 },
      heaters: setPointC < 0 ? [{ kind: "doorFrame", powerW: 300 }, { kind: "drainLine", powerW: 200 }] : [],
      evaporatorFans: { powerW: 3000, hoursPerDay: 22 },
      defrost: { heaterW: setPointC < 0 ? 12000 : 0, minutesPerDefrost: 30, defrostsPerDay: 3, fractionToRoom: 0.4 },
    };
    if (kind === "storage" && setPointC < 0) {
      r.products = [{ commodityId: "ready-meals", massKgPerDay: 8000, enteringTempC: -15, pullDownHours: 24, packaging: { kind: "cardboard", massFractionOfProduct: 0.05 } }];
    } else if (kind === "storage") {
      r.products = [{ commodityId: "apples", massKgPerDay: 6000, enteringTempC: 18, pullDownHours: 18, arrivalsByHour: hourly }];
      r.storedProduce = [{ commodityId: "apples", palletPositions: 200, kgPerPallet: 400 }];
    } else if (kind === "ripening") {
      r.storedProduce = [{ commodityId: "bananas", palletPositions: 24, kgPerPallet: 960 }];
      r.ripening = { chargeActive: true, respirationMultiplier: 3 };
      r.ventilation = { airChangesPerHour: 0.5, hoursPerDay: 4, startHour: 10 };
    } else if (kind === "blast") {
      r.batch = { commodityId: "beef-lean", massKg: 4000, thicknessM: 0.1, enteringTempC: 5, finalTempC: -18, airVelocityMS: 4, batchesPerDay: 1, fanPowerW: 3000 };
    }
    rooms.push(r);
    doors.push({
      id: `door-${i}`,
      widthM: 2.5,
      heightM: 3.5,
      sides: [id, kind === "dock" || !neighbour ? "outdoors" : neighbour],
      passagesByHour: hourly.map((x) => x * 4),
      protection: "stripCurtain",
    });
  }
  return {
    site: { name: "Synthetic benchmark site (invented)", designDryBulbC: 32, coincidentWetBulbC: 23, groundTempC: 12, elevationM: 150 },
    rooms,
    doors,
  };
}
