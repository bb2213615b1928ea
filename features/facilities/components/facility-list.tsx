"use client";
import { useState } from "react";
import Link from "next/link";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { fmt, type UnitSystem } from "@/lib/units";
import type { FacilityDto } from "../schema";
import { SiteConditionsForm } from "./site-conditions-form";

export function FacilityList({ ws, canEdit, unitSystem }: { ws: string; canEdit: boolean; unitSystem: UnitSystem }) {
  const qc = useQueryClient();
  const [archived, setArchived] = useState(false);
  const [creating, setCreating] = useState(false);
  const [name, setName] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [banner, setBanner] = useState<string | null>(null);
  const key = ["facilities", ws, archived];
  const list = useQuery({
    queryKey: key,
    queryFn: () => api<{ facilities: FacilityDto[] }>(`/api/v1/workspaces/${ws}/facilities?archived=${archived ? 1 : 0}`),
  });
  const invalidate = () => qc.invalidateQueries({ queryKey: ["facilities", ws] });
  const onError = (e: unknown) => setBanner(e instanceof ApiError ? e.message : "Could not reach the server.");

  const create = useMutation({
    mutationFn: (site: Record<string, number | null>) =>
      api<{ facility: FacilityDto }>(`/api/v1/workspaces/${ws}/facilities`, { method: "POST", json: { name, site } }),
    onSuccess: () => {
      setCreating(false);
      setName("");
      setErrors({});
      invalidate();
    },
    onError: (e) => (e instanceof ApiError && e.code === "validation" ? setErrors(e.fieldMap()) : onError(e)),
  });
  const duplicate = useMutation({
    mutationFn: (id: string) => api(`/api/v1/workspaces/${ws}/facilities/${id}/duplicate`, { method: "POST", json: {} }),
    onSuccess: invalidate,
    onError,
  });
  const archive = useMutation({
    mutationFn: (v: { id: string; archived: boolean }) =>
      api(`/api/v1/workspaces/${ws}/facilities/${v.id}/archive`, { method: "POST", json: { archived: v.archived } }),
    onSuccess: invalidate,
    onError,
  });

  const rows = list.data?.facilities ?? [];
  return (
    <main className="flex flex-col gap-4 p-4">
      <div className="flex items-center gap-3">
        <h2 className="text-sm font-semibold">{archived ? "Archived facilities" : "Facilities"}</h2>
        <label className="flex items-center gap-1 text-xs text-muted">
          <input type="checkbox" checked={archived} onChange={(e) => setArchived(e.target.checked)} /> show archived
        </label>
        {canEdit && !creating ? (
          <Button variant="primary" className="ml-auto" onClick={() => setCreating(true)}>
            New facility
          </Button>
        ) : null}
      </div>
      {banner ? (
        <p role="alert" className="rounded border border-danger/50 bg-danger/10 px-3 py-2 text-sm text-danger">
          ⚠ {banner}{" "}
          <button className="underline" onClick={() => setBanner(null)}>
            dismiss
          </button>
        </p>
      ) : null}
      {creating ? (
        <section className="rounded border border-line bg-surface-2 p-4" aria-label="New facility">
          <SiteConditionsForm
            unitSystem={unitSystem}
            errors={errors}
            submitLabel="Create facility"
            onSubmit={(site) => create.mutate(site)}
            extra={<Field id="name" label="Facility name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} />}
          />
          <Button variant="ghost" className="mt-2" onClick={() => { setCreating(false); setErrors({}); }}>
            Cancel
          </Button>
        </section>
      ) : null}
      {list.isPending ? (
        <div className="flex flex-col gap-2" aria-busy="true" aria-label="Loading facilities">
          {[0, 1, 2].map((i) => (
            <div key={i} className="h-9 animate-pulse rounded bg-surface-3" />
          ))}
        </div>
      ) : list.isError ? (
        <p role="alert" className="text-sm text-danger">⚠ {(list.error as Error).message}</p>
      ) : rows.length === 0 ? (
        <div className="rounded border border-dashed border-line p-8 text-center text-sm text-muted">
          {archived
            ? "No archived facilities."
            : "A facility is one warehouse site: its rooms, doors, evaporators, circuits and condensers. " +
              (canEdit ? "Create the first one with “New facility”." : "A designer or owner creates facilities.")}
        </div>
      ) : (
        <table className="w-full border-collapse text-sm">
          <thead>
            <tr className="border-b border-line text-left text-xs text-muted">
              <th className="py-1.5 pr-3 font-medium">Facility</th>
              <th className="py-1.5 pr-3 text-right font-medium">Design dry bulb</th>
              <th className="py-1.5 pr-3 text-right font-medium">Wet bulb / RH</th>
              <th className="py-1.5 pr-3 text-right font-medium">Ground</th>
              <th className="py-1.5 pr-3 text-right font-medium">Elevation</th>
              <th className="py-1.5 pr-3 font-medium">Updated</th>
              <th className="py-1.5 font-medium"><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {rows.map((f) => (
              <tr key={f.id} className="border-b border-line/60 hover:bg-surface-2">
                <td className="py-1.5 pr-3">
                  <Link className="font-medium text-accent hover:underline" href={`/w/${ws}/f/${f.id}`}>
                    {f.name}
                  </Link>
                </td>
                <td className="py-1.5 pr-3 text-right font-mono">{fmt.temp(f.site.designDryBulbC, unitSystem)}</td>
                <td className="py-1.5 pr-3 text-right font-mono">
                  {f.site.coincidentWetBulbC != null ? fmt.temp(f.site.coincidentWetBulbC, unitSystem) : `${fmt.number(f.site.designRhPct ?? NaN, 0)} % RH`}
                </td>
                <td className="py-1.5 pr-3 text-right font-mono">{fmt.temp(f.site.groundTempC, unitSystem)}</td>
                <td className="py-1.5 pr-3 text-right font-mono">{fmt.length(f.site.elevationM, unitSystem)}</td>
                <td className="py-1.5 pr-3 text-xs text-muted">{new Date(f.updatedAt).toLocaleString("en-GB")}</td>
                <td className="py-1.5 text-right">
                  {canEdit ? (
                    <span className="inline-flex gap-1">
                      <Button variant="ghost" onClick={() => duplicate.mutate(f.id)} aria-label={`Duplicate ${f.name}`}>
                        Duplicate
                      </Button>
                      <Button variant="ghost" onClick={() => archive.mutate({ id: f.id, archived: !f.archived })} aria-label={`${f.archived ? "Restore" : "Archive"} ${f.name}`}>
                        {f.archived ? "Restore" : "Archive"}
                      </Button>
                    </span>
                  ) : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </main>
  );
}
