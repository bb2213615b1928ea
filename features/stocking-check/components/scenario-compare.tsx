"use client";
import { fmt, type UnitSystem } from "@/lib/units";
import type { ScenarioDto } from "../schema";
import { VerdictBadge } from "./verdict-badge";

/** Two or more checks side by side: verdict, limiting item and each item's headroom. */
export function ScenarioCompare({ scenarios, unitSystem: s }: { scenarios: ScenarioDto[]; unitSystem: UnitSystem }) {
  const keys = new Map<string, string>();
  for (const sc of scenarios) for (const c of sc.result?.checks ?? []) keys.set(`${c.item.kind}|${c.item.id}|${c.basis}`, `${c.item.label} (${c.basis === "daily" ? "daily" : "peak hour"})`);
  const cell = (sc: ScenarioDto, key: string) => sc.result?.checks.find((c) => `${c.item.kind}|${c.item.id}|${c.basis}` === key);
  return (
    <section aria-labelledby="compare-h" className="overflow-x-auto">
      <h2 id="compare-h" className="mb-2 text-base font-semibold">
        Side by side
      </h2>
      <table className="text-sm">
        <thead>
          <tr className="text-left">
            <th className="py-1 pr-4 text-xs font-medium text-muted">Headroom (− = short)</th>
            {scenarios.map((sc) => (
              <th key={sc.id} scope="col" className="py-1 pr-4 font-semibold">
                {sc.name}
                <div className="text-xs font-normal text-muted">{sc.author?.name ?? ""}</div>
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="font-mono tabular-nums">
          <tr className="border-t border-line">
            <th scope="row" className="py-1 pr-4 text-left font-sans font-medium">
              Verdict
            </th>
            {scenarios.map((sc) => (
              <td key={sc.id} className="py-1 pr-4 font-sans">
                {sc.verdict ? <VerdictBadge verdict={sc.verdict} /> : "—"}
              </td>
            ))}
          </tr>
          <tr className="border-t border-line">
            <th scope="row" className="py-1 pr-4 text-left font-sans font-medium">
              Limiting item
            </th>
            {scenarios.map((sc) => (
              <td key={sc.id} className="py-1 pr-4 font-sans text-xs">
                {sc.result?.limiting ? `${sc.result.limiting.item.label}, ${sc.result.limiting.basis}` : "—"}
              </td>
            ))}
          </tr>
          {[...keys].map(([key, label]) => (
            <tr key={key} className="border-t border-line">
              <th scope="row" className="py-1 pr-4 text-left font-sans font-normal">
                {label}
              </th>
              {scenarios.map((sc) => {
                const c = cell(sc, key);
                if (!c) return <td key={sc.id}>—</td>;
                const kind = c.quantity === "heat" ? "heat" : "refrigeration";
                return (
                  <td key={sc.id} className={`py-1 pr-4 text-right ${c.headroomW < 0 ? "text-danger" : c.verdict === "tight" ? "text-warn" : ""}`}>
                    {c.headroomW < 0 ? `−${fmt.power(-c.headroomW, s, kind)}` : fmt.power(c.headroomW, s, kind)}
                    <span className="ml-1 text-xs" aria-label={c.verdict}>
                      {c.verdict === "shortfall" ? "✕" : c.verdict === "tight" ? "▲" : "✓"}
                    </span>
                  </td>
                );
              })}
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}
