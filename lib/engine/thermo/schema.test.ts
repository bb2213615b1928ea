import { describe, expect, it } from "vitest";
import { loadFluid, ThermoRangeError } from "./index";
import { evaluateQuery, fluidIdSchema, stateQuerySchema } from "./schema";

describe("state query schema", () => {
  it("parses query-string values and names the failing field", () => {
    const q = stateQuerySchema.parse({ by: "PT", pPa: "101325", tK: "300" });
    expect(q).toEqual({ by: "PT", pPa: 101325, tK: 300 });
    const bad = stateQuerySchema.safeParse({ by: "PH", pPa: "-5", hJkg: "abc" });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => i.path.join("."));
    expect(paths).toContain("pPa");
    expect(paths).toContain("hJkg");
    expect(stateQuerySchema.parse({ by: "satT", tK: 250 })).toEqual({ by: "satT", tK: 250, convention: "dew" });
    expect(fluidIdSchema.safeParse("R22").success).toBe(false);
  });

  it("evaluates a query on a fluid; out-of-range values give ThermoRangeError", async () => {
    const nh3 = await loadFluid("R717");
    const a = evaluateQuery(nh3, stateQuerySchema.parse({ by: "satP", pPa: 101325 }));
    // Ammonia normal boiling point −33.33 °C = 239.82 K (ASHRAE Handbook—Fundamentals, from memory).
    expect(a.kind).toBe("saturation");
    if (a.kind === "saturation") expect(Math.abs(a.saturation.tDewK - 239.82)).toBeLessThan(0.02);
    expect(() => evaluateQuery(nh3, { by: "PT", pPa: 1e5, tK: 1000 })).toThrow(ThermoRangeError);
  });
});
