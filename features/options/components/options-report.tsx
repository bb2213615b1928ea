import { fmt, type UnitSystem } from "@/lib/units";
import type { OptionsComparison } from "@/lib/engine/compare-options";

const th = "border-b border-line py-1 pr-3 text-left text-xs font-medium text-muted";
const td = "border-b border-line py-1 pr-3 align-top";
const tdn = `${td} text-right font-mono tabular-nums whitespace-nowrap`;

/** The plant options in the calculation report: one row per plant, the design first. */
export function OptionsReportTable({ c, unitSystem: s, currency, weatherLabel, codesNotice }: { c: OptionsComparison; unitSystem: UnitSystem; currency: string; weatherLabel: string | null; codesNotice: string }) {
  const dash = <span className="text-muted">—</span>;
  return (
    <div className="report-block">
      <p className="mb-2 text-xs text-muted">
        The same rooms with each plant. {weatherLabel ? `Annual figures on ${weatherLabel}.` : "No weather year: annual figures and indirect TEWI are not computed."} TEWI over {c.years} years with a grid factor of {fmt.number(c.gridKgCo2PerKWh, 3)} kg CO₂/kWh by {c.tewiFormula}. Charges are estimates from internal volumes and fill fractions (defaults common practice unless entered).
      </p>
      <table className="w-full">
        <thead>
          <tr>
            <th className={th}>Plant</th>
            <th className={th}>Refrigerants (safety group, GWP)</th>
            <th className={`${th} text-right`}>Installed</th>
            <th className={`${th} text-right`}>Design kWe</th>
            <th className={`${th} text-right`}>kWh/year</th>
            <th className={`${th} text-right`}>Cost/year [{currency}]</th>
            <th className={`${th} text-right`}>Seasonal COP</th>
            <th className={`${th} text-right`}>Charge</th>
            <th className={`${th} text-right`}>TEWI direct / indirect [t CO₂e]</th>
            <th className={`${th} text-right`}>Code aid (max ratio)</th>
          </tr>
        </thead>
        <tbody>
          {c.options.map((o) => {
            const ratios = o.codeAid?.flatMap((a) => (a.ratio === undefined ? [] : [a.ratio])) ?? [];
            return (
              <tr key={o.id}>
                <td className={td}>
                  {o.name}
                  {o.isDesign ? " (design)" : ""}
                  {o.error ? <span className="block text-xs">⚠ {o.error.message}</span> : null}
                </td>
                <td className={td}>{o.refrigerants?.map((f) => `${f.id} (${f.safetyGroup}, ${f.gwp100})`).join(", ") ?? dash}</td>
                <td className={tdn}>{o.installedRefrigerationW !== undefined ? fmt.power(o.installedRefrigerationW, s, "refrigeration") : dash}</td>
                <td className={tdn}>{o.designElectricalW !== undefined ? fmt.power(o.designElectricalW, s, "electrical") : dash}</td>
                <td className={tdn}>{o.annual ? fmt.number(o.annual.kWh, 0) : dash}</td>
                <td className={tdn}>{o.annual?.cost ? fmt.number(o.annual.cost.total, 0) : dash}</td>
                <td className={tdn}>{o.annual?.seasonalCOP !== undefined ? fmt.cop(o.annual.seasonalCOP) : dash}</td>
                <td className={tdn}>{o.charge ? fmt.mass(o.charge.totalKg, s) : dash}</td>
                <td className={tdn}>{o.tewi ? `${fmt.number(o.tewi.directKg / 1000, 1)} / ${o.tewi.indirectKnown ? fmt.number(o.tewi.indirectKg / 1000, 1) : "—"}` : dash}</td>
                <td className={tdn}>{ratios.length ? `${fmt.number(Math.max(...ratios), 2)}${Math.max(...ratios) > 1 ? " ▲ over" : " ✓"}` : dash}</td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <p className="mt-2 text-xs">Code aid, not a code check: charge ÷ volume of the smallest occupied room a circuit serves, beside a practical limit (EN 378-1 Annex C values from memory unless entered). {codesNotice}</p>
    </div>
  );
}
