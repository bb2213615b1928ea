"use client";
import { useEffect, useState } from "react";
import { useRouter } from "next/navigation";
import { Bar, BarChart, CartesianGrid, ComposedChart, Legend, Line, Tooltip, XAxis, YAxis } from "recharts";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/api-client";
import { fmt, convert, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { JobProgress, type JobDto } from "@/features/jobs";
import type { AnnualFigures, AnnualResult } from "@/lib/engine/annual";
import type { EnergyViewDto } from "../queries";
import { sourceWords, type WeatherKind } from "../schema";

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];
const SPLIT: { key: keyof AnnualFigures["split"]; label: string; colour: string }[] = [
  { key: "compressors", label: "Compressors", colour: "oklch(0.55 0.1 220)" },
  { key: "condenserFans", label: "Condenser fans", colour: "oklch(0.7 0.12 80)" },
  { key: "evaporatorFans", label: "Evaporator fans", colour: "oklch(0.62 0.1 160)" },
  { key: "defrost", label: "Defrost", colour: "oklch(0.6 0.14 30)" },
  { key: "pumps", label: "Pumps & auxiliaries", colour: "oklch(0.55 0.08 300)" },
];

function ratio(a: number | null, b: number | null): number | null {
  return a !== null && b !== null && b > 0 ? a / b : null;
}

/** A figure with its label and, on expanding, how it was formed. */
function Figure({ label, value, sub, how, testId }: { label: string; value: string; sub?: string; how?: string[]; testId?: string }) {
  return (
    <div className="flex min-w-44 flex-col gap-0.5 rounded border border-line bg-surface p-2">
      <dt className="text-xs text-muted">{label}</dt>
      <dd className="font-mono text-base font-semibold" data-testid={testId}>
        {value}
      </dd>
      {sub ? <dd className="text-xs text-muted">{sub}</dd> : null}
      {how?.length ? (
        <dd>
          <details className="text-xs text-muted">
            <summary className="cursor-pointer">How</summary>
            <ul className="mt-1 list-disc pl-4">
              {how.map((h) => (
                <li key={h}>{h}</li>
              ))}
            </ul>
          </details>
        </dd>
      ) : null}
    </div>
  );
}

function ChartOrTable({ label, view, setView }: { label: string; view: "chart" | "table"; setView: (v: "chart" | "table") => void }) {
  return (
    <div role="group" aria-label={`${label}: chart or table`} className="ml-2 flex overflow-hidden rounded border border-line text-xs">
      {(["chart", "table"] as const).map((v) => (
        <button key={v} type="button" aria-pressed={view === v} className={`px-2 py-0.5 ${view === v ? "bg-accent text-accent-ink" : "bg-surface"}`} onClick={() => setView(v)}>
          {v === "chart" ? "Chart" : "Table"}
        </button>
      ))}
    </div>
  );
}

/** The Energy page's results: the stored year with its stamps, a run in progress, or what to do first. */
export function EnergyView({ ws, facilityId, initial, s }: { ws: string; facilityId: string; initial: EnergyViewDto; s: UnitSystem }) {
  const router = useRouter();
  const [data, setData] = useState(initial);
  const [job, setJob] = useState<JobDto | null>(initial.job);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const [monthView, setMonthView] = useState<"chart" | "table">("chart");
  const [condView, setCondView] = useState<"chart" | "table">("chart");
  const [inBrowser, setInBrowser] = useState(false);
  useEffect(() => {
    const t = setTimeout(() => setInBrowser(true), 0);
    return () => clearTimeout(t);
  }, []);
  useEffect(() => {
    setData(initial);
    setJob(initial.job);
  }, [initial]);

  const url = `/api/v1/workspaces/${ws}/facilities/${facilityId}/energy`;
  async function reload() {
    const d = await api<EnergyViewDto>(url);
    setData(d);
    setJob(d.job);
  }
  async function run() {
    setBusy(true);
    setError(null);
    try {
      setJob((await api<{ job: JobDto }>(url, { method: "POST" })).job);
    } catch (e) {
      setError(e instanceof ApiError ? e.message : "The request did not reach the server. Try again.");
    } finally {
      setBusy(false);
    }
  }

  const r = data.result;
  const a: AnnualResult | null = r?.annual ?? null;
  const running = job !== null && (job.status === "queued" || job.status === "running");

  return (
    <section aria-labelledby="energy-results-h" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 id="energy-results-h" className="text-base font-semibold">
          The year, hour by hour
        </h2>
        {data.canRun && data.weather ? (
          <Button onClick={run} disabled={busy || running}>
            {running ? "Running…" : busy ? "Starting…" : "Run the year"}
          </Button>
        ) : null}
      </div>
      <p className="text-sm" data-testid="weather-source">
        Weather:{" "}
        {data.weather ? (
          <>
            <strong>{data.weather.label}</strong> <span className="text-muted">— {[sourceWords(data.weather.kind, data.weather.label), `${data.weather.hours} hours`].filter(Boolean).join(", ")}</span>
          </>
        ) : (
          <span className="text-muted">none yet. {data.canRun ? "Upload an hourly file or enter monthly means below." : "An owner or designer gives the facility a weather year."}</span>
        )}
      </p>
      {error ? (
        <p role="alert" className="text-sm text-danger">
          ⚠ {error}
        </p>
      ) : null}
      {job ? (
        <JobProgress
          key={job.id}
          job={job}
          label="Annual energy run"
          onFinished={(j) => {
            if (j.status === "done") {
              void reload().then(() => router.refresh());
            } else setJob(j);
          }}
        />
      ) : null}
      {!job && data.failed ? (
        <div role="alert" className="rounded border border-danger/60 p-2 text-sm text-danger">
          ⚠ The last run failed: {data.failed.error ?? "no reason recorded"}
          {Array.isArray(data.failed.result?.fields) ? (
            <ul className="mt-1 list-disc pl-5 text-xs">
              {(data.failed.result!.fields as { field: string; message: string }[]).slice(0, 20).map((f) => (
                <li key={f.field + f.message}>
                  {f.field}: {f.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {data.current.modelError ? (
        <p role="alert" className="text-sm text-danger">
          ⚠ The model cannot be computed as it stands: {data.current.modelError}
        </p>
      ) : null}
      {r && data.stale.length ? (
        <p role="status" className="rounded border border-warn/60 p-2 text-sm">
          <span aria-hidden>⚠</span> <strong>Out of date</strong>: {data.stale.join("; ")}. {running ? "A new run is on its way." : data.canRun ? "Run the year again to update these figures." : "The figures update when the year is run again."}
        </p>
      ) : null}
      {!a ? (
        <div className="rounded border border-line bg-surface-2 p-4 text-sm">
          <p>
            This page shows the facility&apos;s year: energy per circuit and in total, split by compressors, fans, defrost and pumps; each month&apos;s energy and COP; the hours at each condensing
            temperature; the peak and its hour; the benchmarks per m³ and per tonne; seasonal COP beside the Carnot COP of the same hours; and the running cost.
          </p>
          <p className="mt-2 text-muted">{!data.weather ? "It needs a weather year first." : running ? "The first run is under way." : data.canRun ? "Run the year to see it." : "Nobody has run the year yet."}</p>
        </div>
      ) : (
        <Results a={a} r={r!} s={s} currency={data.currency} monthView={monthView} setMonthView={setMonthView} condView={condView} setCondView={setCondView} inBrowser={inBrowser} />
      )}
    </section>
  );
}

function Results({
  a,
  r,
  s,
  currency,
  monthView,
  setMonthView,
  condView,
  setCondView,
  inBrowser,
}: {
  a: AnnualResult;
  r: NonNullable<EnergyViewDto["result"]>;
  s: UnitSystem;
  currency: string;
  monthView: "chart" | "table";
  setMonthView: (v: "chart" | "table") => void;
  condView: "chart" | "table";
  setCondView: (v: "chart" | "table") => void;
  inBrowser: boolean;
}) {
  const f = a.facility;
  const eff = ratio(f.seasonalCOP, f.seasonalCarnotCOP);
  const months = f.monthly.map((m, i) => ({ month: MONTHS[i], kWh: Math.round(m.kWh), cop: m.meanCOP === null ? null : Math.round(m.meanCOP * 100) / 100 }));
  const cond = f.hoursAtCondensingC.filter((b) => b.hours > 0);
  const tLabel = UNIT_LABELS[s].temp;
  const condData = cond.map((b) => ({ t: `${fmt.number(convert.tempToDisplay(b.fromC, s), 0)}…${fmt.number(convert.tempToDisplay(b.toC, s), 0)}`, hours: b.hours }));
  const rows: { name: string; fig: AnnualFigures; facility?: boolean }[] = [{ name: "Facility", fig: f, facility: true }, ...a.circuits.map((c) => ({ name: c.name, fig: c as AnnualFigures }))];
  return (
    <div className="flex flex-col gap-5">
      <dl className="flex flex-wrap gap-2" aria-label="The year's figures">
        <Figure label="Energy per year (facility)" value={fmt.energyElectrical(f.kWh)} sub={`refrigeration delivered ${fmt.energyCooling(f.loadKWh, s)}`} how={f.trace.statements} testId="annual-kwh" />
        <Figure
          label="Running cost per year"
          value={fmt.money(f.cost.total, currency)}
          sub={f.cost.total === 0 ? "no tariff entered yet: set one under Tariff and operation" : `energy ${fmt.money(f.cost.energy, currency)} + demand ${fmt.money(f.cost.demand, currency)}`}
          testId="annual-cost"
        />
        <Figure
          label="Peak electrical demand"
          value={fmt.power(f.peakKWe * 1000, s, "electrical")}
          sub={`at ${f.peakHour.label}, ${fmt.temp(f.peakHour.dryBulbC, s)} and ${fmt.number(f.peakHour.rhPct, 0)} % RH`}
          how={[
            `${f.trace.peak.label}: load ${fmt.power(f.trace.peak.loadKW * 1000, s)}`,
            ...SPLIT.map((k) => `${k.label}: ${fmt.power(f.trace.peak.kWe[k.key] * 1000, s, "electrical")}`),
            ...(f.trace.peak.condensingC !== undefined ? [`condensing at ${fmt.temp(f.trace.peak.condensingC, s)}`] : []),
          ]}
          testId="peak-kwe"
        />
        <Figure
          label="Seasonal COP · seasonal Carnot COP"
          value={`${f.seasonalCOP === null ? "—" : fmt.cop(f.seasonalCOP)} · ${f.seasonalCarnotCOP === null ? "—" : fmt.cop(f.seasonalCarnotCOP)}`}
          sub={`second-law efficiency over the year ${eff === null ? "—" : fmt.percent(eff)}; with fans, defrost and pumps ${f.seasonalSystemCOP === null ? "—" : fmt.cop(f.seasonalSystemCOP)}`}
          testId="seasonal-cop"
        />
        <Figure label="Per refrigerated volume" value={f.kWhPerM3 === null ? "—" : fmt.energyPerVolume(f.kWhPerM3, s)} sub="a usual cold-store benchmark" testId="kwh-per-m3" />
        <Figure label="Per tonne handled" value={f.kWhPerTonne === null ? "— (no intake in the model)" : fmt.energyPerMass(f.kWhPerTonne, s)} sub="intake over the year" testId="kwh-per-t" />
        {f.unmetLoadKWh > 0 ? (
          <Figure label="⚠ Load not met" value={fmt.energyCooling(f.unmetLoadKWh, s)} sub={`in ${fmt.hours(f.hoursOverCapacity)} over the compressors' capacity`} />
        ) : null}
      </dl>

      <section aria-labelledby="split-h">
        <h3 id="split-h" className="mb-2 text-sm font-semibold text-muted">
          Energy per year by circuit and use, kWh(e)
        </h3>
        <div className="overflow-x-auto">
          <table className="text-xs" data-testid="split-table">
            <thead className="text-muted">
              <tr className="border-b border-line">
                <th className="py-1 pr-3 text-left font-normal">Circuit</th>
                {SPLIT.map((k) => (
                  <th key={k.key} className="px-2 text-right font-normal">
                    {k.label}
                  </th>
                ))}
                <th className="px-2 text-right font-normal">Total</th>
                <th className="px-2 text-right font-normal">Seasonal COP</th>
                <th className="px-2 text-right font-normal">Carnot COP</th>
                <th className="px-2 text-right font-normal">Peak</th>
                <th className="px-2 text-right font-normal">Cost</th>
              </tr>
            </thead>
            <tbody className="font-mono">
              {rows.map(({ name, fig, facility }) => (
                <tr key={name} className={`border-b border-line/60 ${facility ? "font-semibold" : ""}`}>
                  <td className="py-1 pr-3 font-sans">{name}</td>
                  {SPLIT.map((k) => (
                    <td key={k.key} className="px-2 text-right">
                      {fmt.number(fig.split[k.key], 0)}
                    </td>
                  ))}
                  <td className="px-2 text-right">{fmt.number(fig.kWh, 0)}</td>
                  <td className="px-2 text-right">{fig.seasonalCOP === null ? "—" : fmt.cop(fig.seasonalCOP)}</td>
                  <td className="px-2 text-right">{fig.seasonalCarnotCOP === null ? "—" : fmt.cop(fig.seasonalCarnotCOP)}</td>
                  <td className="px-2 text-right" title={fig.peakHour.label}>
                    {fmt.power(fig.peakKWe * 1000, s, "electrical")}
                  </td>
                  <td className="px-2 text-right">{fmt.money(fig.cost.total, currency)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      </section>

      <section aria-labelledby="monthly-h">
        <div className="mb-2 flex items-center gap-2">
          <h3 id="monthly-h" className="text-sm font-semibold text-muted">
            Each month: energy and mean COP
          </h3>
          <ChartOrTable label="Monthly energy" view={monthView} setView={setMonthView} />
        </div>
        {monthView === "chart" ? (
          <div className="w-full max-w-4xl" role="img" aria-label="Bars: the facility's kWh(e) each month; line: the month's mean COP. The table view lists the same values.">
            {inBrowser && (
              <ComposedChart responsive style={{ width: "100%", height: 300 }} data={months} margin={{ top: 8, right: 16, left: 8, bottom: 8 }}>
                <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
                <XAxis dataKey="month" tick={{ fontSize: 11, fill: "var(--muted)" }} />
                <YAxis yAxisId="e" tick={{ fontSize: 11, fill: "var(--muted)" }} label={{ value: "kWh(e)", angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }} />
                <YAxis yAxisId="c" orientation="right" tick={{ fontSize: 11, fill: "var(--muted)" }} label={{ value: "COP", angle: 90, position: "insideRight", fill: "var(--muted)", fontSize: 11 }} />
                <Tooltip contentStyle={{ background: "var(--surface)", border: "1px solid var(--line)", fontSize: 12 }} formatter={(v, n) => (n === "kWh" ? [`${fmt.number(Number(v), 0)} kWh(e)`, "Energy"] : [fmt.cop(Number(v)), "Mean COP"])} />
                <Legend wrapperStyle={{ fontSize: 11 }} formatter={(n) => (n === "kWh" ? "Energy, kWh(e)" : "Mean COP")} />
                <Bar yAxisId="e" dataKey="kWh" fill="oklch(0.55 0.1 220)" isAnimationActive={false} />
                <Line yAxisId="c" dataKey="cop" stroke="oklch(0.6 0.14 30)" strokeWidth={2} dot isAnimationActive={false} />
              </ComposedChart>
            )}
          </div>
        ) : (
          <table className="text-xs" data-testid="monthly-table">
            <thead className="text-muted">
              <tr className="border-b border-line">
                <th className="py-1 pr-3 text-left font-normal">Month</th>
                <th className="px-2 text-right font-normal">Energy</th>
                <th className="px-2 text-right font-normal">Refrigeration</th>
                <th className="px-2 text-right font-normal">Mean COP</th>
              </tr>
            </thead>
            <tbody className="font-mono">
              {f.monthly.map((m, i) => (
                <tr key={MONTHS[i]} className="border-b border-line/60">
                  <td className="py-1 pr-3 font-sans">{MONTHS[i]}</td>
                  <td className="px-2 text-right">{fmt.energyElectrical(m.kWh)}</td>
                  <td className="px-2 text-right">{fmt.energyCooling(m.loadKWh, s)}</td>
                  <td className="px-2 text-right">{m.meanCOP === null ? "—" : fmt.cop(m.meanCOP)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>

      <section aria-labelledby="cond-h">
        <div className="mb-2 flex items-center gap-2">
          <h3 id="cond-h" className="text-sm font-semibold text-muted">
            Hours at each condensing temperature ({tLabel}, 1 K bins; circuit-hours: each circuit adds its own hours)
          </h3>
          <ChartOrTable label="Condensing hours" view={condView} setView={setCondView} />
        </div>
        {cond.length === 0 ? (
          <p className="text-xs text-muted">No circuit rejects heat to a condenser (a cascade's low stage only), so there are no condensing hours to show.</p>
        ) : condView === "chart" ? (
          <div className="w-full max-w-4xl" role="img" aria-label="Bars: hours of the year (circuit-hours) at each condensing temperature. The table view lists the same values.">
            {inBrowser && (
              <BarChart responsive style={{ width: "100%", height: 260 }} data={condData} margin={{ top: 8, right: 16, left: 8, bottom: 8 }}>
                <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
                <XAxis dataKey="t" tick={{ fontSize: 10, fill: "var(--muted)" }} />
                <YAxis tick={{ fontSize: 11, fill: "var(--muted)" }} label={{ value: "hours", angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }} />
                <Tooltip contentStyle={{ background: "var(--surface)", border: "1px solid var(--line)", fontSize: 12 }} formatter={(v) => [`${fmt.number(Number(v), 0)} h`, "Hours"]} />
                <Bar dataKey="hours" fill="oklch(0.62 0.1 160)" isAnimationActive={false} />
              </BarChart>
            )}
          </div>
        ) : (
          <table className="text-xs">
            <thead className="text-muted">
              <tr className="border-b border-line">
                <th className="py-1 pr-3 text-left font-normal">Condensing</th>
                <th className="px-2 text-right font-normal">Hours</th>
              </tr>
            </thead>
            <tbody className="font-mono">
              {cond.map((b) => (
                <tr key={b.fromC} className="border-b border-line/60">
                  <td className="py-1 pr-3">
                    {fmt.temp(b.fromC, s)} to {fmt.temp(b.toC, s)}
                  </td>
                  <td className="px-2 text-right">{fmt.number(b.hours, 0)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>

      {a.peakHourTrace ? <PeakHour a={a} s={s} /> : null}

      {a.warnings.length ? (
        <section aria-labelledby="warn-h">
          <h3 id="warn-h" className="mb-1 text-sm font-semibold text-muted">
            Warnings
          </h3>
          <ul className="list-none text-xs">
            {a.warnings.map((w) => (
              <li key={w}>⚠ {w}</li>
            ))}
          </ul>
        </section>
      ) : null}
      <details className="text-xs text-muted">
        <summary className="cursor-pointer">Method and stamps</summary>
        <ul className="mt-1 list-disc pl-4">
          {a.statements.map((t) => (
            <li key={t}>{t}</li>
          ))}
        </ul>
        <p className="mt-2" data-testid="energy-stamps">
          Computed for model version {r.modelVersion} (input {r.inputHash}) with the weather &ldquo;{r.weather?.label ?? "a weather year since replaced"}&rdquo;{r.weather && sourceWords(r.weather.kind as WeatherKind, r.weather.label) ? ` (${sourceWords(r.weather.kind as WeatherKind, r.weather.label)})` : ""}, engine {r.engineVersion}, {a.method} method, {a.hours} hours
          {r.computeMs !== null ? `, in ${r.computeMs} ms` : ""}, on {new Date(r.createdAt).toISOString().slice(0, 16).replace("T", " ")} UTC.
        </p>
      </details>
    </div>
  );
}

/** The facility's peak hour taken apart: the weather and schedules of that hour, each circuit and each room. */
function PeakHour({ a, s }: { a: AnnualResult; s: UnitSystem }) {
  const t = a.peakHourTrace;
  const roomName = new Map(a.rooms.map((r) => [r.roomId, r.name]));
  return (
    <details className="text-xs" data-testid="peak-hour-trace">
      <summary className="cursor-pointer text-sm font-semibold text-muted">The peak hour taken apart: {t.label}</summary>
      <p className="mt-1">
        Outdoors {fmt.temp(t.dryBulbC, s)}, {fmt.number(t.rhPct, 0)} % RH, wet bulb {fmt.temp(t.wetBulbC, s)}; schedule multipliers: product × {fmt.number(t.factors.product, 2)}, people ×{" "}
        {fmt.number(t.factors.people, 2)}, lights × {fmt.number(t.factors.lights, 2)}.
      </p>
      <table className="mt-2">
        <thead className="text-muted">
          <tr className="border-b border-line">
            <th className="py-1 pr-3 text-left font-normal">Circuit</th>
            <th className="px-2 text-right font-normal">Load</th>
            <th className="px-2 text-right font-normal">Condensing</th>
            <th className="px-2 text-right font-normal">Sink</th>
            <th className="px-2 text-right font-normal">Part load</th>
            <th className="px-2 text-right font-normal">Power fraction</th>
            {SPLIT.map((k) => (
              <th key={k.key} className="px-2 text-right font-normal">
                {k.label}
              </th>
            ))}
            <th className="px-2 text-right font-normal">Work ÷ Carnot work</th>
          </tr>
        </thead>
        <tbody className="font-mono">
          {t.circuits.map((c) => (
            <tr key={c.circuitId} className="border-b border-line/60">
              <td className="py-1 pr-3 font-sans">{c.name}</td>
              <td className="px-2 text-right">{fmt.power(c.loadW, s)}</td>
              <td className="px-2 text-right">{c.condensingC === null ? "—" : fmt.temp(c.condensingC, s)}</td>
              <td className="px-2 text-right">{fmt.temp(c.sinkC, s)}</td>
              <td className="px-2 text-right">{fmt.percent(c.partLoadRatio)}</td>
              <td className="px-2 text-right">{fmt.percent(c.powerFraction)}</td>
              {SPLIT.map((k) => (
                <td key={k.key} className="px-2 text-right">
                  {fmt.power(c.kW[k.key] * 1000, s, "electrical")}
                </td>
              ))}
              <td className="px-2 text-right">{c.carnotWorkW > 0 ? fmt.number(c.workW / c.carnotWorkW, 2) : "—"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <table className="mt-2">
        <thead className="text-muted">
          <tr className="border-b border-line">
            <th className="py-1 pr-3 text-left font-normal">Room</th>
            <th className="px-2 text-right font-normal">Load served</th>
            <th className="px-2 text-right font-normal">Outside surfaces</th>
            <th className="px-2 text-right font-normal">Doors</th>
            <th className="px-2 text-right font-normal">Product</th>
            <th className="px-2 text-right font-normal">Fans</th>
            <th className="px-2 text-right font-normal">Defrosts that day</th>
          </tr>
        </thead>
        <tbody className="font-mono">
          {t.rooms.map((r) => (
            <tr key={r.roomId} className="border-b border-line/60">
              <td className="py-1 pr-3 font-sans">{roomName.get(r.roomId) ?? r.roomId}</td>
              <td className="px-2 text-right">{fmt.power(r.loadW, s)}</td>
              <td className="px-2 text-right">{fmt.power(r.outsideSurfacesW, s)}</td>
              <td className="px-2 text-right">{fmt.power(r.doorsW, s)}</td>
              <td className="px-2 text-right">{fmt.power(r.productW, s)}</td>
              <td className="px-2 text-right">{fmt.power(r.fansHeatW, s)}</td>
              <td className="px-2 text-right">{fmt.number(r.defrostsPerDay, 1)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}
