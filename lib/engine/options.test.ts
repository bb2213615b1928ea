import { readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import { loadFluid } from "./thermo";
import { computeFacility, facilityModelSchema, withPlant } from "./model";
import { addOption, alternativesOf, deleteOption, makeDesign, OptionEditError, renameOption, setAssessment } from "./options";
import { mergeThreeWay } from "../merge";

const root = path.resolve(__dirname, "../..");
const { $comment, ...ledger } = JSON.parse(readFileSync(path.join(root, "seeds/data/example-facility.json"), "utf8"));
void $comment;
const { $comment: c2, ...plant } = JSON.parse(readFileSync(path.join(__dirname, "plant/fixtures/harrowfield-plant.json"), "utf8"));
void c2;
const doc = () => ({ schemaVersion: 1, ...structuredClone(ledger), plant: structuredClone(plant) }) as Record<string, unknown>;

beforeAll(async () => {
  await Promise.all([loadFluid("R717"), loadFluid("R744")]);
});

describe("plant options in the facility model", () => {
  it("keeps an old model valid: no options, the study's defaults", () => {
    const m = facilityModelSchema.parse(doc());
    expect(m.plantOptions).toEqual([]);
    expect(m.plantStudy.designName).toBe("Design");
    expect(m.plantStudy.years).toBe(15);
    expect(alternativesOf(m).map((a) => a.id)).toEqual(["design"]);
  });

  it("copies the design plant into a new option (a copy, not a shared object)", () => {
    const d = doc();
    const next = addOption(d, { id: "o1", name: "CO2 cascade" });
    const opts = next.plantOptions as { plant: unknown }[];
    expect(opts[0].plant).toEqual(d.plant);
    expect(opts[0].plant).not.toBe(d.plant);
    expect(facilityModelSchema.safeParse(next).success).toBe(true);
  });

  it("checks every option's evaporators against the shared rooms, and refuses duplicate names", () => {
    let d = addOption(doc(), { id: "o1", name: "Alt" });
    (d.plantOptions as { plant: { evaporators: { roomId: string }[] } }[])[0].plant.evaporators[2].roomId = "gone";
    const r = facilityModelSchema.safeParse(d);
    expect(r.success).toBe(false);
    expect(r.error!.issues.map((i) => [i.path.join("."), i.message])).toContainEqual(["plantOptions.0.plant.evaporators.2.roomId", 'no room with id "gone"']);
    d = addOption(doc(), { id: "o1", name: "Alt" });
    expect(() => addOption(d, { id: "o2", name: "alt" })).toThrow(OptionEditError);
    expect(() => renameOption(d, "o1", "design")).toThrow(/already the name/);
    expect(() => renameOption(d, "o1", "")).toThrow(/name: must not be empty/);
    const dup = { ...d, plantOptions: [...(d.plantOptions as object[]), { id: "o1", name: "Other" }] };
    expect(facilityModelSchema.safeParse(dup).error!.issues.map((i) => i.message)).toContain('duplicate option id "o1"');
  });

  it("shares the rooms: a room edit changes the load of every option at once", () => {
    const d = addOption(doc(), { id: "o1", name: "Alt" });
    const before = facilityModelSchema.parse(d);
    const warmer = structuredClone(d) as { rooms: { setPointC: number }[] };
    warmer.rooms[0].setPointC -= 3;
    const after = facilityModelSchema.parse(warmer);
    for (const id of ["design", "o1"]) {
      const alt = (m: typeof before) => alternativesOf(m).find((a) => a.id === id)!;
      const q0 = computeFacility(withPlant(before, alt(before).plant)).plant.totals.refrigerationW;
      const q1 = computeFacility(withPlant(after, alt(after).plant)).plant.totals.refrigerationW;
      expect(q1).toBeGreaterThan(q0);
    }
  });

  it("makes an option the design by swapping plant, name and assessment; swapping back restores the document", () => {
    let d = addOption(doc(), { id: "o1", name: "Alt" });
    const opts = d.plantOptions as { plant: { circuits: { compressor: { units: number } }[] } }[];
    opts[0].plant.circuits[0].compressor.units = 4;
    d = setAssessment(d, "o1", { leakPctPerYear: 12 });
    const swapped = makeDesign(d, "o1");
    const m = facilityModelSchema.parse(swapped);
    expect(m.plant.circuits[0].compressor.units).toBe(4);
    expect(m.plantStudy.designName).toBe("Alt");
    expect(m.plantStudy.designAssessment.leakPctPerYear).toBe(12);
    expect(m.plantOptions[0].name).toBe("Design");
    expect(m.plantOptions[0].plant.circuits[0].compressor.units).toBe(3);
    expect(makeDesign(swapped, "o1")).toEqual({ ...d, plantStudy: { designName: "Design", designAssessment: {} } });
    expect(() => makeDesign(d, "nope")).toThrow(/No option "nope"/);
    expect(() => deleteOption(d, "design")).toThrow(/cannot be deleted/);
    expect(deleteOption(d, "o1").plantOptions).toEqual([]);
  });

  it("merges two people's edits of different options, and reports the same option renamed both ways as a conflict", () => {
    const base = addOption(addOption(doc(), { id: "o1", name: "A" }), { id: "o2", name: "B" });
    const theirs = renameOption(base, "o1", "A (NH3)");
    const mine = setAssessment(base, "o2", { recoveryPct: 95 });
    const merged = mergeThreeWay(base, theirs, mine);
    expect(merged.ok).toBe(true);
    const m = facilityModelSchema.parse(merged.ok ? merged.merged : null);
    expect(m.plantOptions.map((o) => o.name)).toEqual(["A (NH3)", "B"]);
    expect(m.plantOptions[1].assessment.recoveryPct).toBe(95);
    const clash = mergeThreeWay(base, renameOption(base, "o1", "X"), renameOption(base, "o1", "Y"));
    expect(clash.ok).toBe(false);
    expect(clash.ok ? [] : clash.conflicts).toEqual(["plantOptions[o1].name"]);
  });
});
