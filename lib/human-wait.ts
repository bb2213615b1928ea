/** "42 seconds", "3 minutes", "2 hours": a wait, for a person (rounded up). */
export function humanWait(seconds: number): string {
  const s = Math.max(1, Math.ceil(seconds));
  if (s < 90) return `${s} second${s === 1 ? "" : "s"}`;
  const m = Math.ceil(s / 60);
  if (m < 90) return `${m} minutes`;
  return `${Math.ceil(m / 60)} hours`;
}
