"use client";
import { memo } from "react";
import type { FacilityResult } from "@/lib/engine/model";
import { fmt, type UnitSystem } from "@/lib/units";

/** The live totals, rooms and circuits under the canvas (collapsible); redrawn only when the results change. */
export const ResultsPanel = memo(function ResultsPanel({ result, s, ms, onSelect }: { result: FacilityResult | null; s: UnitSystem; ms: number | null; onSelect: (nid: string) => void }) {
  if (!result)
    return (
      <div className="grid grid-cols-3 gap-3 p-3" aria-busy="true">
        {[0, 1, 2].map((i) => (
          <div key={i} className="h-16 animate-pulse rounded bg-surface-3" />
        ))}
      </div>
    );
  const t = result.ledger.totals;
  const p = result.plant.totals;
  return (
    <div className="grid gap-4 p-3 text-xs lg:grid-cols-[auto_1fr_1fr]" aria-live="polite">
      <dl className="grid grid-cols-[auto_auto] content-start gap-x-4 gap-y-0.5">
        <dt className="text-muted">Required capacity</dt>
        <dd className="text-right font-mono" data-total="required">{fmt.power(t.requiredCapacityW, s)}</dd>
        <dt className="text-muted">Refrigeration (plant)</dt>
        <dd className="text-right font-mono">{fmt.power(p.refrigerationW, s)}</dd>
        <dt className="text-muted">Compressor shaft</dt>
        <dd className="text-right font-mono">{fmt.power(p.shaftPowerW, s, "electrical").replace("kW(e)", "kW shaft")}</dd>
        <dt className="text-muted">Electrical input</dt>
        <dd className="text-right font-mono">{fmt.power(p.electricalW, s, "electrical")}</dd>
        <dt className="text-muted">Heat rejected</dt>
        <dd className="text-right font-mono">{fmt.power(p.heatRejectedW, s, "heat")}</dd>
        <dt className="text-muted">24-h energy</dt>
        <dd className="text-right font-mono">{fmt.number(t.totalEnergyKWhPerDay, 0)} kWh/day</dd>
        <dd className="col-span-2 pt-1 text-[11px] text-muted">
          Computed in your browser in {fmt.number(ms ?? 0, 0)} ms · engine {result.engineVersion}
        </dd>
      </dl>
      <table className="w-full self-start">
        <caption className="text-left font-semibold text-muted">Rooms</caption>
        <thead className="text-muted">
          <tr>
            <th className="text-left font-normal">Room</th>
            <th className="text-right font-normal">Design</th>
            <th className="text-right font-normal">Energy</th>
          </tr>
        </thead>
        <tbody>
          {result.ledger.rooms.map((r) => (
            <tr key={r.roomId}>
              <td>
                <button className="text-accent hover:underline" onClick={() => onSelect(`room:${r.roomId}`)}>
                  {r.roomName}
                </button>
              </td>
              <td className="text-right font-mono">{fmt.power(r.designCapacityW, s)}</td>
              <td className="text-right font-mono">{fmt.number(r.totalEnergyKWhPerDay, 0)} kWh/d</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex flex-col gap-2">
        <table className="w-full">
          <caption className="text-left font-semibold text-muted">Circuits</caption>
          <thead className="text-muted">
            <tr>
              <th className="text-left font-normal">Circuit</th>
              <th className="text-right font-normal">Suction</th>
              <th className="text-right font-normal">Cond.</th>
              <th className="text-right font-normal">COP</th>
              <th className="text-right font-normal">Shaft</th>
            </tr>
          </thead>
          <tbody>
            {result.plant.circuits.map((c) => (
              <tr key={c.id}>
                <td>
                  <button className="text-accent hover:underline" onClick={() => onSelect(`circuit:${c.id}`)}>
                    {c.tag}
                  </button>{" "}
                  <span className="text-muted">{c.refrigerant}</span>
                </td>
                <td className="text-right font-mono">{fmt.temp(c.suctionC, s)}</td>
                <td className="text-right font-mono">{fmt.temp(c.condensingC, s)}</td>
                <td className="text-right font-mono">{fmt.cop(c.cop)}</td>
                <td className="text-right font-mono">{fmt.power(c.shaftPowerW, s, "electrical").replace("kW(e)", "kW")}</td>
              </tr>
            ))}
          </tbody>
        </table>
        {result.plant.warnings.length ? (
          <ul className="flex flex-col gap-0.5">
            {result.plant.warnings.map((w, i) => (
              <li key={i} className={w.severity === "warning" ? "text-warn" : "text-muted"}>
                {w.severity === "warning" ? "⚠ Warning:" : "ℹ Note:"} {w.message}
              </li>
            ))}
          </ul>
        ) : null}
        {result.plant.cautions.length ? (
          <p className="text-[11px] text-muted">
            Safety: {result.plant.cautions.map((c) => `${c.refrigerant} (${c.safetyGroup})`).join(", ")} — see the Circuits view. {result.plant.codesNotice}
          </p>
        ) : null}
      </div>
    </div>
  );
});
