"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useMutation, useQuery } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/api-client";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import type { InstalledDto } from "../schema";
import type { InstalledPlantRaw } from "../installed";

const cell = "border-t border-line px-2 py-1 align-top";
const intIn = "w-12 rounded border border-line bg-surface px-1 py-0.5 text-right font-mono text-sm tabular-nums";
const selIn = "rounded border border-line bg-surface px-1 py-0.5 text-xs";
const numIn = "w-24 rounded border border-line bg-surface px-1.5 py-0.5 text-right font-mono text-sm tabular-nums";

/** A number typed in display units (decimal comma accepted); NaN when it is not a number. */
const parse = (x: string) => Number(x.trim().replace(",", "."));

/**
 * The installed plant the checks compare with: read by everyone; designers record it — from the
 * catalogue ratings, or first as the design's duties with a selection margin, then corrected.
 */
export function InstalledPlant({ ws, facilityId, unitSystem: s, canEdit, recorded }: { ws: string; facilityId: string; unitSystem: UnitSystem; canEdit: boolean; recorded: boolean }) {
  const url = `/api/v1/workspaces/${ws}/facilities/${facilityId}/installed`;
  const router = useRouter();
  const [marginPct, setMarginPct] = useState("15");
  const [draft, setDraft] = useState<InstalledPlantRaw | null>(null);
  // Inputs are uncontrolled (typed values survive re-renders); a new draft remounts them.
  const [generation, setGeneration] = useState(0);
  const [msg, setMsg] = useState<{ ok: boolean; text: string; fields?: { field: string; message: string }[] } | null>(null);
  const q = useQuery({ queryKey: ["installed", facilityId], queryFn: () => api<InstalledDto>(url) });
  const save = useMutation({
    mutationFn: (installed: InstalledPlantRaw) => api<{ version: number }>(url, { method: "PUT", json: { baseVersion: q.data!.version, installed } }),
    onSuccess: (r) => {
      setMsg({ ok: true, text: `Installed plant recorded as model version ${r.version}.` });
      setDraft(null);
      q.refetch();
      router.refresh();
    },
    onError: (e) => setMsg({ ok: false, text: e instanceof Error ? e.message : "Not saved.", fields: e instanceof ApiError ? e.fields : undefined }),
  });
  const propose = useMutation({
    mutationFn: () => {
      const m = parse(marginPct);
      if (!(m >= 0 && m <= 100)) throw new Error("The selection margin must be between 0 and 100 %.");
      return api<InstalledDto>(`${url}?margin=${m / 100}`);
    },
    onSuccess: (d) => {
      setDraft(structuredClone(d.proposed));
      setGeneration((g) => g + 1);
      setMsg({ ok: true, text: "Proposed from the design: check every rating against the equipment actually installed, then save." });
    },
    onError: (e) => setMsg({ ok: false, text: e instanceof Error ? e.message : "No proposal." }),
  });

  if (q.isPending) return <div aria-busy="true" className="h-24 animate-pulse rounded border border-line bg-surface-2" />;
  if (q.isError) return <p className="text-sm text-danger">⚠ The installed plant could not be loaded: {q.error.message}</p>;
  const d = q.data;
  const shown = draft ?? d.installed;
  const L = UNIT_LABELS[s];
  const editing = canEdit && draft !== null;
  const set = (fn: (x: InstalledPlantRaw) => void) => setDraft((old) => {
    const next = structuredClone(old ?? d.installed!);
    fn(next);
    return next;
  });
  const numCell = (value: number, onChange: (v: number) => void, label: string, small = false) =>
    editing ? (
      <input aria-label={label} className={small ? intIn : numIn} inputMode="decimal" defaultValue={String(value)} onBlur={(e) => onChange(parse(e.target.value))} />
    ) : (
      <span className="font-mono tabular-nums">{String(value)}</span>
    );
  const showNum = (v: number, digits: number) => fmt.number(v, digits);
  const twoStage = new Set(d.twoStageCircuits ?? []);

  return (
    <section aria-labelledby="installed-h" className="flex flex-col gap-3 rounded border border-line p-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="installed-h" className="text-sm font-semibold">
          Installed plant {recorded || draft ? "" : "— not recorded"}
        </h2>
        {canEdit ? (
          <div className="flex flex-wrap items-end gap-2">
            {!draft && d.installed ? <Button onClick={() => (setDraft(structuredClone(d.installed)), setGeneration((g) => g + 1))}>Edit ratings</Button> : null}
            <label className="flex items-center gap-1 text-xs text-muted">
              Selection margin over design
              <input className={numIn} inputMode="decimal" value={marginPct} onChange={(e) => setMarginPct(e.target.value)} aria-label="Selection margin over design, %" /> %
            </label>
            <Button onClick={() => propose.mutate()} disabled={propose.isPending}>
              {propose.isPending ? "Proposing…" : "Propose from the design"}
            </Button>
            {draft ? (
              <>
                <Button variant="primary" onClick={() => save.mutate(draft)} disabled={save.isPending}>
                  {save.isPending ? "Saving…" : "Save installed plant"}
                </Button>
                <Button variant="ghost" onClick={() => setDraft(null)}>
                  Discard
                </Button>
              </>
            ) : null}
          </div>
        ) : null}
      </div>
      <p className="text-xs text-muted">
        Checks compare each room&apos;s evaporators, each circuit&apos;s running compressors (standby excluded) and each condenser, re-rated at the scenario&apos;s conditions, with the new load.
        {canEdit ? " Ratings are per unit at the stated rating conditions; enter the catalogue values of the equipment actually installed." : ""}
      </p>
      {msg ? (
        <div role={msg.ok ? "status" : "alert"} className={`text-sm ${msg.ok ? "text-ok" : "text-danger"}`}>
          {msg.ok ? "✓" : "⚠"} {msg.text}
          {msg.fields?.length ? (
            <ul className="list-disc pl-5 text-xs">
              {msg.fields.map((f) => (
                <li key={f.field}>
                  {f.field}: {f.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {!shown ? (
        <p className="text-sm text-muted">{canEdit ? "Nothing recorded yet: propose it from the design, correct the ratings, and save." : "A designer has not recorded the installed plant yet."}</p>
      ) : (
        <div key={generation} className="grid grid-cols-1 gap-3 2xl:grid-cols-3">
          <table className="text-sm">
            <caption className="text-left text-xs font-semibold">Evaporators</caption>
            <thead className="text-left text-xs text-muted">
              <tr>
                <th className="px-2 font-medium">Tag · room</th>
                <th className="px-2 font-medium">Units</th>
                <th className="px-2 font-medium">Per unit ({L.power_refrigeration})</th>
                <th className="px-2 font-medium">at TD ({L.tempDiff})</th>
                <th className="px-2 font-medium">Rated feed · on site</th>
                <th className="px-2 font-medium">Frost loss (%)</th>
              </tr>
            </thead>
            <tbody>
              {shown.evaporators.map((e, i) => (
                <tr key={e.id}>
                  <td className={cell}>
                    <span className="font-mono">{e.tag}</span> <span className="text-xs text-muted">{d.rooms[e.roomId] ?? e.roomId}</span>
                  </td>
                  <td className={cell}>
                    <span className="inline-flex items-center gap-1">{numCell(e.units, (v) => set((x) => void (x.evaporators[i].units = v)), `${e.tag} units`, true)} <span className="text-xs text-muted">standby</span> {numCell(e.standbyUnits, (v) => set((x) => void (x.evaporators[i].standbyUnits = v)), `${e.tag} standby units`, true)}</span>
                  </td>
                  <td className={cell}>
                    {editing
                      ? numCell(Math.round(convert.powerToDisplay(e.ratedCapacityWPerUnit, s) * 1000) / 1000, (v) => set((x) => void (x.evaporators[i].ratedCapacityWPerUnit = convert.powerFromDisplay(v, s))), `${e.tag} capacity per unit`)
                      : showNum(convert.powerToDisplay(e.ratedCapacityWPerUnit, s), 1)}
                  </td>
                  <td className={`${cell} font-mono`}>{showNum(convert.tempDiffToDisplay(e.rating.tdK, s), 1)}</td>
                  <td className={cell}>
                    {editing ? (
                      <span className="inline-flex items-center gap-1">
                        <select aria-label={`${e.tag} rated feed`} className={selIn} defaultValue={e.rating.feed} onChange={(ev) => set((x) => void (x.evaporators[i].rating.feed = ev.target.value as "dx" | "pumped"))}>
                          <option value="dx">DX</option>
                          <option value="pumped">pumped</option>
                        </select>
                        <select aria-label={`${e.tag} feed on site`} className={selIn} defaultValue={e.siteFeed ?? ""} onChange={(ev) => set((x) => { const v = ev.target.value; if (v === "dx" || v === "pumped") x.evaporators[i].siteFeed = v; else delete x.evaporators[i].siteFeed; })}>
                          <option value="">as designed</option>
                          <option value="dx">DX</option>
                          <option value="pumped">pumped</option>
                        </select>
                      </span>
                    ) : (
                      <span className="text-xs">{e.rating.feed} · {e.siteFeed ?? "as designed"}</span>
                    )}
                  </td>
                  <td className={cell}>
                    {editing ? (
                      <input aria-label={`${e.tag} frost loss, %`} className={intIn} inputMode="decimal" placeholder="auto" defaultValue={e.frostCapacityLoss === undefined ? "" : String(e.frostCapacityLoss * 100)} onBlur={(ev) => set((x) => { const t = ev.target.value.trim(); if (t === "") delete x.evaporators[i].frostCapacityLoss; else x.evaporators[i].frostCapacityLoss = parse(t) / 100; })} />
                    ) : (
                      <span className="font-mono text-xs">{e.frostCapacityLoss === undefined ? "auto" : showNum(e.frostCapacityLoss * 100, 0)}</span>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <table className="text-sm">
            <caption className="text-left text-xs font-semibold">Compressor sets</caption>
            <thead className="text-left text-xs text-muted">
              <tr>
                <th className="px-2 font-medium">Tag · circuit</th>
                <th className="px-2 font-medium">Units</th>
                <th className="px-2 font-medium">Stage</th>
                <th className="px-2 font-medium">Swept volume per unit (m³/h)</th>
              </tr>
            </thead>
            <tbody>
              {shown.compressors.map((c, i) => (
                <tr key={c.id}>
                  <td className={cell}>
                    <span className="font-mono">{c.tag}</span> <span className="text-xs text-muted">{d.circuits[c.circuitId] ?? c.circuitId} · {c.type}</span>
                  </td>
                  <td className={cell}>
                    <span className="inline-flex items-center gap-1">{numCell(c.units, (v) => set((x) => void (x.compressors[i].units = v)), `${c.tag} units`, true)} <span className="text-xs text-muted">standby</span> {numCell(c.standbyUnits, (v) => set((x) => void (x.compressors[i].standbyUnits = v)), `${c.tag} standby units`, true)}</span>
                  </td>
                  <td className={cell}>
                    {twoStage.has(c.circuitId) ? (
                      editing ? (
                        <select aria-label={`${c.tag} stage`} className={selIn} defaultValue={c.stage ?? "low"} onChange={(ev) => set((x) => void (x.compressors[i].stage = ev.target.value as "low" | "high"))}>
                          <option value="low">low (booster)</option>
                          <option value="high">high</option>
                        </select>
                      ) : (
                        <span className="text-xs">{c.stage ?? "low"}</span>
                      )
                    ) : (
                      <span className="text-xs text-muted">single</span>
                    )}
                  </td>
                  <td className={cell}>
                    {c.rating.by === "swept-volume"
                      ? editing
                        ? numCell(Math.round(c.rating.sweptVolumeM3sPerUnit * 3600 * 100) / 100, (v) => set((x) => void ((x.compressors[i].rating as { sweptVolumeM3sPerUnit: number }).sweptVolumeM3sPerUnit = v / 3600)), `${c.tag} swept volume per unit`)
                        : showNum(c.rating.sweptVolumeM3sPerUnit * 3600, 0)
                      : `rated ${fmt.power(c.rating.capacityWPerUnit, s)} at ${fmt.temp(c.rating.evaporatingC, s)} / ${fmt.temp(c.rating.condensingC, s)}`}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
          <table className="text-sm">
            <caption className="text-left text-xs font-semibold">Condensers</caption>
            <thead className="text-left text-xs text-muted">
              <tr>
                <th className="px-2 font-medium">Tag</th>
                <th className="px-2 font-medium">Units</th>
                <th className="px-2 font-medium">Heat per unit ({L.power_heat})</th>
                <th className="px-2 font-medium">at approach ({L.tempDiff})</th>
              </tr>
            </thead>
            <tbody>
              {shown.condensers.map((c, i) => (
                <tr key={c.id}>
                  <td className={`${cell} font-mono`}>{c.tag}</td>
                  <td className={cell}>
                    <span className="inline-flex items-center gap-1">{numCell(c.units, (v) => set((x) => void (x.condensers[i].units = v)), `${c.tag} units`, true)} <span className="text-xs text-muted">standby</span> {numCell(c.standbyUnits, (v) => set((x) => void (x.condensers[i].standbyUnits = v)), `${c.tag} standby units`, true)}</span>
                  </td>
                  <td className={cell}>
                    {editing
                      ? numCell(Math.round(convert.powerToDisplay(c.ratedHeatRejectionWPerUnit, s, "heat") * 1000) / 1000, (v) => set((x) => void (x.condensers[i].ratedHeatRejectionWPerUnit = convert.powerFromDisplay(v, s, "heat"))), `${c.tag} heat rejection per unit`)
                      : showNum(convert.powerToDisplay(c.ratedHeatRejectionWPerUnit, s, "heat"), 1)}
                  </td>
                  <td className={`${cell} font-mono`}>{showNum(convert.tempDiffToDisplay(c.ratingApproachK, s), 1)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
