import { describe, expect, it } from "vitest";
import { sniffPlan } from "./image-type";

// Signatures from the format specifications: PNG (ISO/IEC 15948 §5.2), JPEG SOI + marker
// (ITU-T T.81 Annex B), PDF header (ISO 32000-1 §7.5.2).
describe("site-plan type by magic bytes", () => {
  it("recognises PNG, JPEG and PDF and nothing else", () => {
    expect(sniffPlan(new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]))).toBe("image/png");
    expect(sniffPlan(new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10]))).toBe("image/jpeg");
    expect(sniffPlan(new TextEncoder().encode("%PDF-1.7\n"))).toBe("application/pdf");
    expect(sniffPlan(new TextEncoder().encode("<svg xmlns="))).toBeNull();
    expect(sniffPlan(new TextEncoder().encode("GIF89a"))).toBeNull();
    expect(sniffPlan(new Uint8Array([0x89, 0x50]))).toBeNull();
  });
});
