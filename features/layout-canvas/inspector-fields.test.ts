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

describe("R744 high-side inputs", () => {
  const co2 = circuitSchema.parse({ id: "c", tag: "C-1", refrigerant: "R744", arrangement: "transcritical", heatRejection: { to: "condenser", condenserId: "gc" } });

  it("enters the high-side set point in bar(a) or psia and stores Pa absolute", () => {
    const f = toForm(co2, "circuit", "SI");
    expect(f[formKey("highSidePa")]).toBe("");
    const bar = fromForm(co2, "circuit", { ...f, highSidePa: "95" }, f, "SI") as typeof co2;
    // 1 bar = 100 000 Pa (by definition).
    expect(bar.highSidePa).toBe(9.5e6);
    const fi = toForm(co2, "circuit", "IP");
    const psi = fromForm(co2, "circuit", { ...fi, highSidePa: "1300" }, fi, "IP") as typeof co2;
    // 1 psi = 6894.757 Pa (NIST SP 811, Appendix B).
    expect(psi.highSidePa as number).toBeCloseTo(1300 * 6894.757, 0);
    expect(toForm(bar, "circuit", "SI")[formKey("highSidePa")]).toBe("95");
  });

  it("takes “optimise” as a word and names the field and range when the number is out of range", () => {
    const f = toForm(co2, "circuit", "SI");
    const opt = fromForm(co2, "circuit", { ...f, highSidePa: "Optimize" }, f, "SI") as typeof co2;
    expect(opt.highSidePa).toBe("optimise");
    expect(() => fromForm(co2, "circuit", { ...f, highSidePa: "high" }, f, "SI")).toThrow(/must be a number or “optimise”/);
    const r = circuitSchema.safeParse(fromForm(co2, "circuit", { ...f, highSidePa: "200" }, f, "SI"));
    expect(r.success).toBe(false);
    expect(issueKey("circuit", r.error!.issues[0].path)).toBe("highSidePa");
    expect(r.error!.issues[0].message).toMatch(/50–140 bar\(a\)/);
    const sw = circuitSchema.safeParse(fromForm(co2, "circuit", { ...f, switchOverC: "35" }, f, "SI"));
    expect(sw.success).toBe(false);
    expect(issueKey("circuit", sw.error!.issues[0].path)).toBe("switchOverC");
    expect(sw.error!.issues[0].message).toBe("must be between 5 and 30 °C");
  });
});
