"use client";
import { useState, type ReactNode } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, Tooltip, XAxis, YAxis } from "recharts";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { fmt, type UnitSystem } from "@/lib/units";
import { JobProgress, type JobDto } from "@/features/jobs";
import { BETTER, bestOf } from "@/lib/engine/compare-best";
import type { OptionFigures } from "@/lib/engine/compare-options";
import type { OptionsDto } from "../schema";

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
/** Series colours, distinguishable in both themes; each series also has its name in the legend and table. */
const SERIES = ["#3b82c4", "#d9822b", "#4a9a5b", "#a05fb5", "#c4493b", "#6b7f8f", "#b59a2a", "#2a9ab5", "#8f6b4a"];
const SAFETY_RANK: Record<string, number> = { A1: 0, A2L: 1, B1: 2, A2: 3, B2L: 4, B2: 5, A3: 6, B3: 7 };

interface Row {
  key: string;
  label: string;
  unit?: string;
  /** How the figure is made, shown on hover and to screen readers. */
  how: string;
  value: (o: OptionFigures) => number | undefined;
  show: (v: number, o: OptionFigures) => ReactNode;
  better?: "lower" | "higher";
}

function rows(s: UnitSystem, currency: string, years: number): Row[] {
  const kWh = (v: number) => `${fmt.number(v, 0)} kWh`;
  const tCo2 = (kg: number) => `${fmt.number(kg / 1000, 1)} t CO₂e`;
  return [
    { key: "installedRefrigerationW", label: "Installed refrigeration", how: "Room duty of each circuit × installed ÷ running compressor units, at design conditions", value: (o) => o.installedRefrigerationW, show: (v) => fmt.power(v, s, "refrigeration"), better: BETTER.installedRefrigerationW },
    { key: "designElectricalW", label: "Design-hour electrical", how: "Compressors, pumps, condenser and evaporator fans at the design hour", value: (o) => o.designElectricalW, show: (v) => fmt.power(v, s, "electrical"), better: BETTER.designElectricalW },
    { key: "peakKWe", label: "Peak electrical (year)", how: "Highest hourly electrical input of the year on the facility's weather", value: (o) => (o.annual ? o.annual.peakKWe * 1000 : undefined), show: (v) => fmt.power(v, s, "electrical"), better: BETTER.peakKWe },
    { key: "annualKWh", label: "Annual energy", how: "Hour-by-hour year of the plant on the facility's weather year", value: (o) => o.annual?.kWh, show: kWh, better: BETTER.annualKWh },
    { key: "annualCost", label: "Annual running cost", how: "Energy and demand charges of the facility's tariff", value: (o) => o.annual?.cost?.total, show: (v) => `${fmt.number(v, 0)} ${currency}`, better: BETTER.annualCost },
    { key: "seasonalCOP", label: "Seasonal COP", how: "Refrigeration ÷ electrical input over the year (Carnot COP of the same hours beside it)", value: (o) => o.annual?.seasonalCOP, show: (v, o) => `${fmt.cop(v)}${o.annual?.seasonalCarnotCOP ? ` (Carnot ${fmt.cop(o.annual.seasonalCarnotCOP)})` : ""}`, better: BETTER.seasonalCOP },
    { key: "chargeKg", label: "Refrigerant charge (estimate)", how: "Σ internal volume × (φ·ρ_liquid + (1 − φ)·ρ_vapour) over evaporators, condensers, receivers and pipework", value: (o) => o.charge?.totalKg, show: (v, o) => `${fmt.mass(v, s)}${o.refrigerants && o.refrigerants.length > 1 ? ` (${o.refrigerants.map((f) => `${f.id} ${fmt.mass(f.chargeKg, s)}`).join(", ")})` : ""}`, better: BETTER.chargeKg },
    { key: "gwpWeighted", label: "GWP (100 years)", how: "IPCC AR4 100-year GWP; charge-weighted when the plant uses more than one refrigerant", value: (o) => o.gwpWeighted, show: (v, o) => `${o.refrigerants?.map((f) => `${f.id} ${fmt.number(f.gwp100, 0)}`).join(" · ")}${o.refrigerants && o.refrigerants.length > 1 ? ` (weighted ${fmt.number(v, 1)})` : ""}`, better: BETTER.gwpWeighted },
    { key: "safety", label: "Safety group (ISO 817)", how: "Refrigerant safety classification; A1 ranks best here, then A2L, B1, A2, B2L, B2, A3, B3", value: (o) => (o.refrigerants?.length ? Math.max(...o.refrigerants.map((f) => SAFETY_RANK[f.safetyGroup] ?? 9)) : undefined), show: (_v, o) => o.refrigerants?.map((f) => `${f.id} ${f.safetyGroup}`).join(" · "), better: "lower" },
    { key: "tewiDirect", label: `TEWI direct (${years} years)`, how: "GWP·L·n + GWP·m·(1 − α_recovery), EN 378-1 Annex B", value: (o) => o.tewi?.directKg, show: tCo2, better: BETTER.tewiDirect },
    { key: "tewiIndirect", label: `TEWI indirect (${years} years)`, how: "n·E_annual·β, EN 378-1 Annex B", value: (o) => (o.tewi?.indirectKnown ? o.tewi.indirectKg : undefined), show: tCo2, better: BETTER.tewiIndirect },
    { key: "tewiTotal", label: `TEWI total (${years} years)`, how: "Direct + indirect", value: (o) => (o.tewi?.indirectKnown ? o.tewi.totalKg : undefined), show: tCo2, better: BETTER.tewiTotal },
    {
      key: "codeAidRatio",
      label: "Code aid: charge ÷ room volume",
      how: "Per circuit: charge ÷ volume of the smallest occupied room it serves, beside the practical limit (the highest ratio of the plant shown)",
      value: (o) => {
        const r = o.codeAid?.flatMap((a) => (a.ratio === undefined ? [] : [a.ratio]));
        return r && r.length ? Math.max(...r) : undefined;
      },
      show: (_v, o) => (
        <ul className="flex flex-col gap-0.5">
          {o.codeAid?.map((a) => (
            <li key={a.circuitId}>
              {a.verdict === "no-room" ? (
                <span className="text-muted">{o.circuits?.find((c) => c.id === a.circuitId)?.tag}: serves no room</span>
              ) : (
                <span className={a.verdict === "over" ? "text-warn" : ""}>
                  {a.verdict === "over" ? "▲ over" : "✓ within"} · {o.circuits?.find((c) => c.id === a.circuitId)?.tag} {fmt.number(a.chargePerVolumeKgM3!, 5)} kg/m³ in {a.room?.name} vs {fmt.number(a.limit.kgPerM3, 5)} kg/m³
                </span>
              )}
            </li>
          ))}
        </ul>
      ),
      better: BETTER.codeAidRatio,
    },
  ];
}

function ChartBlock({ title, table, children }: { title: string; table: ReactNode; children: ReactNode }) {
  return (
    <figure className="flex min-w-0 flex-col gap-1 rounded border border-line bg-surface p-3">
      <figcaption className="text-sm font-semibold">{title}</figcaption>
      {children}
      <details className="text-xs">
        <summary className="cursor-pointer text-accent">Table of this chart</summary>
        {table}
      </details>
    </figure>
  );
}

export function OptionsView({ ws, facilityId, unitSystem: s, initial, canEdit, canExport }: { ws: string; facilityId: string; unitSystem: UnitSystem; initial: OptionsDto; canEdit: boolean; canExport: boolean }) {
  const base = `/api/v1/workspaces/${ws}/facilities/${facilityId}/options`;
  const qc = useQueryClient();
  const q = useQuery({ queryKey: ["options", facilityId], queryFn: () => api<OptionsDto>(base), initialData: initial });
  const d = q.data;
  const opts = d.comparison.options;
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const [newName, setNewName] = useState("");
  const [from, setFrom] = useState("design");
  const [nameError, setNameError] = useState<string | undefined>();
  const [job, setJob] = useState<JobDto | null>(null);

  const m = useMutation({
    mutationFn: (a: { path: string; method: string; json?: unknown; done: string }) => api<{ version: number }>(a.path, { method: a.method, json: a.json }).then(() => a.done),
    onSuccess: (done) => {
      setMsg({ ok: true, text: done });
      void qc.invalidateQueries({ queryKey: ["options", facilityId] });
    },
    onError: (e) => setMsg({ ok: false, text: e instanceof ApiError ? e.message : String(e) }),
  });

  function create() {
    setNameError(undefined);
    if (!newName.trim()) return setNameError("Name: must not be empty (1 to 80 characters)");
    m.mutate({ path: base, method: "POST", json: { name: newName.trim(), ...(from !== "design" ? { from } : {}) }, done: `Option "${newName.trim()}" created from ${opts.find((o) => o.id === from)?.name}; a new version is saved.` }, {
      onSuccess: () => setNewName(""),
      onError: (e) => setNameError(e instanceof ApiError ? e.message : String(e)),
    });
  }

  async function exportXlsx() {
    setMsg(null);
    try {
      const r = await api<{ job: JobDto }>(`/api/v1/workspaces/${ws}/facilities/${facilityId}/exports`, { method: "POST", json: { format: "xlsx" } });
      setJob(r.job);
    } catch (e) {
      setMsg({ ok: false, text: e instanceof ApiError ? e.message : `The export could not be started (${String(e)}).` });
    }
  }

  const R = rows(s, d.currency, d.comparison.years);
  const annualKnown = opts.some((o) => o.annual);
  const monthly = MONTHS.map((mon, i) => ({ month: mon, ...Object.fromEntries(opts.filter((o) => o.annual).map((o) => [o.name, o.annual!.monthly[i]?.kWh ?? 0])) }));
  const tewiData = opts.filter((o) => o.tewi).map((o) => ({ name: o.name, direct: o.tewi!.directKg / 1000, indirect: o.tewi!.indirectKnown ? o.tewi!.indirectKg / 1000 : 0 }));
  const costData = Array.from({ length: d.comparison.years + 1 }, (_, y) => ({ year: y, ...Object.fromEntries(opts.filter((o) => o.costOverYears).map((o) => [o.name, o.costOverYears![y]])) }));
  const axis = { tick: { fontSize: 11, fill: "var(--muted)" } };
  const tip = { contentStyle: { background: "var(--surface)", border: "1px solid var(--line)", fontSize: 12 } };

  return (
    <main className="flex flex-col gap-4 p-4">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 className="text-base font-semibold">Plant options</h2>
          <p className="text-xs text-muted">
            The same rooms, different plant: {opts.length} plant{opts.length === 1 ? "" : "s"} compared · version {d.version} ·{" "}
            {d.weather ? `weather: ${d.weather.label}${d.weather.label.includes(String(d.weather.year)) ? "" : ` (${d.weather.year})`}` : "no weather year"} · computed on the server in {fmt.number(d.computeMs / 1000, 2)} s
          </p>
        </div>
        {canExport ? (
          <Button onClick={exportXlsx} disabled={job !== null && !["done", "failed"].includes(job.status)}>
            Export comparison (Excel)
          </Button>
        ) : null}
      </header>
      {job ? <JobProgress job={job} label="Excel export (schedule and options)" onFinished={setJob} /> : null}
      <p role="note" className="rounded border border-warn/60 bg-warn/10 p-2 text-xs">
        ⚠ The code aid sets each circuit's charge beside a practical limit; it is an aid, not a code check. Local codes govern and a licensed professional decides. {d.codesNotice}
      </p>
      {d.annualNote ? <p className="text-xs text-muted">ⓘ {d.annualNote}</p> : null}
      {msg ? (
        <p role={msg.ok ? "status" : "alert"} className={`text-sm ${msg.ok ? "text-ok" : "text-danger"}`}>
          {msg.ok ? "✓ " : "⚠ "}
          {msg.text}
        </p>
      ) : null}

      {opts.length === 1 ? (
        <p className="text-sm text-muted">
          Options compare plants for the same rooms — e.g. ammonia two-stage pumped, a CO₂/ammonia cascade, CO₂ transcritical, a DX plant on an HFO blend. {canEdit ? "Create the first option: it starts as a copy of the design plant." : "A designer creates them."}
        </p>
      ) : null}

      <div className="overflow-x-auto rounded border border-line">
        <table className="w-full text-sm" aria-label="Plant options compared">
          <thead className="bg-surface-2">
            <tr>
              <th scope="col" className="p-2 text-left">
                Figure
              </th>
              {opts.map((o) => (
                <th key={o.id} scope="col" className="p-2 text-left align-top" data-option={o.name}>
                  <span className="font-semibold">{o.name}</span>
                  {o.isDesign ? <span className="ml-2 rounded bg-accent/15 px-1.5 text-xs text-accent">design</span> : null}
                  {canEdit ? <OptionActions key={`${o.id}|${d.version}`} o={o} base={base} busy={m.isPending} run={m.mutate} /> : null}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {opts.some((o) => o.error || o.annualError) ? (
              <tr>
                <th scope="row" className="p-2 text-left font-medium">
                  Status
                </th>
                {opts.map((o) => (
                  <td key={o.id} className="p-2 align-top text-xs">
                    {o.error ? <span className="text-danger">⚠ {o.error.message}</span> : o.annualError ? <span className="text-warn">⚠ the year could not be computed: {o.annualError}</span> : "✓ computed"}
                  </td>
                ))}
              </tr>
            ) : null}
            {R.map((r) => {
              const values = opts.map((o) => (o.error ? undefined : r.value(o)));
              const best = r.better ? bestOf(values, r.better) : [];
              return (
                <tr key={r.key} className="border-t border-line" data-row={r.key}>
                  <th scope="row" className="p-2 text-left align-top font-medium" title={r.how}>
                    {r.label}
                    <span className="sr-only"> ({r.how})</span>
                  </th>
                  {opts.map((o, i) => {
                    const v = values[i];
                    const isBest = best.includes(i);
                    return (
                      <td key={o.id} className={`p-2 align-top tabular-nums ${isBest ? "font-semibold" : ""}`} data-best={isBest ? "true" : undefined}>
                        {v === undefined ? <span className="text-muted">—</span> : r.show(v, o)}
                        {isBest ? (
                          <span className="ml-1.5 whitespace-nowrap text-xs text-ok" aria-label="best in this row">
                            ★ best
                          </span>
                        ) : null}
                      </td>
                    );
                  })}
                </tr>
              );
            })}
            <tr className="border-t border-line text-xs text-muted">
              <th scope="row" className="p-2 text-left font-medium">
                Assumptions
              </th>
              {opts.map((o) => (
                <td key={o.id} className="p-2 align-top">
                  leak {fmt.number(o.assumptions.leakPctPerYear, 1)} %/year · recovery {fmt.number(o.assumptions.recoveryPct, 0)} % ·{" "}
                  {o.assumptions.practicalLimitKgM3 !== undefined ? `practical limit ${o.assumptions.practicalLimitKgM3} kg/m³ (${o.assumptions.practicalLimitSource ?? "entered"})` : "practical limit from the table"}
                  {canEdit ? <AssessmentForm key={`${o.id}|${d.version}`} o={o} base={base} limits={d.practicalLimits} busy={m.isPending} run={m.mutate} /> : null}
                </td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
      <p className="text-xs text-muted">
        ★ marks the best figure of each row (text, not colour alone). Charges are estimates from default internal volumes and fill fractions (common practice) unless entered; TEWI by {d.comparison.tewiFormula}; {d.comparison.years} years, grid {fmt.number(d.comparison.gridKgCo2PerKWh, 3)} kg CO₂/kWh.
      </p>

      {canEdit ? (
        <section aria-label="Create an option" className="flex flex-wrap items-end gap-3 rounded border border-line bg-surface p-3">
          <div className="w-64">
            <Field id="new-option-name" label="New option name" value={newName} maxLength={80} onChange={(e) => setNewName(e.target.value)} error={nameError} hint="1 to 80 characters, unique in this facility" />
          </div>
          <label className="flex flex-col gap-1 text-xs font-medium text-muted">
            Copy the plant of
            <select className="rounded border border-line bg-surface px-2 py-1.5 text-sm text-ink" value={from} onChange={(e) => setFrom(e.target.value)}>
              {opts.map((o) => (
                <option key={o.id} value={o.id}>
                  {o.name}
                </option>
              ))}
            </select>
          </label>
          <Button variant="primary" onClick={create} disabled={m.isPending}>
            Create option
          </Button>
          <StudyForm years={d.comparison.years} grid={d.comparison.gridKgCo2PerKWh} base={base} busy={m.isPending} run={m.mutate} />
        </section>
      ) : (
        <p className="text-xs text-muted">You can read the comparison; designers create, rename and delete options and make one the design.</p>
      )}

      <div className="grid gap-3 lg:grid-cols-3">
        <ChartBlock
          title="Annual energy by month"
          table={
            <table className="mt-1 tabular-nums">
              <thead>
                <tr>
                  <th className="pr-2 text-left">Month</th>
                  {opts.filter((o) => o.annual).map((o) => (
                    <th key={o.id} className="pr-2 text-right">{o.name} [kWh]</th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {monthly.map((r) => (
                  <tr key={r.month}>
                    <td className="pr-2">{r.month}</td>
                    {opts.filter((o) => o.annual).map((o) => (
                      <td key={o.id} className="pr-2 text-right">{fmt.number((r as Record<string, number | string>)[o.name] as number, 0)}</td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          }
        >
          {annualKnown ? (
            <BarChart responsive style={{ width: "100%", height: 260 }} data={monthly} margin={{ top: 8, right: 8, left: 8, bottom: 8 }}>
              <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
              <XAxis dataKey="month" {...axis} />
              <YAxis {...axis} label={{ value: "kWh", angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }} />
              <Tooltip {...tip} formatter={(v) => `${fmt.number(Number(v), 0)} kWh`} />
              <Legend wrapperStyle={{ fontSize: 11 }} />
              {opts.filter((o) => o.annual).map((o, i) => (
                <Bar key={o.id} dataKey={o.name} fill={SERIES[i % SERIES.length]} isAnimationActive={false} />
              ))}
            </BarChart>
          ) : (
            <p className="py-8 text-center text-xs text-muted">Needs the facility&apos;s weather year.</p>
          )}
        </ChartBlock>
        <ChartBlock
          title={`TEWI over ${d.comparison.years} years, direct and indirect`}
          table={
            <table className="mt-1 tabular-nums">
              <thead>
                <tr>
                  <th className="pr-2 text-left">Plant</th>
                  <th className="pr-2 text-right">Direct [t CO₂e]</th>
                  <th className="pr-2 text-right">Indirect [t CO₂e]</th>
                </tr>
              </thead>
              <tbody>
                {tewiData.map((r) => (
                  <tr key={r.name}>
                    <td className="pr-2">{r.name}</td>
                    <td className="pr-2 text-right">{fmt.number(r.direct, 1)}</td>
                    <td className="pr-2 text-right">{annualKnown ? fmt.number(r.indirect, 1) : "—"}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          }
        >
          <BarChart responsive style={{ width: "100%", height: 260 }} data={tewiData} margin={{ top: 8, right: 8, left: 8, bottom: 8 }}>
            <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
            <XAxis dataKey="name" {...axis} interval={0} />
            <YAxis {...axis} label={{ value: "t CO₂e", angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }} />
            <Tooltip {...tip} formatter={(v) => `${fmt.number(Number(v), 1)} t CO₂e`} />
            <Legend wrapperStyle={{ fontSize: 11 }} />
            <Bar dataKey="direct" name="Direct (leaks, end of life)" stackId="t" fill={SERIES[4]} isAnimationActive={false} />
            <Bar dataKey="indirect" name="Indirect (energy)" stackId="t" fill={SERIES[0]} isAnimationActive={false} />
          </BarChart>
        </ChartBlock>
        <ChartBlock
          title="Running cost over the years (undiscounted)"
          table={
            <table className="mt-1 tabular-nums">
              <thead>
                <tr>
                  <th className="pr-2 text-left">Year</th>
                  {opts.filter((o) => o.costOverYears).map((o) => (
                    <th key={o.id} className="pr-2 text-right">{o.name} [{d.currency}]</th>
                  ))}
                </tr>
              </thead>
              <tbody>
                {costData.map((r) => (
                  <tr key={r.year}>
                    <td className="pr-2">{r.year}</td>
                    {opts.filter((o) => o.costOverYears).map((o) => (
                      <td key={o.id} className="pr-2 text-right">{fmt.number((r as Record<string, number>)[o.name], 0)}</td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          }
        >
          {opts.some((o) => o.costOverYears) ? (
            <LineChart responsive style={{ width: "100%", height: 260 }} data={costData} margin={{ top: 8, right: 8, left: 8, bottom: 8 }}>
              <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
              <XAxis dataKey="year" {...axis} label={{ value: "years", position: "insideBottomRight", fill: "var(--muted)", fontSize: 11 }} />
              <YAxis {...axis} label={{ value: d.currency, angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }} />
              <Tooltip {...tip} formatter={(v) => `${fmt.number(Number(v), 0)} ${d.currency}`} />
              <Legend wrapperStyle={{ fontSize: 11 }} />
              {opts.filter((o) => o.costOverYears).map((o, i) => (
                <Line key={o.id} dataKey={o.name} stroke={SERIES[i % SERIES.length]} strokeDasharray={i % 2 ? "5 3" : undefined} dot={false} isAnimationActive={false} />
              ))}
            </LineChart>
          ) : (
            <p className="py-8 text-center text-xs text-muted">Needs the facility&apos;s weather year and tariff.</p>
          )}
        </ChartBlock>
      </div>

      <details className="rounded border border-line bg-surface p-3 text-sm">
        <summary className="cursor-pointer font-semibold">Charge estimate, part by part</summary>
        <p className="mt-1 text-xs text-muted">m = V·(φ·ρ_liquid + (1 − φ)·ρ_vapour) per part, densities from the property engine at the part&apos;s saturation state. Default volumes and fill fractions are common practice; {canEdit ? "enter the manufacturers' internal volumes and measured pipe runs to replace them (empty: the default)." : "a designer can replace them with the manufacturers' volumes."}</p>
        {opts.map((o) => (o.charge ? <ChargeTable key={`${o.id}|${d.version}`} o={o} s={s} canEdit={canEdit} base={base} busy={m.isPending} run={m.mutate} /> : null))}
      </details>
    </main>
  );
}

type Run = (a: { path: string; method: string; json?: unknown; done: string }) => void;

function OptionActions({ o, base, busy, run }: { o: OptionFigures; base: string; busy: boolean; run: Run }) {
  const [renaming, setRenaming] = useState(false);
  const [name, setName] = useState(o.name);
  const path = `${base}/${encodeURIComponent(o.id)}`;
  return (
    <div className="mt-1 flex flex-wrap gap-1 font-normal">
      {renaming ? (
        <form
          className="flex items-center gap-1"
          onSubmit={(e) => {
            e.preventDefault();
            run({ path, method: "PATCH", json: { name }, done: `Renamed to "${name.trim()}".` });
            setRenaming(false);
          }}
        >
          <label className="sr-only" htmlFor={`rename-${o.id}`}>
            New name of {o.name}
          </label>
          <input id={`rename-${o.id}`} className="w-36 rounded border border-line bg-surface px-1 py-0.5 text-xs" value={name} maxLength={80} onChange={(e) => setName(e.target.value)} />
          <Button type="submit" className="px-1.5 py-0.5 text-xs" disabled={busy}>
            Save
          </Button>
        </form>
      ) : (
        <Button className="px-1.5 py-0.5 text-xs" variant="ghost" onClick={() => setRenaming(true)} aria-label={`Rename ${o.name}`}>
          Rename
        </Button>
      )}
      {!o.isDesign ? (
        <>
          <Button className="px-1.5 py-0.5 text-xs" variant="ghost" disabled={busy} aria-label={`Make ${o.name} the design`} onClick={() => run({ path: `${path}/design`, method: "POST", done: `"${o.name}" is now the design (a new revision); the former design is kept as an option.` })}>
            Make design
          </Button>
          <Button
            className="px-1.5 py-0.5 text-xs"
            variant="danger"
            disabled={busy}
            aria-label={`Delete ${o.name}`}
            onClick={() => {
              if (window.confirm(`Delete the option "${o.name}"? The previous versions keep it.`)) run({ path, method: "DELETE", done: `Option "${o.name}" deleted.` });
            }}
          >
            Delete
          </Button>
        </>
      ) : null}
    </div>
  );
}

function AssessmentForm({ o, base, limits, busy, run }: { o: OptionFigures; base: string; limits: OptionsDto["practicalLimits"]; busy: boolean; run: Run }) {
  const [leak, setLeak] = useState(String(o.assumptions.leakPctPerYear));
  const [rec, setRec] = useState(String(o.assumptions.recoveryPct));
  const [limit, setLimit] = useState(o.assumptions.practicalLimitKgM3 === undefined ? "" : String(o.assumptions.practicalLimitKgM3));
  const [err, setErr] = useState<Record<string, string>>({});
  const refr = o.refrigerants?.map((f) => f.id) ?? [];
  function save(e: React.FormEvent) {
    e.preventDefault();
    const errors: Record<string, string> = {};
    const l = Number(leak);
    const r = Number(rec);
    const p = limit.trim() === "" ? null : Number(limit);
    if (!Number.isFinite(l) || l < 0 || l > 100) errors.leak = "Leak rate: must be between 0 and 100 %/year";
    if (!Number.isFinite(r) || r < 0 || r > 100) errors.rec = "Recovery: must be between 0 and 100 %";
    if (p !== null && (!Number.isFinite(p) || p <= 0 || p > 10)) errors.limit = "Practical limit: must be greater than 0 and at most 10 kg/m³";
    setErr(errors);
    if (Object.keys(errors).length) return;
    run({
      path: `${base}/${encodeURIComponent(o.id)}`,
      method: "PATCH",
      json: { leakPctPerYear: l, recoveryPct: r, practicalLimitKgM3: p, practicalLimitSource: p === null ? null : "entered by the designer" },
      done: `Assessment of "${o.name}" saved.`,
    });
  }
  return (
    <details className="mt-1">
      <summary className="cursor-pointer text-accent">Edit leak rate, recovery, practical limit</summary>
      <form className="mt-1 flex flex-col gap-2" onSubmit={save}>
        <Field id={`leak-${o.id}`} label="Leak rate" unit="%/year" inputMode="decimal" value={leak} onChange={(e) => setLeak(e.target.value)} error={err.leak} />
        <Field id={`rec-${o.id}`} label="Recovered at end of life" unit="%" inputMode="decimal" value={rec} onChange={(e) => setRec(e.target.value)} error={err.rec} />
        <Field id={`limit-${o.id}`} label="Practical limit (empty: the table's)" unit="kg/m³" inputMode="decimal" value={limit} onChange={(e) => setLimit(e.target.value)} error={err.limit} />
        <ul className="text-[11px]">
          {refr.map((id) => (
            <li key={id}>
              <button type="button" className="text-accent underline" onClick={() => setLimit(String(limits[id]?.kgPerM3 ?? ""))}>
                Use {id}: {limits[id]?.kgPerM3} kg/m³
              </button>{" "}
              — {limits[id]?.source}
            </li>
          ))}
        </ul>
        <Button type="submit" className="self-start px-2 py-1 text-xs" disabled={busy}>
          Save assessment
        </Button>
      </form>
    </details>
  );
}

function StudyForm({ years, grid, base, busy, run }: { years: number; grid: number; base: string; busy: boolean; run: Run }) {
  const [y, setY] = useState(String(years));
  const [g, setG] = useState(String(grid));
  const [err, setErr] = useState<Record<string, string>>({});
  return (
    <form
      className="ml-auto flex items-end gap-2"
      onSubmit={(e) => {
        e.preventDefault();
        const errors: Record<string, string> = {};
        const yy = Number(y);
        const gg = Number(g);
        if (!Number.isFinite(yy) || yy < 1 || yy > 60) errors.y = "Years: must be between 1 and 60";
        if (!Number.isFinite(gg) || gg < 0 || gg > 2) errors.g = "Grid emission factor: must be between 0 and 2 kg CO₂/kWh";
        setErr(errors);
        if (!Object.keys(errors).length) run({ path: base, method: "PATCH", json: { years: yy, gridKgCo2PerKWh: gg }, done: "Years and grid emission factor saved." });
      }}
    >
      <div className="w-24">
        <Field id="study-years" label="Years (n)" inputMode="numeric" value={y} onChange={(e) => setY(e.target.value)} error={err.y} />
      </div>
      <div className="w-40">
        <Field id="study-grid" label="Grid emission factor (β)" unit="kg CO₂/kWh" inputMode="decimal" value={g} onChange={(e) => setG(e.target.value)} error={err.g} />
      </div>
      <Button type="submit" disabled={busy}>
        Save
      </Button>
    </form>
  );
}

function ChargeTable({ o, s, canEdit, base, busy, run }: { o: OptionFigures; s: UnitSystem; canEdit: boolean; base: string; busy: boolean; run: Run }) {
  const parts = o.charge!.circuits.flatMap((c) => c.parts.map((p) => ({ c, p })));
  const [vals, setVals] = useState<Record<string, { vol: string; phi: string }>>(() =>
    Object.fromEntries(parts.map(({ p }) => [p.key, { vol: p.volumeSource === "user" ? String(p.volumeM3 * 1000) : "", phi: p.fractionSource === "user" ? String(p.liquidFraction) : "" }])),
  );
  const [err, setErr] = useState<string | null>(null);
  function save(e: React.FormEvent) {
    e.preventDefault();
    const overrides: { id: string; volumeM3?: number; liquidFraction?: number }[] = [];
    for (const { p } of parts) {
      const v = vals[p.key] ?? { vol: "", phi: "" };
      const o2: { id: string; volumeM3?: number; liquidFraction?: number } = { id: p.key };
      if (v.vol.trim() !== "") {
        const dm3 = Number(v.vol);
        if (!Number.isFinite(dm3) || dm3 < 0 || dm3 > 1_000_000) return setErr(`${p.label}: volume must be between 0 and 1 000 000 dm³`);
        o2.volumeM3 = dm3 / 1000;
      }
      if (v.phi.trim() !== "") {
        const f = Number(v.phi);
        if (!Number.isFinite(f) || f < 0 || f > 1) return setErr(`${p.label}: liquid fraction must be between 0 and 1`);
        o2.liquidFraction = f;
      }
      if (o2.volumeM3 !== undefined || o2.liquidFraction !== undefined) overrides.push(o2);
    }
    setErr(null);
    run({ path: `${base}/${encodeURIComponent(o.id)}`, method: "PATCH", json: { chargeOverrides: overrides }, done: `Charge volumes of "${o.name}" saved (${overrides.length} part${overrides.length === 1 ? "" : "s"} entered).` });
  }
  const set = (key: string, field: "vol" | "phi", v: string) => setVals((x) => ({ ...x, [key]: { ...(x[key] ?? { vol: "", phi: "" }), [field]: v } }));
  return (
    <form className="mt-3" onSubmit={save} aria-label={`Charge estimate of ${o.name}`}>
      <h3 className="text-sm font-semibold">
        {o.name}: {fmt.mass(o.charge!.totalKg, s)}
      </h3>
      <table className="w-full text-xs tabular-nums">
        <thead>
          <tr className="text-left text-muted">
            <th className="pr-2">Circuit</th>
            <th className="pr-2">Part</th>
            <th className="pr-2 text-right">Volume [dm³]</th>
            <th className="pr-2 text-right">Liquid fraction φ</th>
            <th className="pr-2 text-right">At</th>
            <th className="pr-2 text-right">Mean density [kg/m³]</th>
            <th className="pr-2 text-right">Charge [kg]</th>
            <th>Basis</th>
            {canEdit ? <th className="pl-2">Your volume [dm³] · φ</th> : null}
          </tr>
        </thead>
        <tbody>
          {parts.map(({ c, p }) => (
            <tr key={p.key} className="border-t border-line" data-part={p.key}>
              <td className="pr-2">{c.tag}</td>
              <td className="pr-2">{p.label}</td>
              <td className="pr-2 text-right">{fmt.number(p.volumeM3 * 1000, 1)}</td>
              <td className="pr-2 text-right">{fmt.number(p.liquidFraction, 2)}</td>
              <td className="pr-2 text-right">{fmt.temp(p.tempC, s)}</td>
              <td className="pr-2 text-right">{fmt.number(p.meanDensityKgM3, 1)}</td>
              <td className="pr-2 text-right">{fmt.number(p.massKg, 1)}</td>
              <td className="text-muted">{p.basis}</td>
              {canEdit ? (
                <td className="whitespace-nowrap pl-2">
                  <input aria-label={`${o.name} ${c.tag} ${p.label} volume, dm³`} inputMode="decimal" className="w-20 rounded border border-line bg-surface px-1" value={vals[p.key]?.vol ?? ""} onChange={(e) => set(p.key, "vol", e.target.value)} />{" "}
                  <input aria-label={`${o.name} ${c.tag} ${p.label} liquid fraction`} inputMode="decimal" className="w-14 rounded border border-line bg-surface px-1" value={vals[p.key]?.phi ?? ""} onChange={(e) => set(p.key, "phi", e.target.value)} />
                </td>
              ) : null}
            </tr>
          ))}
        </tbody>
      </table>
      {canEdit ? (
        <div className="mt-1 flex items-center gap-2">
          <Button type="submit" className="px-2 py-1 text-xs" disabled={busy}>
            Save volumes of {o.name}
          </Button>
          {err ? (
            <p role="alert" className="text-xs text-danger">
              ⚠ {err}
            </p>
          ) : null}
        </div>
      ) : null}
    </form>
  );
}
