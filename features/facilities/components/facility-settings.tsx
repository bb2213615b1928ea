"use client";
import { useState } from "react";
import { useMutation } from "@tanstack/react-query";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import type { UnitSystem } from "@/lib/units";
import type { FacilityDto } from "../schema";
import { SiteConditionsForm } from "./site-conditions-form";

export function FacilitySettings({ ws, facility: initial, canEdit, unitSystem }: { ws: string; facility: FacilityDto; canEdit: boolean; unitSystem: UnitSystem }) {
  const [facility, setFacility] = useState(initial);
  const [name, setName] = useState(initial.name);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const save = useMutation({
    mutationFn: (site: Record<string, number | null>) =>
      api<{ facility: FacilityDto }>(`/api/v1/workspaces/${ws}/facilities/${facility.id}`, {
        method: "PATCH",
        json: { name, site, baseVersion: facility.version },
      }),
    onSuccess: (r) => {
      setFacility(r.facility);
      setErrors({});
      setStatus({ kind: "ok", text: `Saved (version ${r.facility.version}).` });
    },
    onError: (e) => {
      if (e instanceof ApiError && e.code === "validation") {
        setErrors(e.fieldMap());
        setStatus({ kind: "error", text: "Not saved: correct the fields marked below." });
      } else setStatus({ kind: "error", text: e instanceof Error ? e.message : "Not saved." });
    },
  });
  return (
    <main className="flex flex-col">
      <section className="max-w-2xl p-4">
        {!canEdit ? <p className="mb-3 text-xs text-muted">Read-only for your role.</p> : null}
        {status ? (
          <p role={status.kind === "error" ? "alert" : "status"} className={`mb-3 text-sm ${status.kind === "ok" ? "text-ok" : "text-danger"}`}>
            {status.kind === "ok" ? "✓" : "⚠"} {status.text}
          </p>
        ) : null}
        <SiteConditionsForm
          initial={facility.site}
          unitSystem={unitSystem}
          errors={errors}
          disabled={!canEdit}
          submitLabel="Save site conditions"
          onSubmit={(site) => save.mutate(site)}
          extra={<Field id="name" label="Facility name" value={name} onChange={(e) => setName(e.target.value)} error={errors.name} disabled={!canEdit} />}
        />
      </section>
    </main>
  );
}
