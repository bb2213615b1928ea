"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { ApiError, api } from "@/lib/api-client";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { SOURCE_WORDS, type WeatherDto } from "../schema";

const MONTHS = ["January", "February", "March", "April", "May", "June", "July", "August", "September", "October", "November", "December"];
type Problem = { field: string; message: string };

/** Sends the weather file as multipart (field `file`, optional `year`). */
async function upload(url: string, file: File, year: string): Promise<{ weather: WeatherDto }> {
  const fd = new FormData();
  fd.set("file", file);
  if (year.trim()) fd.set("year", year.trim());
  const res = await fetch(url, { method: "POST", body: fd });
  const data = await res.json().catch(() => ({}));
  if (!res.ok) {
    const e = data?.error ?? {};
    throw new ApiError(e.message ?? `Upload failed (${res.status})`, res.status, e.code ?? "unknown", e.field, e.fields, data);
  }
  return data;
}

function ErrorList({ error }: { error: { message: string; fields?: Problem[] } }) {
  return (
    <div role="alert" className="text-sm text-danger">
      <p>⚠ {error.message}</p>
      {error.fields?.length ? (
        <ul className="mt-1 max-h-48 list-disc overflow-auto pl-5 text-xs">
          {error.fields.map((f) => (
            <li key={f.field + f.message}>
              {f.field}: {f.message}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

/**
 * The facility's weather year: what it is (source always named) and its monthly means; for
 * owners and designers, an upload of an hourly file and a form of monthly means.
 */
export function WeatherPanel({ ws, facilityId, weather, canEdit, s }: { ws: string; facilityId: string; weather: WeatherDto | null; canEdit: boolean; s: UnitSystem }) {
  const router = useRouter();
  const url = `/api/v1/workspaces/${ws}/facilities/${facilityId}/weather`;
  const [file, setFile] = useState<File | null>(null);
  const [year, setYear] = useState("");
  const [busy, setBusy] = useState<"upload" | "monthly" | null>(null);
  const [error, setError] = useState<{ message: string; fields?: Problem[] } | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [showMonthly, setShowMonthly] = useState(false);
  const L = UNIT_LABELS[s];

  async function send() {
    if (!file) return;
    setBusy("upload");
    setError(null);
    setDone(null);
    try {
      const r = await upload(url, file, year);
      setDone(`Stored: ${r.weather.label}. The year is being run with it.`);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? { message: e.message, fields: e.fields } : { message: "The upload did not reach the server. Try again." });
    } finally {
      setBusy(null);
    }
  }

  return (
    <section aria-labelledby="weather-h" className="flex flex-col gap-3 rounded border border-line bg-surface-2 p-4">
      <h2 id="weather-h" className="text-base font-semibold">
        Weather year
      </h2>
      {weather ? (
        <div className="flex flex-col gap-2 text-sm">
          <p>
            <strong>{weather.label}</strong> — {SOURCE_WORDS[weather.kind]}; {weather.year}, {weather.hours} hours, 1 January a{" "}
            {["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"][weather.startWeekday]}
            {weather.pressurePa ? `, mean pressure ${fmt.pressure(weather.pressurePa, s)}` : ""}.
          </p>
          {weather.kind === "monthly" ? <p className="text-xs text-warn">⚠ An approximation: each month repeats its mean day, so the year&apos;s peaks are milder than a real year&apos;s.</p> : null}
          {weather.kind === "demo" ? <p className="text-xs text-muted">Invented for the demo: not measured weather of any place.</p> : null}
          {weather.notes.length ? (
            <ul className="list-disc pl-5 text-xs text-muted">
              {weather.notes.map((n) => (
                <li key={n}>{n}</li>
              ))}
            </ul>
          ) : null}
          <details>
            <summary className="cursor-pointer text-xs text-muted">Monthly means of this year</summary>
            <table className="mt-1 text-xs" data-testid="weather-months">
              <thead className="text-muted">
                <tr className="border-b border-line">
                  <th className="py-1 pr-3 text-left font-normal">Month</th>
                  <th className="px-2 text-right font-normal">Mean dry bulb</th>
                  <th className="px-2 text-right font-normal">Lowest</th>
                  <th className="px-2 text-right font-normal">Highest</th>
                  <th className="px-2 text-right font-normal">Mean RH</th>
                </tr>
              </thead>
              <tbody className="font-mono">
                {weather.summary.months.map((m) => (
                  <tr key={m.month} className="border-b border-line/60">
                    <td className="py-1 pr-3 font-sans">{MONTHS[m.month - 1]}</td>
                    <td className="px-2 text-right">{fmt.temp(m.meanDryBulbC, s)}</td>
                    <td className="px-2 text-right">{fmt.temp(m.minDryBulbC, s)}</td>
                    <td className="px-2 text-right">{fmt.temp(m.maxDryBulbC, s)}</td>
                    <td className="px-2 text-right">{fmt.number(m.meanRhPct, 1)} %</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </details>
        </div>
      ) : (
        <p className="text-sm text-muted">No weather year yet: the annual energy needs one — an hourly file, or monthly means.</p>
      )}
      {canEdit ? (
        <>
          <p className="text-xs text-muted">
            Upload an hourly year (8760 hours, or 8784 in a leap year), up to 4 MB: an <strong>EPW</strong> weather file, or a <strong>CSV</strong> with a time column (<code className="font-mono">Timestamp</code> in ISO 8601, or{" "}
            <code className="font-mono">Hour</code> 1…8760), a dry bulb column and one of relative humidity, wet bulb or dew point, units in the header, e.g.{" "}
            <code className="font-mono">Timestamp, Dry bulb [°C], Relative humidity [%]</code>. A file with any problem is refused with its rows named; nothing is stored.
          </p>
          <div className="flex flex-wrap items-end gap-3">
            <div className="flex flex-col gap-1">
              <label htmlFor="weather-file" className="text-xs font-medium text-muted">
                Weather file (.csv or .epw)
              </label>
              <input
                id="weather-file"
                type="file"
                accept=".csv,.epw,.txt,text/csv"
                className="text-sm"
                onChange={(e) => {
                  setFile(e.target.files?.[0] ?? null);
                  setError(null);
                  setDone(null);
                }}
              />
            </div>
            <div className="flex flex-col gap-1">
              <label htmlFor="weather-year" className="text-xs font-medium text-muted">
                Year (only for a file of hours without dates)
              </label>
              <input id="weather-year" inputMode="numeric" value={year} onChange={(e) => setYear(e.target.value)} placeholder="2025" className="w-24 rounded border border-line bg-surface px-2 py-1.5 text-sm" />
            </div>
            <Button variant="primary" onClick={send} disabled={!file || busy !== null}>
              {busy === "upload" ? "Reading…" : "Upload weather file"}
            </Button>
            <Button onClick={() => setShowMonthly((v) => !v)} aria-expanded={showMonthly}>
              {showMonthly ? "Hide monthly means" : "Enter monthly means instead"}
            </Button>
          </div>
          {error ? <ErrorList error={error} /> : null}
          {done ? (
            <p role="status" className="text-sm text-ok">
              ✓ {done}
            </p>
          ) : null}
          {showMonthly ? (
            <MonthlyForm
              url={url}
              s={s}
              L={L}
              initial={weather?.kind === "monthly" ? (weather.monthly as MonthlyInitial | null) : null}
              onSaved={(label) => {
                setDone(`Stored: ${label}. The year is being run with it.`);
                setShowMonthly(false);
                router.refresh();
              }}
            />
          ) : null}
        </>
      ) : null}
    </section>
  );
}

type MonthlyInitial = { year?: number; label?: string; meanDryBulbC: number[]; dailyRangeK: number[]; meanRhPct: number[] };

const MONTHLY_RANGES = { meanDryBulbC: [-50, 50], dailyRangeK: [0, 30], meanRhPct: [1, 100] } as const;

/** Twelve months of mean dry bulb, mean daily range and mean RH, typed in the user's units and sent in SI. */
function MonthlyForm({ url, s, L, initial, onSaved }: { url: string; s: UnitSystem; L: Record<string, string>; initial: MonthlyInitial | null; onSaved: (label: string) => void }) {
  const show = (v: number | undefined, f: (x: number) => number) => (v === undefined ? "" : String(Math.round(f(v) * 10) / 10));
  const [label, setLabel] = useState(initial?.label ?? "");
  const [year, setYear] = useState(String(initial?.year ?? 2025));
  const [rows, setRows] = useState(
    MONTHS.map((_, i) => ({
      t: show(initial?.meanDryBulbC[i], (x) => convert.tempToDisplay(x, s)),
      r: show(initial?.dailyRangeK[i], (x) => convert.tempDiffToDisplay(x, s)),
      h: show(initial?.meanRhPct[i], (x) => x),
    })),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [top, setTop] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const n = (x: string) => (x.trim() === "" ? Number.NaN : Number(x.replace(",", ".")));

  async function save(e: React.FormEvent) {
    e.preventDefault();
    const errs: Record<string, string> = {};
    const climate = { label: label.trim() || "monthly means", meanDryBulbC: [] as number[], dailyRangeK: [] as number[], meanRhPct: [] as number[] };
    rows.forEach((row, i) => {
      const t = n(row.t);
      const r = n(row.r);
      const h = n(row.h);
      const tc = convert.tempFromDisplay(t, s);
      const rk = convert.tempDiffFromDisplay(r, s);
      const [tl, th] = MONTHLY_RANGES.meanDryBulbC;
      if (!Number.isFinite(t) || tc < tl || tc > th) errs[`meanDryBulbC.${i}`] = `${MONTHS[i]} mean dry bulb must be between ${fmt.temp(tl, s)} and ${fmt.temp(th, s)}`;
      if (!Number.isFinite(r) || rk < 0 || rk > 30) errs[`dailyRangeK.${i}`] = `${MONTHS[i]} mean daily range must be between 0 and ${fmt.tempDiff(30, s)}`;
      if (!Number.isFinite(h) || h < 1 || h > 100) errs[`meanRhPct.${i}`] = `${MONTHS[i]} mean relative humidity must be between 1 and 100 %`;
      climate.meanDryBulbC.push(Math.round(tc * 100) / 100);
      climate.dailyRangeK.push(Math.round(rk * 100) / 100);
      climate.meanRhPct.push(h);
    });
    const y = Number(year);
    if (!Number.isInteger(y) || y < 1900 || y > 2100) errs.year = "year must be a whole number from 1900 to 2100";
    setErrors(errs);
    if (Object.keys(errs).length) {
      setTop(`${Object.keys(errs).length} value${Object.keys(errs).length === 1 ? "" : "s"} to correct; nothing was saved.`);
      return;
    }
    setBusy(true);
    setTop(null);
    try {
      const r = await api<{ weather: WeatherDto }>(url, { method: "PUT", json: { year: y, climate } });
      onSaved(r.weather.label);
    } catch (err) {
      if (err instanceof ApiError) {
        const m: Record<string, string> = {};
        for (const f of err.fields ?? []) m[f.field.replace(/^climate\./, "")] = f.message;
        setErrors(m);
        setTop(err.message);
      } else setTop("The request did not reach the server. Try again.");
    } finally {
      setBusy(false);
    }
  }

  const cell = (i: number, k: "t" | "r" | "h", key: string, what: string) => (
    <td className="px-1 py-0.5">
      <input
        aria-label={`${MONTHS[i]} ${what}`}
        aria-invalid={errors[`${key}.${i}`] ? true : undefined}
        inputMode="decimal"
        value={rows[i][k]}
        onChange={(e) => setRows(rows.map((r, j) => (j === i ? { ...r, [k]: e.target.value } : r)))}
        className={`w-20 rounded border bg-surface px-1.5 py-0.5 text-right text-sm ${errors[`${key}.${i}`] ? "border-danger" : "border-line"}`}
      />
    </td>
  );

  return (
    <form onSubmit={save} className="flex flex-col gap-2 rounded border border-line bg-surface p-3" aria-labelledby="monthly-h">
      <h3 id="monthly-h" className="text-sm font-semibold">
        Monthly means (a sine-day year — an approximation)
      </h3>
      <p className="text-xs text-muted">
        Each day of a month repeats the month&apos;s mean day: the dry bulb follows a cosine through the mean daily range, lowest at 03:00 and highest at 15:00, with the month&apos;s moisture held
        constant. Day-to-day weather is not represented, so the peaks come out milder than in a real year.
      </p>
      <div className="flex flex-wrap gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor="monthly-label" className="text-xs font-medium text-muted">
            Name of the climate
          </label>
          <input id="monthly-label" value={label} maxLength={200} onChange={(e) => setLabel(e.target.value)} placeholder="e.g. nearest station, long-term means" className="w-72 rounded border border-line bg-surface px-2 py-1 text-sm" />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="monthly-year" className="text-xs font-medium text-muted">
            Calendar year
          </label>
          <input id="monthly-year" inputMode="numeric" value={year} onChange={(e) => setYear(e.target.value)} aria-invalid={errors.year ? true : undefined} className="w-24 rounded border border-line bg-surface px-2 py-1 text-sm" />
        </div>
      </div>
      <table className="text-xs">
        <thead className="text-muted">
          <tr>
            <th className="pr-2 text-left font-normal">Month</th>
            <th className="px-1 text-right font-normal">Mean dry bulb ({L.temp})</th>
            <th className="px-1 text-right font-normal">Mean daily range ({L.tempDiff})</th>
            <th className="px-1 text-right font-normal">Mean RH (%)</th>
          </tr>
        </thead>
        <tbody>
          {MONTHS.map((m, i) => (
            <tr key={m}>
              <td className="pr-2">{m}</td>
              {cell(i, "t", "meanDryBulbC", "mean dry bulb")}
              {cell(i, "r", "dailyRangeK", "mean daily range")}
              {cell(i, "h", "meanRhPct", "mean relative humidity")}
            </tr>
          ))}
        </tbody>
      </table>
      {top ? <ErrorList error={{ message: top, fields: Object.entries(errors).map(([field, message]) => ({ field, message })) }} /> : null}
      <div>
        <Button type="submit" variant="primary" disabled={busy}>
          {busy ? "Building the year…" : "Build the year from these means"}
        </Button>
      </div>
    </form>
  );
}
