import { describe, expect, it } from "vitest";
import { nextTag } from "./schedule";

describe("stable tags", () => {
  it("hands out one above the highest number in use, never a freed one", () => {
    expect(nextTag("EV", [])).toBe("EV-1");
    expect(nextTag("EV", ["EV-1", "EV-2", "EV-6", "CP-9"])).toBe("EV-7");
    // EV-3 was deleted: it is not reused.
    expect(nextTag("EV", ["EV-1", "EV-2", "EV-4"])).toBe("EV-5");
    expect(nextTag("CD", ["CD-A", "CD-2"])).toBe("CD-3");
    expect(nextTag("C.1", ["C.1-4", "Cx1-9"])).toBe("C.1-5");
  });
});
