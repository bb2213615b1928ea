/**
 * Formula-injection guard for exported cells (OWASP "CSV injection"): text that begins with
 * = + - @ (or a tab / carriage return, which some spreadsheet programs skip before such a
 * character) gets a leading apostrophe, so a spreadsheet shows it as text and never runs it.
 */
const DANGEROUS_START = /^[=+\-@\t\r]/;

export function neutralise(text: string): string {
  return DANGEROUS_START.test(text) ? `'${text}` : text;
}

/** One CSV field (RFC 4180): neutralised text quoted when needed; numbers at full precision. */
export function csvField(v: number | string | null | undefined): string {
  if (v === null || v === undefined) return "";
  if (typeof v === "number") return Number.isFinite(v) ? String(v) : "";
  const t = neutralise(v);
  return /[",\r\n]/.test(t) ? `"${t.replace(/"/g, '""')}"` : t;
}
