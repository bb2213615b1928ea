"use client";
import type { StockingCheckResult } from "@/lib/engine/stocking";
import { fmt, type UnitSystem } from "@/lib/units";
import { solveLines, verdictLine } from "../summary";
import { VerdictBadge } from "./verdict-badge";

const KIND_WORDS = { "room-evaporators": "Room evaporators", compressors: "Compressors (standby excluded)", condenser: "Condenser" } as const;

/** One check's verdict, every installed item on both bases, the loads before/after and the solver. */
export function ScenarioResult({ result: r, unitSystem: s, roomNames }: { result: StockingCheckResult; unitSystem: UnitSystem; roomNames: Record<string, string> }) {
  const pw = (w: number, heat: boolean) => fmt.power(w, s, heat ? "heat" : "refrigeration");
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3" role="status" aria-label="Verdict">
        <VerdictBadge verdict={r.verdict} size="lg" />
        <p className="text-sm">{verdictLine(r, s)}</p>
      </div>
      <p className="text-xs text-muted">
        {r.safetyFactor.statement} Tight means less than {fmt.percent(r.tightHeadroomFraction)} headroom over the required capacity.
      </p>

      <section aria-labelledby="rooms-h">
        <h3 id="rooms-h" className="mb-1 text-sm font-semibold">
          Changed rooms
        </h3>
        <table className="w-full text-sm">
          <thead className="text-left text-xs text-muted">
            <tr>
              <th className="py-1 pr-3 font-medium">Room</th>
              <th className="py-1 pr-3 font-medium">Set point</th>
              <th className="py-1 pr-3 text-right font-medium">Daily load before → after</th>
              <th className="py-1 pr-3 text-right font-medium">Peak hour before → after</th>
            </tr>
          </thead>
          <tbody className="font-mono tabular-nums">
            {r.rooms.map((x) => (
              <tr key={x.roomId} className="border-t border-line">
                <td className="py-1 pr-3 font-sans">{x.after.roomName}</td>
                <td className="py-1 pr-3">
                  {x.before.setPointC !== x.after.setPointC ? `${fmt.temp(x.before.setPointC, s)} → ` : ""}
                  {fmt.temp(x.after.setPointC, s)}
                </td>
                <td className="py-1 pr-3 text-right">
                  {pw(x.before.dailyW, false)} → {pw(x.after.dailyW, false)}
                </td>
                <td className="py-1 pr-3 text-right">
                  {pw(x.before.peakW, false)} → {pw(x.after.peakW, false)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section aria-labelledby="items-h">
        <h3 id="items-h" className="mb-1 text-sm font-semibold">
          Installed plant at the new conditions
        </h3>
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <thead className="text-left text-xs text-muted">
              <tr>
                <th className="py-1 pr-3 font-medium">Item</th>
                <th className="py-1 pr-3 font-medium">Basis</th>
                <th className="py-1 pr-3 text-right font-medium">Required</th>
                <th className="py-1 pr-3 text-right font-medium">Available</th>
                <th className="py-1 pr-3 text-right font-medium">Headroom</th>
                <th className="py-1 pr-3 font-medium">Verdict</th>
              </tr>
            </thead>
            <tbody className="font-mono tabular-nums">
              {r.checks.map((c) => {
                const limiting = r.limiting && r.limiting.item.id === c.item.id && r.limiting.item.kind === c.item.kind && r.limiting.basis === c.basis;
                const heat = c.quantity === "heat";
                return (
                  <tr key={`${c.item.kind}-${c.item.id}-${c.basis}`} className={`border-t border-line ${limiting ? "bg-surface-3" : ""}`}>
                    <td className="py-1 pr-3 font-sans">
                      <span title={KIND_WORDS[c.item.kind]}>{c.item.label}</span>
                      {c.item.tags.length ? <span className="ml-1 text-xs text-muted">{c.item.tags.join(", ")}</span> : null}
                      {limiting ? <span className="ml-1 text-xs font-semibold">· limiting</span> : null}
                    </td>
                    <td className="py-1 pr-3 font-sans text-xs">{c.basis === "daily" ? "daily load" : "peak hour"}{heat ? ", heat rejected" : ""}</td>
                    <td className="py-1 pr-3 text-right">{pw(c.requiredW, heat)}</td>
                    <td className="py-1 pr-3 text-right">{pw(c.availableW, heat)}</td>
                    <td className={`py-1 pr-3 text-right ${c.headroomW < 0 ? "text-danger" : ""}`}>
                      {c.headroomW < 0 ? `−${pw(-c.headroomW, heat)}` : pw(c.headroomW, heat)}
                      <span className="ml-1 text-xs text-muted">{Number.isFinite(c.headroomFraction) ? fmt.percent(c.headroomFraction) : ""}</span>
                    </td>
                    <td className="py-1 pr-3 font-sans">
                      <VerdictBadge verdict={c.verdict} />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      </section>

      {r.solves.length ? (
        <section aria-labelledby="solve-h">
          <h3 id="solve-h" className="mb-1 text-sm font-semibold">
            What still fits
          </h3>
          <ul className="list-disc pl-5 text-sm">
            {solveLines(r, roomNames).map((l) => (
              <li key={l}>{l}</li>
            ))}
          </ul>
          <p className="mt-1 text-xs text-muted">Solved by bisection on the same engine; each value fits, and one tolerance step beyond it does not.</p>
        </section>
      ) : null}
      <details className="text-xs text-muted">
        <summary className="cursor-pointer">How this is checked</summary>
        <ul className="mt-1 list-disc pl-5">
          <li>Required: the heat ledger of the changed rooms — daily load = 24-h energy × (1 + safety factor) / run hours; peak hour = the largest hourly load × (1 + safety factor).</li>
          <li>Available: the installed plant re-rated at the new conditions — evaporators by Q = UA·TD at the new TD; running compressors (standby excluded) from their swept volume at the new suction and condensing state; condensers by UA·ΔT at the new approach.</li>
          <li>Compressors carry the sum of their rooms (coincident peak hour); a condenser carries the heat its circuits reject at those loads.</li>
          <li>Shortfall when required exceeds available; tight under {fmt.percent(r.tightHeadroomFraction)} headroom; the item with the least relative headroom limits.</li>
        </ul>
      </details>
      {r.notes.length ? (
        <ul className="text-xs text-warn">
          {r.notes.map((n) => (
            <li key={n}>⚠ {n}</li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
