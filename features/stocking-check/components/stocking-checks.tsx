"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { fmt, type UnitSystem } from "@/lib/units";
import type { CreateScenarioInput, ScenarioDto } from "../schema";
import { ScenarioForm, type CommodityOption, type RoomOption } from "./scenario-form";
import { ScenarioResult } from "./scenario-result";
import { VerdictBadge } from "./verdict-badge";
import { ScenarioCompare } from "./scenario-compare";
import { InstalledPlant } from "./installed-plant";

interface Props {
  ws: string;
  facilityId: string;
  unitSystem: UnitSystem;
  rooms: RoomOption[];
  commodities: CommodityOption[];
  initial: ScenarioDto[];
  initialSelected: string | null;
  canCreate: boolean;
  canApply: boolean;
  installedRecorded: boolean;
  currentVersion: number;
  canEditModel: boolean;
}

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

export function StockingChecks(p: Props) {
  const base = `/api/v1/workspaces/${p.ws}/facilities/${p.facilityId}/scenarios`;
  const qc = useQueryClient();
  const router = useRouter();
  const list = useQuery({ queryKey: ["scenarios", p.facilityId], queryFn: () => api<{ scenarios: ScenarioDto[] }>(base).then((r) => r.scenarios), initialData: p.initial });
  const scenarios = list.data ?? [];
  const [selected, setSelected] = useState<string | null>(p.initialSelected ?? scenarios[0]?.id ?? null);
  const [compare, setCompare] = useState<string[]>([]);
  const [creating, setCreating] = useState(scenarios.length === 0 && p.canCreate && p.installedRecorded);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  const roomNames = Object.fromEntries(p.rooms.map((r) => [r.id, r.name]));

  const create = useMutation({
    mutationFn: (input: CreateScenarioInput) => api<ScenarioDto>(base, { method: "POST", json: input }),
    onSuccess: (s) => {
      qc.setQueryData<ScenarioDto[]>(["scenarios", p.facilityId], (old) => [s, ...(old ?? [])]);
      setSelected(s.id);
      setCreating(false);
      setErrors({});
      setFormError(null);
    },
    onError: (e) => {
      if (e instanceof ApiError) {
        setErrors(e.fieldMap());
        setFormError(e.message);
      } else setFormError("The check did not run. Try again.");
    },
  });

  const current = scenarios.find((s) => s.id === selected) ?? null;
  const comparing = compare.map((id) => scenarios.find((s) => s.id === id)).filter((s): s is ScenarioDto => Boolean(s));

  return (
    <main className="grid flex-1 grid-cols-1 gap-4 p-4 lg:grid-cols-[20rem_1fr]">
      <aside aria-label="Stocking checks" className="flex flex-col gap-2">
        <div className="flex items-center justify-between">
          <h2 className="text-sm font-semibold">Stocking checks</h2>
          {p.canCreate && p.installedRecorded ? (
            <Button variant="primary" onClick={() => setCreating(true)}>
              New check
            </Button>
          ) : null}
        </div>
        {scenarios.length === 0 ? (
          <p className="text-sm text-muted">
            A stocking check tests a change of stock — a new commodity, more tonnes a day, warmer arrivals, a room re-purposed — against the installed plant before you make it.
            {p.canCreate ? "" : " Your role can read checks others run."}
          </p>
        ) : (
          <ul className="flex flex-col divide-y divide-line rounded border border-line">
            {scenarios.map((s) => (
              <li key={s.id} className={`flex items-start gap-2 p-2 ${s.id === selected ? "bg-surface-3" : ""}`}>
                <input
                  type="checkbox"
                  aria-label={`Compare ${s.name}`}
                  className="mt-1"
                  checked={compare.includes(s.id)}
                  onChange={(e) => setCompare(e.target.checked ? [...compare, s.id] : compare.filter((x) => x !== s.id))}
                />
                <button type="button" className="flex flex-1 flex-col items-start text-left" onClick={() => (setSelected(s.id), setCreating(false))}>
                  <span className="text-sm font-medium">{s.name}</span>
                  <span className="text-xs text-muted">
                    {s.author?.name ?? "(removed user)"} · {when(s.createdAt)}
                  </span>
                  <span className="mt-1 flex gap-1">
                    {s.verdict ? <VerdictBadge verdict={s.verdict} /> : null}
                    {s.appliedAt ? <span className="text-xs text-muted">applied v{s.appliedRevision}</span> : s.acceptedAt ? <span className="text-xs text-muted">accepted</span> : null}
                  </span>
                </button>
              </li>
            ))}
          </ul>
        )}
        {p.canCreate ? (
          <a href={`/w/${p.ws}/f/${p.facilityId}/import`} className="text-xs text-accent hover:underline">
            Import a stocking plan or room list from a spreadsheet
          </a>
        ) : null}
        {compare.length >= 2 ? <p className="text-xs text-muted">Comparing {compare.length} checks side by side.</p> : scenarios.length >= 2 ? <p className="text-xs text-muted">Tick two or more to compare them.</p> : null}
      </aside>

      <section className="flex min-w-0 flex-col gap-4">
        {!p.installedRecorded ? (
          <p role="status" className="rounded border border-warn/50 bg-warn/10 p-3 text-sm">
            ⚠ No installed plant is recorded for this facility, so a check has nothing to compare with.{" "}
            {p.canEditModel ? "Record it below: propose it from the design, correct the ratings to the equipment installed, and save." : "A designer records the installed evaporators, compressors and condensers."}
          </p>
        ) : null}
        {creating && p.canCreate ? (
          <>
            {formError ? (
              <p role="alert" className="text-sm text-danger">
                ⚠ {formError}
              </p>
            ) : null}
            <ScenarioForm rooms={p.rooms} commodities={p.commodities} unitSystem={p.unitSystem} errors={errors} pending={create.isPending} onSubmit={(i) => create.mutate(i)} onCancel={() => setCreating(false)} />
          </>
        ) : comparing.length >= 2 ? (
          <ScenarioCompare scenarios={comparing} unitSystem={p.unitSystem} />
        ) : current ? (
          <ScenarioDetail
            key={current.id}
            s={current}
            base={base}
            unitSystem={p.unitSystem}
            roomNames={roomNames}
            canCreate={p.canCreate}
            canApply={p.canApply}
            currentVersion={p.currentVersion}
            onRerun={(s) =>
              create.mutate({ name: s.name.endsWith(`(v${p.currentVersion})`) ? s.name : `${s.name} (v${p.currentVersion})`.slice(0, 120), changes: s.changes })
            }
            rerunPending={create.isPending}
            onChanged={(s) => {
              qc.setQueryData<ScenarioDto[]>(["scenarios", p.facilityId], (old) => (old ?? []).map((x) => (x.id === s.id ? s : x)));
              router.refresh();
            }}
          />
        ) : null}
        <InstalledPlant ws={p.ws} facilityId={p.facilityId} unitSystem={p.unitSystem} canEdit={p.canEditModel} recorded={p.installedRecorded} />
      </section>
    </main>
  );
}

function describeChange(c: ScenarioDto["changes"]["rooms"][number], s: UnitSystem, roomNames: Record<string, string>): string {
  const parts = [
    c.commodityId ? `commodity ${c.commodityId}` : null,
    c.tonnesPerDay !== undefined ? `${fmt.number(c.tonnesPerDay, 2)} t/day` : null,
    c.enteringTempC !== undefined ? `entering ${fmt.temp(c.enteringTempC, s)}` : null,
    c.finalTempC !== undefined ? `final ${fmt.temp(c.finalTempC, s)}` : null,
    c.pullDownHours !== undefined ? `pull-down ${fmt.number(c.pullDownHours, 1)} h` : null,
    c.storedMassKg !== undefined ? `stored ${fmt.mass(c.storedMassKg, s)}` : null,
    c.setPointC !== undefined ? `set point ${fmt.temp(c.setPointC, s)}` : null,
  ].filter(Boolean);
  return `${roomNames[c.roomId] ?? c.roomId}: ${parts.join(", ")}`;
}

function ScenarioDetail({
  s,
  base,
  unitSystem,
  roomNames,
  canCreate,
  canApply,
  currentVersion,
  onRerun,
  rerunPending,
  onChanged,
}: {
  s: ScenarioDto;
  base: string;
  unitSystem: UnitSystem;
  roomNames: Record<string, string>;
  canCreate: boolean;
  canApply: boolean;
  currentVersion: number;
  onRerun: (s: ScenarioDto) => void;
  rerunPending: boolean;
  onChanged: (s: ScenarioDto) => void;
}) {
  const stale = s.baseVersion < currentVersion && !s.appliedAt;
  const [to, setTo] = useState("");
  const [emailOpen, setEmailOpen] = useState(false);
  const [msg, setMsg] = useState<{ ok: boolean; text: string; field?: string } | null>(null);
  const fail = (e: unknown) => setMsg({ ok: false, text: e instanceof Error ? e.message : "That did not work.", field: e instanceof ApiError ? e.field : undefined });
  const email = useMutation({
    mutationFn: () => api<{ sent: number }>(`${base}/${s.id}/email`, { method: "POST", json: { to: to.split(/[,;\s]+/).filter(Boolean) } }),
    onSuccess: (r) => (setMsg({ ok: true, text: `Sent to ${r.sent} recipient${r.sent === 1 ? "" : "s"}.` }), setEmailOpen(false)),
    onError: fail,
  });
  const accept = useMutation({
    mutationFn: () => api<ScenarioDto>(`${base}/${s.id}/accept`, { method: "POST" }),
    onSuccess: (x) => (onChanged(x), setMsg({ ok: true, text: "Accepted: a designer can now apply it to the model." })),
    onError: fail,
  });
  const apply = useMutation({
    mutationFn: () => api<{ scenario: ScenarioDto; version: number }>(`${base}/${s.id}/apply`, { method: "POST" }),
    onSuccess: (x) => (onChanged(x.scenario), setMsg({ ok: true, text: `Applied to the model as version ${x.version}.` })),
    onError: fail,
  });
  return (
    <article aria-labelledby="scenario-h" className="flex flex-col gap-4">
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h2 id="scenario-h" className="text-base font-semibold">
            {s.name}
          </h2>
          <p className="text-xs text-muted">
            by {s.author?.name ?? "(removed user)"} · {when(s.createdAt)} · against version {s.baseVersion}
            {s.acceptedAt ? ` · accepted ${when(s.acceptedAt)}` : ""}
            {s.appliedAt ? ` · applied as version ${s.appliedRevision}` : ""}
          </p>
          <ul className="mt-1 text-sm">
            {s.changes.rooms.map((c) => (
              <li key={c.roomId}>{describeChange(c, unitSystem, roomNames)}</li>
            ))}
          </ul>
        </div>
        <div className="flex flex-wrap gap-2">
          {canCreate ? (
            <Button onClick={() => setEmailOpen(!emailOpen)} aria-expanded={emailOpen}>
              E-mail…
            </Button>
          ) : null}
          {canCreate && !s.acceptedAt && s.verdict !== "shortfall" ? (
            <Button onClick={() => accept.mutate()} disabled={accept.isPending}>
              Accept
            </Button>
          ) : null}
          {canApply && s.acceptedAt && !s.appliedAt ? (
            <Button variant="primary" onClick={() => apply.mutate()} disabled={apply.isPending}>
              {apply.isPending ? "Applying…" : "Apply to the model"}
            </Button>
          ) : null}
        </div>
      </header>
      {stale ? (
        <p role="status" className="flex flex-wrap items-center gap-2 rounded border border-warn/50 bg-warn/10 p-2 text-sm">
          ⚠ The model is now version {currentVersion}; this check ran against version {s.baseVersion}.
          {canCreate ? (
            <Button onClick={() => onRerun(s)} disabled={rerunPending}>
              {rerunPending ? "Running…" : `Run it again on version ${currentVersion}`}
            </Button>
          ) : null}
        </p>
      ) : null}
      {emailOpen ? (
        <form
          className="flex flex-wrap items-end gap-2 rounded border border-line bg-surface-2 p-3"
          onSubmit={(e) => {
            e.preventDefault();
            email.mutate();
          }}
        >
          <div className="min-w-72 flex-1">
            <Field id="email-to" label="Send the summary to (comma-separated)" type="text" value={to} onChange={(e) => setTo(e.target.value)} error={msg && !msg.ok && msg.field?.startsWith("to") ? msg.text : undefined} />
          </div>
          <Button type="submit" variant="primary" disabled={email.isPending || !to.trim()}>
            {email.isPending ? "Sending…" : "Send"}
          </Button>
        </form>
      ) : null}
      {msg ? (
        <p role={msg.ok ? "status" : "alert"} className={`text-sm ${msg.ok ? "text-ok" : "text-danger"}`}>
          {msg.ok ? "✓" : "⚠"} {msg.text}
        </p>
      ) : null}
      {s.result ? <ScenarioResult result={s.result} unitSystem={unitSystem} roomNames={roomNames} /> : <p className="text-sm text-muted">No result stored.</p>}
    </article>
  );
}
