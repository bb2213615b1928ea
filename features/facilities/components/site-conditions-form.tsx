"use client";
import { useState } from "react";
import { Field } from "@/components/form/field";
import { Button } from "@/components/ui/button";
import { convert, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { SITE_RANGES, type SiteConditions } from "../schema";

type Humidity = "wetBulb" | "rh";

function show(v: number | null | undefined, f: (x: number) => number): string {
  return v === null || v === undefined ? "" : String(Math.round(f(v) * 100) / 100);
}

/**
 * Site design conditions, typed in the user's units and sent in SI. Errors come back from the
 * server's schema, named by field, and are shown beside it; what was typed stays.
 */
export function SiteConditionsForm({
  initial,
  unitSystem,
  errors,
  disabled,
  submitLabel,
  onSubmit,
  extra,
}: {
  initial?: Partial<SiteConditions>;
  unitSystem: UnitSystem;
  errors: Record<string, string>;
  disabled?: boolean;
  submitLabel: string;
  onSubmit: (site: Record<string, number | null>) => void;
  extra?: React.ReactNode;
}) {
  const s = unitSystem;
  const L = UNIT_LABELS[s];
  const [humidity, setHumidity] = useState<Humidity>(initial?.designRhPct != null ? "rh" : "wetBulb");
  const [v, setV] = useState({
    designDryBulbC: show(initial?.designDryBulbC, (x) => convert.tempToDisplay(x, s)),
    coincidentWetBulbC: show(initial?.coincidentWetBulbC, (x) => convert.tempToDisplay(x, s)),
    designRhPct: show(initial?.designRhPct, (x) => x),
    groundTempC: show(initial?.groundTempC, (x) => convert.tempToDisplay(x, s)),
    elevationM: show(initial?.elevationM, (x) => convert.lengthToDisplay(x, s)),
  });
  const set = (k: keyof typeof v) => (e: React.ChangeEvent<HTMLInputElement>) => setV({ ...v, [k]: e.target.value });
  const n = (x: string) => (x.trim() === "" ? Number.NaN : Number(x.replace(",", ".")));

  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});

  /**
   * For IP users the allowed ranges are checked here first and stated in °F / ft (the server
   * checks the same ranges in SI, and names them in SI).
   */
  function rangeErrors(values: Record<string, number | null>): Record<string, string> {
    const out: Record<string, string> = {};
    if (s === "SI") return out;
    for (const [key, r] of Object.entries(SITE_RANGES)) {
      const v = values[key];
      if (v === null || v === undefined || Number.isNaN(v)) continue;
      if (v < r.min || v > r.max) {
        const show = (x: number) =>
          r.kind === "temp" ? convert.tempToDisplay(x, s) : r.kind === "length" ? convert.lengthToDisplay(x, s) : x;
        const unit = r.kind === "temp" ? L.temp : r.kind === "length" ? L.length : "%";
        out[key] = `${r.label} must be between ${Math.round(show(r.min) * 10) / 10} and ${Math.round(show(r.max) * 10) / 10} ${unit}`;
      }
    }
    return out;
  }

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const t = (x: string) => (x.trim() === "" ? null : convert.tempFromDisplay(n(x), s));
    const values = {
      designDryBulbC: t(v.designDryBulbC),
      coincidentWetBulbC: humidity === "wetBulb" ? t(v.coincidentWetBulbC) : null,
      designRhPct: humidity === "rh" ? (v.designRhPct.trim() === "" ? null : n(v.designRhPct)) : null,
      groundTempC: t(v.groundTempC),
      elevationM: v.elevationM.trim() === "" ? null : convert.lengthFromDisplay(n(v.elevationM), s),
    };
    const local = rangeErrors(values);
    setLocalErrors(local);
    if (Object.keys(local).length === 0) onSubmit(values);
  }
  const err = (k: string) => localErrors[k] ?? errors[`site.${k}`] ?? errors[k];

  return (
    <form onSubmit={submit} className="flex flex-col gap-4" aria-label="Site conditions">
      {extra}
      <div className="grid grid-cols-1 gap-4 sm:grid-cols-2">
        <Field id="designDryBulbC" label="Design dry bulb" unit={L.temp} inputMode="decimal" value={v.designDryBulbC} onChange={set("designDryBulbC")} error={err("designDryBulbC")} disabled={disabled} />
        <fieldset className="flex flex-col gap-1">
          <legend className="text-xs font-medium text-muted">Coincident humidity given as</legend>
          <div className="flex gap-3 text-sm">
            <label className="flex items-center gap-1">
              <input type="radio" name="humidity" checked={humidity === "wetBulb"} onChange={() => setHumidity("wetBulb")} disabled={disabled} /> wet bulb
            </label>
            <label className="flex items-center gap-1">
              <input type="radio" name="humidity" checked={humidity === "rh"} onChange={() => setHumidity("rh")} disabled={disabled} /> relative humidity
            </label>
          </div>
        </fieldset>
        {humidity === "wetBulb" ? (
          <Field id="coincidentWetBulbC" label="Coincident wet bulb" unit={L.temp} inputMode="decimal" value={v.coincidentWetBulbC} onChange={set("coincidentWetBulbC")} error={err("coincidentWetBulbC")} disabled={disabled} />
        ) : (
          <Field id="designRhPct" label="Design relative humidity" unit="%" inputMode="decimal" value={v.designRhPct} onChange={set("designRhPct")} error={err("designRhPct") ?? err("coincidentWetBulbC")} disabled={disabled} />
        )}
        <Field id="groundTempC" label="Ground temperature" unit={L.temp} inputMode="decimal" value={v.groundTempC} onChange={set("groundTempC")} error={err("groundTempC")} disabled={disabled} hint="Undisturbed ground under the slab" />
        <Field id="elevationM" label="Elevation" unit={L.length} inputMode="decimal" value={v.elevationM} onChange={set("elevationM")} error={err("elevationM")} disabled={disabled} hint="Sets barometric pressure and air density" />
      </div>
      {!disabled ? (
        <div>
          <Button type="submit" variant="primary">
            {submitLabel}
          </Button>
        </div>
      ) : null}
    </form>
  );
}
