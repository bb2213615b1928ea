"use client";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { api, ApiError } from "@/lib/api-client";
import { ISSUE_STATUSES, type RevisionRow } from "../schema";

const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" }) + " UTC";

export function RevisionsPanel({ ws, facilityId, current, rows, canRestore, canIssue }: { ws: string; facilityId: string; current: number; rows: RevisionRow[]; canRestore: boolean; canIssue: boolean }) {
  const router = useRouter();
  const base = `/api/v1/workspaces/${ws}/facilities/${facilityId}/revisions`;
  const [status, setStatus] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [issuing, setIssuing] = useState<number | null>(null);
  const [busy, setBusy] = useState(false);

  const restore = async (n: number) => {
    setBusy(true);
    try {
      const r = await api<{ version: number }>(`${base}/${n}/restore`, { method: "POST" });
      setStatus({ kind: "ok", text: `Revision ${n} restored as version ${r.version} (history is kept: nothing was deleted).` });
      router.refresh();
    } catch (e) {
      setStatus({ kind: "error", text: e instanceof Error ? e.message : "Not restored." });
    } finally {
      setBusy(false);
    }
  };

  if (rows.length === 0)
    return (
      <main className="max-w-2xl p-4 text-sm">
        <p>Every save of the model becomes a numbered revision here; a revision can be restored, or issued with a letter, a status and a checker, which locks it.</p>
        <p className="mt-2 text-muted">No revisions yet: draw the facility on the Layout and it is saved as you go.</p>
      </main>
    );

  return (
    <main className="flex max-w-5xl flex-col gap-3 p-4">
      {status ? (
        <p role={status.kind === "error" ? "alert" : "status"} className={`text-sm ${status.kind === "ok" ? "text-ok" : "text-danger"}`}>
          {status.kind === "ok" ? "✓" : "⚠"} {status.text}
        </p>
      ) : null}
      <table className="w-full text-sm">
        <thead className="text-xs text-muted">
          <tr className="border-b border-line">
            <th className="py-1 text-left font-normal">Version</th>
            <th className="text-left font-normal">Saved</th>
            <th className="text-left font-normal">By</th>
            <th className="text-left font-normal">Summary</th>
            <th className="text-left font-normal">Issue</th>
            <th className="text-right font-normal">Actions</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.number} className="border-b border-line/60 align-top">
              <td className="py-1.5 font-mono">
                {r.number}
                {r.number === current ? <span className="ml-1 rounded border border-accent px-1 font-sans text-xs text-ink">current</span> : null}
              </td>
              <td className="whitespace-nowrap text-xs">{when(r.createdAt)}</td>
              <td className="text-xs">{r.author}</td>
              <td className="text-xs">{r.summary ?? "—"}</td>
              <td className="text-xs">
                {r.issued ? (
                  <span title={`Issued ${when(r.issued.at)} by ${r.issued.by}`}>
                    <span className="font-semibold">Rev {r.issued.letter}</span> · {r.issued.status} · checked by {r.issued.checkedBy}
                    <span className="block text-muted">Locked · issued {when(r.issued.at)} by {r.issued.by}</span>
                  </span>
                ) : (
                  <span className="text-muted">not issued</span>
                )}
              </td>
              <td className="text-right">
                <div className="flex justify-end gap-1">
                  {canRestore && r.number !== current ? (
                    <Button className="!px-2 !py-0.5 text-xs" disabled={busy} onClick={() => void restore(r.number)}>
                      Restore
                    </Button>
                  ) : null}
                  {canIssue && !r.issued ? (
                    <Button className="!px-2 !py-0.5 text-xs" onClick={() => setIssuing(issuing === r.number ? null : r.number)} aria-expanded={issuing === r.number}>
                      Issue…
                    </Button>
                  ) : null}
                </div>
                {issuing === r.number ? (
                  <IssueForm
                    url={`${base}/${r.number}/issue`}
                    onDone={(letter) => {
                      setIssuing(null);
                      setStatus({ kind: "ok", text: `Version ${r.number} issued as revision ${letter}; it is now locked.` });
                      router.refresh();
                    }}
                  />
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </main>
  );
}

function IssueForm({ url, onDone }: { url: string; onDone: (letter: string) => void }) {
  const [letter, setLetter] = useState("");
  const [status, setStatus] = useState<string>(ISSUE_STATUSES[0]);
  const [checkedBy, setCheckedBy] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [busy, setBusy] = useState(false);
  const submit = async (e: React.FormEvent) => {
    e.preventDefault();
    setBusy(true);
    try {
      await api(url, { method: "POST", json: { letter: letter.trim().toUpperCase(), status, checkedBy } });
      onDone(letter.trim().toUpperCase());
    } catch (err) {
      setErrors(err instanceof ApiError ? err.fieldMap() : { letter: "Not issued." });
      if (err instanceof ApiError && !err.field && !err.fields?.length) setErrors({ letter: err.message });
    } finally {
      setBusy(false);
    }
  };
  return (
    <form onSubmit={submit} className="mt-2 flex flex-col gap-2 rounded border border-line bg-surface-2 p-2 text-left">
      <Field id="issue-letter" label="Revision letter" value={letter} onChange={(e) => setLetter(e.target.value)} error={errors.letter} hint="e.g. A, B, P1" required />
      <div className="flex flex-col gap-1">
        <label htmlFor="issue-status" className="text-xs font-medium text-muted">
          Status
        </label>
        <select id="issue-status" className="rounded border border-line bg-surface px-2 py-1.5 text-sm" value={status} onChange={(e) => setStatus(e.target.value)}>
          {ISSUE_STATUSES.map((s) => (
            <option key={s}>{s}</option>
          ))}
        </select>
        {errors.status ? <p className="text-xs text-danger">⚠ {errors.status}</p> : null}
      </div>
      <Field id="issue-checked" label="Checked by" value={checkedBy} onChange={(e) => setCheckedBy(e.target.value)} error={errors.checkedBy} required />
      <Button variant="primary" disabled={busy} type="submit">
        Issue and lock
      </Button>
    </form>
  );
}
