import { describe, expect, it } from "vitest";
import { roomSchema } from "@/lib/engine/loads/schema";
import { newRoom } from "./graph";
import { circuitSchema } from "@/lib/engine/plant/schema";
import { formKey, fromForm, FormFieldError, isLinkIssue, issueKey, toForm } from "./inspector-fields";

const room = newRoom({ schemaVersion: 1, rooms: [], doors: [], plant: {} }, (p) => `${p}-x`);

describe("inspector form values", () => {
  it("shows SI as stored and writes back only what changed", () => {
    const f = toForm(room, "room", "SI");
    expect(f.setPointC).toBe("2");
    const next = fromForm(room, "room", { ...f, setPointC: "-25" }, f, "SI") as typeof room;
    expect(next.setPointC).toBe(-25);
    expect(next.surfaces).toBe(room.surfaces);
    expect(fromForm(room, "room", f, f, "SI")).toBe(room);
  });

  it("converts °F and ft back to SI (32 °F = 0 °C and 1 ft = 0.3048 m exactly, by definition)", () => {
    const f = toForm(room, "room", "IP");
    const next = fromForm(room, "room", { ...f, setPointC: "32", heightM: "10" }, f, "IP") as typeof room;
    expect(next.setPointC).toBeCloseTo(0, 9);
    expect(next.heightM).toBeCloseTo(3.048, 9);
    // An unchanged converted field keeps its exact stored value.
    expect(next.lengthM).toBe(room.lengthM);
  });

  it("empties an optional field to the engine default and refuses text that is not a number", () => {
    const f = toForm({ ...room, runHoursPerDay: 18 }, "room", "SI");
    const next = fromForm({ ...room, runHoursPerDay: 18 }, "room", { ...f, runHoursPerDay: "" }, f, "SI") as typeof room;
    expect("runHoursPerDay" in next).toBe(false);
    expect(() => fromForm(room, "room", { ...f, widthM: "wide" }, f, "SI")).toThrow(FormFieldError);
  });

  it("ties the engine schema's issues to the form field", () => {
    const r = roomSchema.safeParse({ ...room, setPointC: 90 });
    expect(r.success).toBe(false);
    expect(issueKey("room", r.error!.issues[0].path)).toBe("setPointC");
    expect(issueKey("circuit", ["compressor", "units"])).toBe(formKey("compressor.units"));
    expect(issueKey("room", ["surfaces", 0, "layers"])).toBeNull();
  });
});

describe("links while an item is unconnected", () => {
  it("treats the missing references as link problems, not as the form's", () => {
    const r = circuitSchema.safeParse({ id: "c", tag: "C-1", refrigerant: "R290", heatRejection: { to: "condenser", condenserId: "" } });
    expect(r.success).toBe(false);
    expect(r.error!.issues.every((i) => isLinkIssue("circuit", i.path))).toBe(true);
    expect(isLinkIssue("circuit", ["compressor", "units"])).toBe(false);
  });
});
