/**
 * What an uploaded site plan really is, by its first bytes (a file name or a declared
 * content type proves nothing). PNG: 89 50 4E 47 0D 0A 1A 0A; JPEG: FF D8 FF; PDF: "%PDF-".
 */
export type PlanKind = "image/png" | "image/jpeg" | "application/pdf";

export function sniffPlan(bytes: Uint8Array): PlanKind | null {
  const starts = (sig: number[]) => sig.every((b, i) => bytes[i] === b);
  if (starts([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])) return "image/png";
  if (starts([0xff, 0xd8, 0xff])) return "image/jpeg";
  if (starts([0x25, 0x50, 0x44, 0x46, 0x2d])) return "application/pdf";
  return null;
}
