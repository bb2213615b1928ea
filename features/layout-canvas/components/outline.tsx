"use client";
import { useState } from "react";
import type { FacilityResult } from "@/lib/engine/model";
import { roomSchema } from "@/lib/engine/loads/schema";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { circuits, condensers, evaporators, nodeId, OUTDOORS, replaceEntity } from "../graph";
import type { CanvasDoc } from "../schema";

/**
 * The same model as a list, for keyboard and screen-reader use and quick edits: rooms with
 * their doors and evaporators, circuits with what they serve, condensers. Every name opens the
 * item in the inspector; room set points and humidities can be edited in place.
 */
export function Outline({ doc, result, s, canEdit, onSelect, onCommit }: { doc: CanvasDoc; result: FacilityResult | null; s: UnitSystem; canEdit: boolean; onSelect: (nid: string) => void; onCommit: (doc: CanvasDoc, key: string) => void }) {
  const rooms = new Map((result?.ledger.rooms ?? []).map((r) => [r.roomId, r]));
  const circ = new Map((result?.plant.circuits ?? []).map((c) => [c.id, c]));
  const sized = new Map((result?.plant.evaporators ?? []).map((e) => [e.id, e]));
  const name = (id: string) => (id === OUTDOORS ? "Outdoors" : (doc.rooms.find((r) => r.id === id)?.name ?? "(not connected)"));
  const item = (nid: string, label: string) => (
    <button className="text-left text-accent hover:underline" onClick={() => onSelect(nid)}>
      {label}
    </button>
  );
  return (
    <div className="h-full overflow-auto p-3 text-sm" aria-label="Outline of the model">
      <table className="w-full max-w-5xl">
        <caption className="pb-1 text-left font-semibold">Rooms</caption>
        <thead className="text-xs text-muted">
          <tr className="border-b border-line">
            <th className="py-1 text-left font-normal">Room</th>
            <th className="text-left font-normal">Set point ({UNIT_LABELS[s].temp})</th>
            <th className="text-left font-normal">RH (%)</th>
            <th className="text-right font-normal">Required</th>
            <th className="pl-4 text-left font-normal">Doors</th>
            <th className="text-left font-normal">Evaporators</th>
          </tr>
        </thead>
        <tbody>
          {doc.rooms.map((r) => (
            <tr key={r.id} className="border-b border-line/60 align-top">
              <td className="py-1">{item(nodeId("room", r.id), r.name)}</td>
              <td>
                <InlineNumber label={`${r.name} set point`} value={convert.tempToDisplay(r.setPointC, s)} disabled={!canEdit} onValid={(v) => {
                  const next = { ...r, setPointC: convert.tempFromDisplay(v, s) };
                  const ok = roomSchema.safeParse(next);
                  if (!ok.success) return ok.error.issues[0].message;
                  onCommit(replaceEntity(doc, nodeId("room", r.id), next), `room:${r.id}:setPointC`);
                  return null;
                }} />
              </td>
              <td>
                <InlineNumber label={`${r.name} relative humidity`} value={r.rhPct} disabled={!canEdit} onValid={(v) => {
                  const next = { ...r, rhPct: v };
                  const ok = roomSchema.safeParse(next);
                  if (!ok.success) return ok.error.issues[0].message;
                  onCommit(replaceEntity(doc, nodeId("room", r.id), next), `room:${r.id}:rhPct`);
                  return null;
                }} />
              </td>
              <td className="whitespace-nowrap text-right font-mono">{rooms.get(r.id) ? fmt.power(rooms.get(r.id)!.designCapacityW, s) : "—"}</td>
              <td className="pl-4">
                <ul>
                  {doc.doors
                    .filter((d) => d.sides.includes(r.id))
                    .map((d) => (
                      <li key={d.id}>
                        {item(nodeId("door", d.id), d.name || d.id)} <span className="text-xs text-muted">to {name(d.sides[0] === r.id ? d.sides[1] : d.sides[0])}</span>
                      </li>
                    ))}
                </ul>
              </td>
              <td>
                <ul>
                  {evaporators(doc)
                    .filter((e) => e.roomId === r.id)
                    .map((e) => (
                      <li key={e.id}>
                        {item(nodeId("evaporator", e.id), e.tag)} <span className="whitespace-nowrap font-mono text-xs">{sized.get(e.id) ? fmt.power(sized.get(e.id)!.dutyW, s) : ""}</span>
                      </li>
                    ))}
                </ul>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <h3 className="mt-4 font-semibold">Circuits</h3>
      <ul className="mt-1 flex flex-col gap-1">
        {circuits(doc).map((c) => {
          const r = circ.get(c.id);
          const hr = c.heatRejection;
          const to = hr.to === "condenser" ? (condensers(doc).find((x) => x.id === hr.condenserId)?.tag ?? "(no condenser)") : `circuit ${circuits(doc).find((x) => x.id === hr.circuitId)?.tag ?? "?"}`;
          return (
            <li key={c.id}>
              {item(nodeId("circuit", c.id), c.tag)} <span className="text-muted">{c.refrigerant}</span>
              {r ? <span className="ml-2 font-mono text-xs">COP {fmt.cop(r.cop)} · suction {fmt.temp(r.suctionC, s)}</span> : null} <span className="text-xs text-muted">· rejects to {to} · serves {evaporators(doc).filter((e) => e.circuitId === c.id).map((e) => e.tag).join(", ") || "nothing yet"}</span>
            </li>
          );
        })}
      </ul>
      <h3 className="mt-4 font-semibold">Condensers</h3>
      <ul className="mt-1 flex flex-col gap-1">
        {condensers(doc).map((c) => (
          <li key={c.id}>
            {item(nodeId("condenser", c.id), c.tag)} <span className="text-muted">{c.type}</span>
          </li>
        ))}
      </ul>
      {doc.doors.some((d) => !d.sides.every((x) => x === OUTDOORS || doc.rooms.some((r) => r.id === x))) || evaporators(doc).some((e) => !doc.rooms.some((r) => r.id === e.roomId)) ? (
        <>
          <h3 className="mt-4 font-semibold">Not connected yet</h3>
          <ul className="mt-1 flex flex-col gap-1">
            {doc.doors
              .filter((d) => !d.sides.every((x) => x === OUTDOORS || doc.rooms.some((r) => r.id === x)))
              .map((d) => (
                <li key={d.id}>{item(nodeId("door", d.id), d.name || d.id)}</li>
              ))}
            {evaporators(doc)
              .filter((e) => !doc.rooms.some((r) => r.id === e.roomId))
              .map((e) => (
                <li key={e.id}>{item(nodeId("evaporator", e.id), e.tag)}</li>
              ))}
          </ul>
        </>
      ) : null}
    </div>
  );
}

function InlineNumber({ label, value, disabled, onValid }: { label: string; value: number; disabled: boolean; onValid: (v: number) => string | null }) {
  const [text, setText] = useState(String(Number(value.toPrecision(6))));
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="flex flex-col">
      <input
        aria-label={label}
        className={`w-20 rounded border bg-surface px-1.5 py-0.5 text-right font-mono text-sm ${error ? "border-danger" : "border-line"}`}
        value={text}
        disabled={disabled}
        inputMode="decimal"
        aria-invalid={error ? true : undefined}
        onChange={(e) => {
          setText(e.target.value);
          const n = Number(e.target.value.replace(",", "."));
          setError(Number.isFinite(n) && e.target.value.trim() !== "" ? onValid(n) : "must be a number");
        }}
      />
      {error ? (
        <span role="alert" className="text-xs text-danger">
          ⚠ {label} {error}
        </span>
      ) : null}
    </span>
  );
}
