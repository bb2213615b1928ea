import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { computeFacility, type FacilityResult } from "@/lib/engine/model";
import { loadFluid } from "@/lib/engine/thermo";
import { parseEngineModel } from "@/features/facilities/engine-model";
import { ledgerRows, stackByRoom } from "./rows";

const raw = JSON.parse(readFileSync(path.resolve(__dirname, "../../seeds/data/harrowfield-model.json"), "utf8"));
let res: FacilityResult;
beforeAll(async () => {
  await loadFluid("R717");
  const p = parseEngineModel(raw, { designDryBulbC: 32, coincidentWetBulbC: 23, designRhPct: null, groundTempC: 12, elevationM: 150 });
  res = computeFacility(p.data!);
});

describe("ledger rows", () => {
  it("lists every component once and adds up to each room's 24-h energy", () => {
    const rows = ledgerRows(res.ledger);
    expect(rows.length).toBe(res.ledger.rooms.reduce((a, r) => a + r.components.length, 0));
    for (const r of res.ledger.rooms) {
      const mine = rows.filter((x) => x.roomId === r.roomId);
      expect(mine.reduce((a, x) => a + x.energyKWhPerDay, 0)).toBeCloseTo(r.totalEnergyKWhPerDay, 6);
      expect(mine.reduce((a, x) => a + x.share, 0)).toBeCloseTo(1, 9);
    }
  });

  it("stacks each room's components by kind, with the same total power", () => {
    const { kinds, rooms } = stackByRoom(res.ledger);
    expect(kinds).toContain("transmission");
    rooms.forEach((row, i) => {
      const sum = kinds.reduce((a, k) => a + (row[k] ?? 0), 0);
      const direct = res.ledger.rooms[i].components.reduce((a, c) => a + c.powerW, 0);
      expect(sum).toBeCloseTo(direct, 6);
    });
  });
});
