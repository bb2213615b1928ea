import { describe, expect, it } from "vitest";
import { ACTIONS, can, ROLES } from "./authz";

// Expectations from PRODUCT.md's role table, written out by hand.
describe("authorization policy", () => {
  it("viewers read the workspace, its facilities and members, and change nothing", () => {
    const allowed = ACTIONS.filter((a) => can("viewer", a));
    expect(allowed).toEqual(["workspace.read", "facility.read", "members.read"]);
  });
  it("operations create stocking checks but do not edit the model or export", () => {
    expect(can("operations", "scenario.create")).toBe(true);
    expect(can("operations", "model.edit")).toBe(false);
    expect(can("operations", "schedule.export")).toBe(false);
    expect(can("operations", "scenario.apply")).toBe(false);
  });
  it("purchasers export the schedule and nothing else beyond reading", () => {
    const writes = ACTIONS.filter((a) => !a.endsWith(".read") && can("purchaser", a));
    expect(writes).toEqual(["schedule.export"]);
  });
  it("only owners manage members and read the audit log", () => {
    for (const r of ROLES) {
      expect(can(r, "members.invite")).toBe(r === "owner");
      expect(can(r, "members.remove")).toBe(r === "owner");
      expect(can(r, "audit.read")).toBe(r === "owner");
    }
  });
});
