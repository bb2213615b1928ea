"use client";
import { useState } from "react";
import { Field } from "@/components/form/field";
import { Button } from "@/components/ui/button";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import type { CommodityOption, CreateScenarioInput, RoomOption } from "../schema";

export type { CommodityOption, RoomOption };

type Row = { roomId: string; commodityId: string; tonnesPerDay: string; enteringTempC: string; finalTempC: string; pullDownHours: string; storedMassKg: string; setPointC: string };

const emptyRow = (roomId: string): Row => ({ roomId, commodityId: "", tonnesPerDay: "", enteringTempC: "", finalTempC: "", pullDownHours: "", storedMassKg: "", setPointC: "" });

/** Decimal comma accepted; blank means "unchanged". */
const num = (x: string) => (x.trim() === "" ? undefined : Number(x.trim().replace(",", ".")));

/**
 * The new-check form: per room, only what changes (blank = as in the model). Values are typed in
 * the user's units and sent in SI; the server's field errors come back beside the fields.
 */
export function ScenarioForm({
  rooms,
  commodities,
  unitSystem: s,
  errors,
  pending,
  onSubmit,
  onCancel,
}: {
  rooms: RoomOption[];
  commodities: CommodityOption[];
  unitSystem: UnitSystem;
  errors: Record<string, string>;
  pending: boolean;
  onSubmit: (input: CreateScenarioInput) => void;
  onCancel: () => void;
}) {
  const L = UNIT_LABELS[s];
  const [name, setName] = useState("");
  const [rows, setRows] = useState<Row[]>([emptyRow(rooms[0]?.id ?? "")]);
  const [placement, setPlacement] = useState<"load" | "headroom">("load");
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const set = (i: number, k: keyof Row) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) =>
    setRows(rows.map((r, j) => (j === i ? { ...r, [k]: e.target.value } : r)));

  function submit(e: React.FormEvent) {
    e.preventDefault();
    const bad: Record<string, string> = {};
    const changes = rows.map((r, i) => {
      const out: Record<string, unknown> = { roomId: r.roomId };
      const put = (k: keyof Row, label: string, toSI: (v: number) => number) => {
        const v = num(r[k]);
        if (v === undefined) return;
        if (!Number.isFinite(v)) bad[`changes.rooms.${i}.${k}`] = `${label} must be a number`;
        else out[k] = toSI(v);
      };
      if (r.commodityId) out.commodityId = r.commodityId;
      put("tonnesPerDay", "Tonnes per day", (v) => v);
      put("enteringTempC", "Entering temperature", (v) => convert.tempFromDisplay(v, s));
      put("finalTempC", "Final temperature", (v) => convert.tempFromDisplay(v, s));
      put("pullDownHours", "Pull-down time", (v) => v);
      put("storedMassKg", "Stored mass", (v) => convert.massFromDisplay(v, s));
      put("setPointC", "New set point", (v) => convert.tempFromDisplay(v, s));
      return out;
    });
    setLocalErrors(bad);
    if (Object.keys(bad).length) return;
    onSubmit({ name, changes: { rooms: changes as CreateScenarioInput["changes"]["rooms"], safetyFactorPlacement: placement } });
  }
  const err = (k: string) => localErrors[k] ?? errors[k];
  const used = new Set(rows.map((r) => r.roomId));

  return (
    <form onSubmit={submit} aria-label="New stocking check" className="flex flex-col gap-4 rounded border border-line bg-surface-2 p-4">
      <Field id="scenario-name" label="Name" placeholder="e.g. Autumn apple intake" value={name} onChange={(e) => setName(e.target.value)} error={err("name")} required maxLength={120} />
      {rows.map((r, i) => {
        const room = rooms.find((x) => x.id === r.roomId);
        const p = room?.product;
        const id = (k: string) => `r${i}-${k}`;
        const f = (k: keyof Row) => `changes.rooms.${i}.${k}`;
        return (
          <fieldset key={i} className="flex flex-col gap-3 rounded border border-line bg-surface p-3">
            <legend className="px-1 text-xs font-semibold text-muted">Room {i + 1}</legend>
            <div className="flex flex-wrap items-end gap-3">
              <div className="flex flex-col gap-1">
                <label htmlFor={id("room")} className="text-xs font-medium text-muted">
                  Room
                </label>
                <select id={id("room")} value={r.roomId} onChange={set(i, "roomId")} className="rounded border border-line bg-surface px-2 py-1.5 text-sm">
                  {rooms.map((x) => (
                    <option key={x.id} value={x.id} disabled={x.id !== r.roomId && used.has(x.id)}>
                      {x.name}
                    </option>
                  ))}
                </select>
                {err(f("roomId")) || err(`changes.rooms.${i}`) ? (
                  <p role="alert" className="text-xs text-danger">
                    ⚠ {err(f("roomId")) ?? err(`changes.rooms.${i}`)}
                  </p>
                ) : null}
              </div>
              <div className="flex flex-col gap-1">
                <label htmlFor={id("commodity")} className="text-xs font-medium text-muted">
                  Commodity
                </label>
                <select id={id("commodity")} value={r.commodityId} onChange={set(i, "commodityId")} className="rounded border border-line bg-surface px-2 py-1.5 text-sm">
                  <option value="">unchanged{p ? ` (${commodities.find((c) => c.id === p.commodityId)?.name ?? p.commodityId})` : ""}</option>
                  {commodities.map((c) => (
                    <option key={c.id} value={c.id}>
                      {c.name} ({c.group})
                    </option>
                  ))}
                </select>
                {err(f("commodityId")) ? (
                  <p role="alert" className="text-xs text-danger">
                    ⚠ {err(f("commodityId"))}
                  </p>
                ) : null}
              </div>
              {rows.length > 1 ? (
                <Button type="button" variant="ghost" onClick={() => setRows(rows.filter((_, j) => j !== i))}>
                  Remove room
                </Button>
              ) : null}
            </div>
            <p className="text-xs text-muted">
              Now:{" "}
              {room
                ? [
                    `set point ${fmt.temp(room.setPointC, s)}`,
                    p ? `${fmt.number(p.tonnesPerDay, 1)} t/day in at ${fmt.temp(p.enteringTempC, s)}, pulled down in ${fmt.number(p.pullDownHours, 1)} h` : "no product intake",
                    room.stored ? `${fmt.mass(room.stored.massKg, s)} stored` : null,
                  ]
                    .filter(Boolean)
                    .join(" · ")
                : "—"}
              . Leave a field blank to keep it.
            </p>
            <div className="grid grid-cols-2 gap-3 md:grid-cols-3">
              <Field id={id("tonnes")} label="Intake" unit="t/day" inputMode="decimal" placeholder={p ? String(p.tonnesPerDay) : ""} value={r.tonnesPerDay} onChange={set(i, "tonnesPerDay")} error={err(f("tonnesPerDay"))} />
              <Field id={id("entering")} label="Entering temperature" unit={L.temp} inputMode="decimal" value={r.enteringTempC} onChange={set(i, "enteringTempC")} error={err(f("enteringTempC"))} />
              <Field id={id("final")} label="Final temperature" unit={L.temp} inputMode="decimal" hint="blank: the room set point" value={r.finalTempC} onChange={set(i, "finalTempC")} error={err(f("finalTempC"))} />
              <Field id={id("pulldown")} label="Pull-down time" unit="h" inputMode="decimal" value={r.pullDownHours} onChange={set(i, "pullDownHours")} error={err(f("pullDownHours"))} />
              <Field id={id("stored")} label="Stored mass" unit={L.mass} inputMode="decimal" value={r.storedMassKg} onChange={set(i, "storedMassKg")} error={err(f("storedMassKg"))} />
              <Field id={id("setpoint")} label="New set point (re-purpose)" unit={L.temp} inputMode="decimal" value={r.setPointC} onChange={set(i, "setPointC")} error={err(f("setPointC"))} />
            </div>
          </fieldset>
        );
      })}
      <div className="flex flex-wrap items-center gap-3">
        {rows.length < rooms.length ? (
          <Button type="button" onClick={() => setRows([...rows, emptyRow(rooms.find((x) => !used.has(x.id))?.id ?? "")])}>
            + Another room
          </Button>
        ) : null}
        <fieldset className="flex items-center gap-3 text-sm">
          <legend className="sr-only">Safety factor</legend>
          <span className="text-xs text-muted">Safety factor:</span>
          <label className="flex items-center gap-1">
            <input type="radio" name="sf" checked={placement === "load"} onChange={() => setPlacement("load")} /> in the load
          </label>
          <label className="flex items-center gap-1">
            <input type="radio" name="sf" checked={placement === "headroom"} onChange={() => setPlacement("headroom")} /> in the headroom
          </label>
        </fieldset>
      </div>
      {err("changes") ? (
        <p role="alert" className="text-sm text-danger">
          ⚠ {err("changes")}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" variant="primary" disabled={pending}>
          {pending ? "Checking…" : "Run the check"}
        </Button>
        <Button type="button" variant="ghost" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
