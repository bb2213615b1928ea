/**
 * A stocking check in words: the verdict line and the e-mail text. Pure (formatting through
 * lib/units), so the page, the e-mail and the tests say the same thing.
 */
import type { CapacityCheck, StockingCheckResult, Verdict } from "@/lib/engine/stocking";
import { fmt, type UnitSystem } from "@/lib/units";

export const VERDICT_WORDS: Record<Verdict, string> = { fits: "Fits", tight: "Tight", shortfall: "Shortfall" };

export function checkLine(c: CapacityCheck, s: UnitSystem): string {
  const kind = c.quantity === "heat" ? "heat" : "refrigeration";
  const head = c.headroomW >= 0 ? `${fmt.power(c.headroomW, s, kind)} headroom` : `${fmt.power(-c.headroomW, s, kind)} short`;
  return `${c.item.label} (${c.basis === "daily" ? "daily load" : "peak hour"}): needs ${fmt.power(c.requiredW, s, kind)}, has ${fmt.power(c.availableW, s, kind)} — ${head}`;
}

/** "Shortfall: 3.8 kW(r) short at Produce room evaporators (daily load)". */
export function verdictLine(r: StockingCheckResult, s: UnitSystem): string {
  const l = r.limiting;
  if (!l) return `${VERDICT_WORDS[r.verdict]}: nothing to compare`;
  const kind = l.quantity === "heat" ? "heat" : "refrigeration";
  const amount = l.headroomW >= 0 ? `${fmt.power(l.headroomW, s, kind)} headroom` : `${fmt.power(-l.headroomW, s, kind)} short`;
  return `${VERDICT_WORDS[r.verdict]}: ${amount} at ${l.item.label} (${l.basis === "daily" ? "daily load" : "peak hour"}), the limiting item`;
}

export function solveLines(r: StockingCheckResult, roomNames: Record<string, string>): string[] {
  return r.solves.flatMap((sv) => {
    const name = roomNames[sv.roomId] ?? sv.roomId;
    const t = sv.maxTonnesPerDay;
    const h = sv.minPullDownHours;
    const tText = t.value === null ? "no intake fits" : t.status === "range-limit" ? `at least ${fmt.number(t.value, 2)} t/day` : `${fmt.number(t.value, 2)} t/day (±${t.tolerance} t/day)`;
    const hText = h.value === null ? "no pull-down up to 168 h fits" : h.status === "range-limit" ? `${fmt.number(h.value, 2)} h or less` : `${fmt.number(h.value, 2)} h (±${h.tolerance} h)`;
    return [`${name}: largest intake that fits ${tText}; shortest pull-down that fits ${hText}`];
  });
}

export function emailText(args: {
  name: string;
  facilityName: string;
  author: string;
  result: StockingCheckResult;
  unitSystem: UnitSystem;
  roomNames: Record<string, string>;
  link: string;
  note?: string;
}): { subject: string; text: string } {
  const r = args.result;
  const lines = [
    `${args.author} shares a stocking check for ${args.facilityName}.`,
    "",
    `Stocking check: ${args.name}`,
    verdictLine(r, args.unitSystem),
    "",
    ...(args.note ? [args.note, ""] : []),
    "Loads of the changed rooms:",
    ...r.rooms.map((x) => `  ${x.after.roomName}: daily ${fmt.power(x.before.dailyW, args.unitSystem)} → ${fmt.power(x.after.dailyW, args.unitSystem)}, peak ${fmt.power(x.before.peakW, args.unitSystem)} → ${fmt.power(x.after.peakW, args.unitSystem)}`),
    "",
    "Installed items:",
    ...r.checks.map((c) => `  ${checkLine(c, args.unitSystem)}`),
    "",
    ...solveLines(r, args.roomNames),
    r.safetyFactor.statement,
    "",
    `Open it in Rimeplan: ${args.link}`,
    "",
    "The check compares with the installed plant as recorded; final design must follow local codes and be checked by licensed practice.",
  ];
  return { subject: `Stocking check "${args.name}" — ${VERDICT_WORDS[r.verdict]}`, text: lines.join("\n") };
}
