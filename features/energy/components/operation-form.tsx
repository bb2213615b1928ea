"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { patternFromWeek, weekFromPattern, DAYS, type Week } from "../week-pattern";

/** The parts of the model's `operation` section this form edits (the rest is kept as it is). */
export interface OperationDoc {
  doorTraffic?: { all?: Week; byDoor?: Record<string, Week> };
  productIntake?: { byWeekday?: number[]; byMonth?: number[] };
  lights?: Week;
  people?: Week;
  defrost?: { fixedShare?: number; maxFactor?: number };
  circuits?: Record<string, { capacityControl?: { type: string; [k: string]: unknown }; minCondensingC?: number; condenserFanControl?: string; [k: string]: unknown }>;
  tariff?: { kind: "flat"; pricePerKWh: number; demandChargePerKWMonth?: number } | { kind: "day-night"; dayPricePerKWh: number; nightPricePerKWh: number; dayStartHour?: number; dayEndHour?: number; demandChargePerKWMonth?: number };
  [k: string]: unknown;
}

interface Pattern {
  on: boolean;
  from: string;
  to: string;
  open: string;
  closed: string;
  sat: string;
  sun: string;
}

function patternState(w: Week | undefined): { p: Pattern; custom: boolean } {
  if (!w) return { p: { on: false, from: "6", to: "22", open: "1", closed: "0.2", sat: "0.5", sun: "0.2" }, custom: false };
  const p = patternFromWeek(w);
  if (!p) return { p: { on: true, from: "6", to: "22", open: "1", closed: "0.2", sat: "0.5", sun: "0.2" }, custom: true };
  return { p: { on: true, from: String(p.from), to: String(p.to), open: String(p.open), closed: String(p.closed), sat: String(p.sat), sun: String(p.sun) }, custom: false };
}

const num = (x: string) => (x.trim() === "" ? Number.NaN : Number(x.replace(",", ".")));

function NumberInput({ id, label, value, onChange, error, unit, width = "w-24" }: { id: string; label: string; value: string; onChange: (v: string) => void; error?: string; unit?: string; width?: string }) {
  return <Field id={id} label={label} unit={unit} error={error} inputMode="decimal" value={value} onChange={(e) => onChange(e.target.value)} inputClassName={`${width} py-1 text-right`} />;
}

export interface CircuitInfo {
  id: string;
  name: string;
}

/**
 * The facility's tariff and operating schedules — the model's `operation` section — saved as a
 * new model version through the same path as every model edit (revisions and merging apply).
 * Each value is checked here with its allowed range, and again by the server's model schema.
 */
export function OperationForm({
  ws,
  facilityId,
  initial,
  circuits,
  currency,
  canEdit,
  s,
}: {
  ws: string;
  facilityId: string;
  initial: OperationDoc | null;
  circuits: CircuitInfo[];
  currency: string;
  canEdit: boolean;
  s: UnitSystem;
}) {
  const router = useRouter();
  const op = initial ?? {};
  const t = op.tariff ?? { kind: "flat" as const, pricePerKWh: 0, demandChargePerKWMonth: 0 };
  const [tariff, setTariff] = useState({
    kind: t.kind,
    price: t.kind === "flat" ? String(t.pricePerKWh) : "0.2",
    day: t.kind === "day-night" ? String(t.dayPricePerKWh) : "0.22",
    night: t.kind === "day-night" ? String(t.nightPricePerKWh) : "0.14",
    dayStart: t.kind === "day-night" ? String(t.dayStartHour ?? 7) : "7",
    dayEnd: t.kind === "day-night" ? String(t.dayEndHour ?? 23) : "23",
    demand: String(t.demandChargePerKWMonth ?? 0),
  });
  const initialPatterns = { doors: patternState(op.doorTraffic?.all), lights: patternState(op.lights), people: patternState(op.people) };
  const [patterns, setPatterns] = useState({ doors: initialPatterns.doors.p, lights: initialPatterns.lights.p, people: initialPatterns.people.p });
  const [intake, setIntake] = useState((op.productIntake?.byWeekday ?? [1, 1, 1, 1, 1, 1, 1]).map(String));
  const [defrost, setDefrost] = useState({ fixedShare: String(op.defrost?.fixedShare ?? 0.3), maxFactor: String(op.defrost?.maxFactor ?? 2) });
  const [circ, setCirc] = useState(
    circuits.map((c) => {
      const o = op.circuits?.[c.id];
      return {
        id: c.id,
        control: o?.capacityControl?.type ?? "default",
        minCond: o?.minCondensingC !== undefined ? String(Math.round(convert.tempToDisplay(o.minCondensingC, s) * 10) / 10) : "",
        fans: o?.condenserFanControl ?? "speed",
      };
    }),
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [top, setTop] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const L = UNIT_LABELS[s];

  function build(): { doc: OperationDoc; errs: Record<string, string> } {
    const errs: Record<string, string> = {};
    const need = (key: string, v: number, lo: number, hi: number, what: string, unit = "", int = false) => {
      if (!Number.isFinite(v) || v < lo || v > hi || (int && !Number.isInteger(v))) errs[key] = `${what} must be ${int ? "a whole number " : ""}between ${lo} and ${hi}${unit ? " " + unit : ""}`;
      return v;
    };
    const demand = need("tariff.demandChargePerKWMonth", num(tariff.demand), 0, 10_000, "Demand charge", `${currency} per kW of monthly peak`);
    const next: OperationDoc = { ...op };
    next.tariff =
      tariff.kind === "flat"
        ? { kind: "flat", pricePerKWh: need("tariff.pricePerKWh", num(tariff.price), 0, 100, "Price", `${currency}/kWh`), demandChargePerKWMonth: demand }
        : {
            kind: "day-night",
            dayPricePerKWh: need("tariff.dayPricePerKWh", num(tariff.day), 0, 100, "Day price", `${currency}/kWh`),
            nightPricePerKWh: need("tariff.nightPricePerKWh", num(tariff.night), 0, 100, "Night price", `${currency}/kWh`),
            dayStartHour: need("tariff.dayStartHour", num(tariff.dayStart), 0, 23, "Day rate from hour", "", true),
            dayEndHour: need("tariff.dayEndHour", num(tariff.dayEnd), 0, 24, "Day rate until hour", "", true),
            demandChargePerKWMonth: demand,
          };
    const week = (k: "doors" | "lights" | "people", label: string): Week | undefined => {
      const p = patterns[k];
      if (!p.on) return undefined;
      const from = need(`${k}.from`, num(p.from), 0, 23, `${label}: open from hour`, "", true);
      const to = need(`${k}.to`, num(p.to), 1, 24, `${label}: open until hour`, "", true);
      if (Number.isFinite(from) && Number.isFinite(to) && to <= from) errs[`${k}.to`] = `${label}: open until hour must be after the opening hour (${from})`;
      const v = {
        from,
        to,
        open: need(`${k}.open`, num(p.open), 0, 10, `${label}: multiplier when open`),
        closed: need(`${k}.closed`, num(p.closed), 0, 10, `${label}: multiplier when closed`),
        sat: need(`${k}.sat`, num(p.sat), 0, 10, `${label}: Saturday factor`),
        sun: need(`${k}.sun`, num(p.sun), 0, 10, `${label}: Sunday factor`),
      };
      return Object.keys(errs).some((e) => e.startsWith(`${k}.`)) ? undefined : weekFromPattern(v);
    };
    const doors = week("doors", "Door traffic");
    next.doorTraffic = { ...(op.doorTraffic ?? {}), byDoor: op.doorTraffic?.byDoor ?? {} };
    if (doors) next.doorTraffic.all = doors;
    else if (!patterns.doors.on) delete next.doorTraffic.all;
    const lights = week("lights", "Lights");
    if (lights) next.lights = lights;
    else if (!patterns.lights.on) delete next.lights;
    const people = week("people", "People");
    if (people) next.people = people;
    else if (!patterns.people.on) delete next.people;
    const byWeekday = intake.map((x, i) => need(`productIntake.byWeekday.${i}`, num(x), 0, 10, `Product intake on ${DAYS[i]}`));
    next.productIntake = { ...(op.productIntake ?? {}), byWeekday };
    next.defrost = {
      fixedShare: need("defrost.fixedShare", num(defrost.fixedShare), 0, 1, "Fixed share of defrosts"),
      maxFactor: need("defrost.maxFactor", num(defrost.maxFactor), 1, 5, "Most defrosts, as a multiple of the design day's,"),
    };
    // Entries of circuits no longer in the model are dropped (the server refuses unknown circuit ids).
    const cs: NonNullable<OperationDoc["circuits"]> = Object.fromEntries(Object.entries(op.circuits ?? {}).filter(([id]) => circuits.some((c) => c.id === id)));
    for (const c of circ) {
      const name = circuits.find((x) => x.id === c.id)?.name ?? c.id;
      const cur = { ...(cs[c.id] ?? {}) };
      if (c.control === "default") delete cur.capacityControl;
      else if (cur.capacityControl?.type !== c.control) cur.capacityControl = { type: c.control };
      if (c.minCond.trim() === "") delete cur.minCondensingC;
      else {
        const v = convert.tempFromDisplay(num(c.minCond), s);
        if (!Number.isFinite(v) || v < -10 || v > 50) errs[`circuits.${c.id}.minCondensingC`] = `${name}: lowest condensing temperature must be between ${fmt.temp(-10, s)} and ${fmt.temp(50, s)}`;
        else cur.minCondensingC = Math.round(v * 100) / 100;
      }
      cur.condenserFanControl = c.fans;
      cs[c.id] = cur;
    }
    next.circuits = cs;
    return { doc: next, errs };
  }

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setSaved(null);
    const { doc, errs } = build();
    setErrors(errs);
    if (Object.keys(errs).length) {
      setTop(`${Object.keys(errs).length} value${Object.keys(errs).length === 1 ? "" : "s"} to correct; nothing was saved.`);
      return;
    }
    setBusy(true);
    setTop(null);
    const modelUrl = `/api/v1/workspaces/${ws}/facilities/${facilityId}/model`;
    try {
      const m = await api<{ version: number; doc: Record<string, unknown> }>(modelUrl);
      const r = await api<{ version: number }>(modelUrl, { method: "PUT", json: { baseVersion: m.version, doc: { ...m.doc, operation: doc }, summary: "Operation and tariff edited" } });
      setSaved(`Saved as model version ${r.version}; the year is run again with it.`);
      router.refresh();
    } catch (err) {
      if (err instanceof ApiError) {
        const m: Record<string, string> = {};
        for (const f of err.fields ?? []) m[f.field.replace(/^model\.operation\./, "")] = f.message;
        if (err.field) m[err.field.replace(/^model\.operation\./, "")] ??= err.message;
        setErrors(m);
        setTop(err.message);
      } else setTop("The change did not reach the server. Try again.");
    } finally {
      setBusy(false);
    }
  }

  const setP = (k: "doors" | "lights" | "people", key: keyof Pattern, v: string | boolean) => setPatterns({ ...patterns, [k]: { ...patterns[k], [key]: v } });
  const patternBlock = (k: "doors" | "lights" | "people", label: string) => {
    const p = patterns[k];
    return (
      <fieldset className="flex flex-col gap-2 rounded border border-line p-2" disabled={!canEdit}>
        <legend className="px-1 text-xs font-semibold">{label}</legend>
        <label className="flex items-center gap-2 text-xs">
          <input type="checkbox" checked={p.on} onChange={(e) => setP(k, "on", e.target.checked)} /> Follow a weekly pattern (otherwise every hour as on the design day)
        </label>
        {initialPatterns[k].custom ? <p className="border-l-2 border-warn pl-2 text-xs">
            ⚠ The model holds a custom week this form cannot show; saving here replaces it with the pattern below.</p> : null}
        {p.on ? (
          <div className="flex flex-wrap gap-2">
            <NumberInput id={`${k}-from`} label="Open from hour" value={p.from} onChange={(v) => setP(k, "from", v)} error={errors[`${k}.from`]} width="w-16" />
            <NumberInput id={`${k}-to`} label="until hour" value={p.to} onChange={(v) => setP(k, "to", v)} error={errors[`${k}.to`]} width="w-16" />
            <NumberInput id={`${k}-open`} label="× when open" value={p.open} onChange={(v) => setP(k, "open", v)} error={errors[`${k}.open`]} width="w-16" />
            <NumberInput id={`${k}-closed`} label="× when closed" value={p.closed} onChange={(v) => setP(k, "closed", v)} error={errors[`${k}.closed`]} width="w-16" />
            <NumberInput id={`${k}-sat`} label="Saturday ×" value={p.sat} onChange={(v) => setP(k, "sat", v)} error={errors[`${k}.sat`]} width="w-16" />
            <NumberInput id={`${k}-sun`} label="Sunday ×" value={p.sun} onChange={(v) => setP(k, "sun", v)} error={errors[`${k}.sun`]} width="w-16" />
          </div>
        ) : null}
      </fieldset>
    );
  };

  return (
    <form onSubmit={save} className="flex flex-col gap-3 rounded border border-line bg-surface-2 p-4" aria-labelledby="operation-h">
      <h2 id="operation-h" className="text-base font-semibold">
        Tariff and operation
      </h2>
      <p className="text-xs text-muted">Multipliers scale the design day&apos;s value at that hour (1 = as on the design day). Saved as a new model version, like any other model edit.</p>
      <fieldset className="flex flex-col gap-2 rounded border border-line p-2" disabled={!canEdit}>
        <legend className="px-1 text-xs font-semibold">Electricity tariff ({currency})</legend>
        <div className="flex flex-wrap items-end gap-3">
          <div className="flex flex-col gap-0.5">
            <label htmlFor="tariff-kind" className="text-xs text-muted">
              Kind
            </label>
            <select id="tariff-kind" value={tariff.kind} onChange={(e) => setTariff({ ...tariff, kind: e.target.value as "flat" | "day-night" })} className="rounded border border-line bg-surface px-2 py-1 text-sm">
              <option value="flat">Flat rate</option>
              <option value="day-night">Day / night</option>
            </select>
          </div>
          {tariff.kind === "flat" ? (
            <NumberInput id="tariff-price" label="Price" unit={`${currency}/kWh`} value={tariff.price} onChange={(v) => setTariff({ ...tariff, price: v })} error={errors["tariff.pricePerKWh"]} />
          ) : (
            <>
              <NumberInput id="tariff-day" label="Day price" unit={`${currency}/kWh`} value={tariff.day} onChange={(v) => setTariff({ ...tariff, day: v })} error={errors["tariff.dayPricePerKWh"]} />
              <NumberInput id="tariff-night" label="Night price" unit={`${currency}/kWh`} value={tariff.night} onChange={(v) => setTariff({ ...tariff, night: v })} error={errors["tariff.nightPricePerKWh"]} />
              <NumberInput id="tariff-day-start" label="Day rate from hour" value={tariff.dayStart} onChange={(v) => setTariff({ ...tariff, dayStart: v })} error={errors["tariff.dayStartHour"]} width="w-16" />
              <NumberInput id="tariff-day-end" label="until hour" value={tariff.dayEnd} onChange={(v) => setTariff({ ...tariff, dayEnd: v })} error={errors["tariff.dayEndHour"]} width="w-16" />
            </>
          )}
          <NumberInput id="tariff-demand" label="Demand charge" unit={`${currency} per kW·month`} value={tariff.demand} onChange={(v) => setTariff({ ...tariff, demand: v })} error={errors["tariff.demandChargePerKWMonth"]} />
        </div>
      </fieldset>
      <div className="grid gap-2 lg:grid-cols-3">
        {patternBlock("doors", "Door traffic (every door)")}
        {patternBlock("lights", "Lights")}
        {patternBlock("people", "People")}
      </div>
      <fieldset className="flex flex-col gap-2 rounded border border-line p-2" disabled={!canEdit}>
        <legend className="px-1 text-xs font-semibold">Product intake by weekday (× the design day&apos;s intake)</legend>
        <div className="flex flex-wrap gap-2">
          {DAYS.map((d, i) => (
            <NumberInput key={d} id={`intake-${i}`} label={d} value={intake[i]} onChange={(v) => setIntake(intake.map((x, j) => (j === i ? v : x)))} error={errors[`productIntake.byWeekday.${i}`]} width="w-16" />
          ))}
        </div>
      </fieldset>
      <fieldset className="flex flex-col gap-2 rounded border border-line p-2" disabled={!canEdit}>
        <legend className="px-1 text-xs font-semibold">Defrosts per day follow the moisture brought in</legend>
        <div className="flex flex-wrap gap-3">
          <NumberInput id="defrost-fixed" label="Fixed share (0…1)" value={defrost.fixedShare} onChange={(v) => setDefrost({ ...defrost, fixedShare: v })} error={errors["defrost.fixedShare"]} />
          <NumberInput id="defrost-max" label="At most × the design day's (1…5)" value={defrost.maxFactor} onChange={(v) => setDefrost({ ...defrost, maxFactor: v })} error={errors["defrost.maxFactor"]} />
        </div>
      </fieldset>
      {circuits.length ? (
        <fieldset className="flex flex-col gap-2 rounded border border-line p-2" disabled={!canEdit}>
          <legend className="px-1 text-xs font-semibold">Circuits: part load and condensing</legend>
          <table className="self-start text-xs">
            <thead className="text-muted">
              <tr>
                <th className="pr-2 text-left font-normal">Circuit</th>
                <th className="px-1 text-left font-normal">Capacity control</th>
                <th className="px-1 text-left font-normal">Lowest condensing ({L.temp})</th>
                <th className="px-1 text-left font-normal">Condenser fans</th>
              </tr>
            </thead>
            <tbody>
              {circ.map((c, i) => {
                const name = circuits[i].name;
                const set = (k: "control" | "minCond" | "fans", v: string) => setCirc(circ.map((x, j) => (j === i ? { ...x, [k]: v } : x)));
                const err = errors[`circuits.${c.id}.minCondensingC`];
                return (
                  <tr key={c.id}>
                    <td className="pr-2">{name}</td>
                    <td className="px-1 py-0.5">
                      <select aria-label={`${name}: capacity control`} value={c.control} onChange={(e) => set("control", e.target.value)} className="rounded border border-line bg-surface px-1 py-0.5">
                        <option value="default">By compressor type (default)</option>
                        <option value="onoff">On/off cycling</option>
                        <option value="slide-valve">Slide valve</option>
                        <option value="variable-speed">Variable speed</option>
                        <option value="staged">Several compressors staged</option>
                      </select>
                    </td>
                    <td className="px-1 py-0.5">
                      <input
                        aria-label={`${name}: lowest condensing temperature`}
                        aria-invalid={err ? true : undefined}
                        inputMode="decimal"
                        placeholder="default"
                        value={c.minCond}
                        onChange={(e) => set("minCond", e.target.value)}
                        className={`w-20 rounded border bg-surface px-1 py-0.5 text-right ${err ? "border-danger" : "border-line"}`}
                      />
                      {err ? (
                        <p role="alert" className="text-danger">
                          ⚠ {err}
                        </p>
                      ) : null}
                    </td>
                    <td className="px-1 py-0.5">
                      <select aria-label={`${name}: condenser fan control`} value={c.fans} onChange={(e) => set("fans", e.target.value)} className="rounded border border-line bg-surface px-1 py-0.5">
                        <option value="speed">Speed controlled</option>
                        <option value="staged">Staged on/off</option>
                        <option value="proportional">Proportional to heat rejected</option>
                      </select>
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </fieldset>
      ) : null}
      {top ? (
        <div role="alert" className="text-sm text-danger">
          <p>⚠ {top}</p>
          <ul className="list-disc pl-5 text-xs">
            {Object.entries(errors).map(([k, v]) => (
              <li key={k}>
                {k}: {v}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {saved ? (
        <p role="status" className="text-sm text-ok">
          ✓ {saved}
        </p>
      ) : null}
      {canEdit ? (
        <div>
          <Button type="submit" variant="primary" disabled={busy}>
            {busy ? "Saving…" : "Save tariff and operation"}
          </Button>
        </div>
      ) : (
        <p className="text-xs text-muted">Read only: owners and designers change the tariff and the schedules.</p>
      )}
    </form>
  );
}
