"use client";
import { useRef, useState } from "react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { Button } from "@/components/ui/button";
import { Field } from "@/components/form/field";
import { ApiError } from "@/lib/api-client";
import { fmt } from "@/lib/units";
import { JobProgress, type JobDto } from "@/features/jobs";
import type { ImportResultDto } from "../schema";

type Kind = "rooms" | "stocking";

/** Preview column titles: the value as stored, in SI. */
const KEY_LABEL: Record<string, string> = {
  name: "Name",
  lengthM: "Length (m)",
  widthM: "Width (m)",
  heightM: "Height (m)",
  setPointC: "Set point (°C)",
  rhPct: "RH (%)",
  kind: "Kind",
  construction: "Construction",
  room: "Room",
  commodity: "Commodity",
  tonnesPerDay: "Intake (t/day)",
  enteringTempC: "Entering (°C)",
  finalTempC: "Final (°C)",
  pullDownHours: "Pull-down (h)",
  storedMassKg: "Stored (kg)",
};
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

const HELP: Record<Kind, { title: string; columns: string; example: string }> = {
  rooms: {
    title: "Room list",
    columns: "Name, Length, Width, Height, Set point; optional RH [%], Kind (storage, blast, ripening, dock, ca, processing, anteroom), Construction (e.g. “PIR 150” in mm, or “U 0.2”).",
    example: "Name; Length [m]; Width [m]; Height [m]; Set point [°C]; Construction",
  },
  stocking: {
    title: "Stocking plan",
    columns: "Room (name or id); any of Commodity, Intake [t/day or kg/day], Entering [°C/°F], Final, Pull-down [h], Stored [kg/t/lb], Set point.",
    example: "Room, Commodity, Intake [t/day], Entering [°C], Pull-down [h]",
  },
};

/** preview → the checked rows now; commit → 202 with the import job. */
async function send(url: string, file: File, mode: "preview", name?: string): Promise<ImportResultDto>;
async function send(url: string, file: File, mode: "commit", name?: string): Promise<{ job: JobDto }>;
async function send(url: string, file: File, mode: "preview" | "commit", name?: string): Promise<unknown> {
  const fd = new FormData();
  fd.set("file", file);
  fd.set("mode", mode);
  if (name) fd.set("name", name);
  const res = await fetch(url, { method: "POST", body: fd });
  const data = await res.json().catch(() => ({}));
  if (!res.ok) {
    const e = data?.error ?? {};
    throw new ApiError(e.message ?? `Import failed (${res.status})`, res.status, e.code ?? "unknown", e.field, e.fields, data);
  }
  return data;
}

function ImportSection({ kind, ws, facilityId }: { kind: Kind; ws: string; facilityId: string }) {
  const url = `/api/v1/workspaces/${ws}/facilities/${facilityId}/import/${kind}`;
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState("");
  const [busy, setBusy] = useState<"preview" | "commit" | null>(null);
  const [preview, setPreview] = useState<ImportResultDto | null>(null);
  const [error, setError] = useState<{ message: string; fields?: { field: string; message: string }[] } | null>(null);
  const [done, setDone] = useState<ImportResultDto | null>(null);
  const [job, setJob] = useState<JobDto | null>(null);
  const h = HELP[kind];
  const router = useRouter();

  async function run(mode: "preview" | "commit") {
    if (!file) return;
    setBusy(mode);
    setError(null);
    try {
      const n = kind === "stocking" ? name.trim() || undefined : undefined;
      if (mode === "preview") setPreview(await send(url, file, "preview", n));
      else {
        // The commit runs on the worker; its progress and outcome show below.
        setJob((await send(url, file, "commit", n)).job);
        setPreview(null);
      }
    } catch (e) {
      setError(e instanceof ApiError ? { message: e.message, fields: e.fields } : { message: "The upload did not reach the server. Try again." });
    } finally {
      setBusy(null);
    }
  }

  function finished(j: JobDto) {
    if (j.status === "done") {
      setDone(j.result as unknown as ImportResultDto);
      setJob(null);
      router.refresh();
    }
  }
  const importing = job !== null && job.status !== "done" && job.status !== "failed";

  const errorsByRow = new Map<number, { column: string; message: string }[]>();
  for (const e of preview?.errors ?? []) errorsByRow.set(e.row, [...(errorsByRow.get(e.row) ?? []), e]);
  const headerErrors = errorsByRow.get(1) ?? [];
  const valueKeys = preview ? [...new Set(preview.rows.flatMap((r) => Object.keys(r.values)))] : [];

  return (
    <section aria-labelledby={`${kind}-h`} className="flex flex-col gap-3 rounded border border-line bg-surface-2 p-4">
      <h2 id={`${kind}-h`} className="text-base font-semibold">
        Import a {h.title.toLowerCase()}
      </h2>
      <p className="text-xs text-muted">
        .xlsx (first sheet) or .csv (comma, semicolon or tab separated, UTF-8), up to 2 MB and 1000 rows. Columns: {h.columns} Units go in the header, e.g. <code className="font-mono">{h.example}</code>; decimal commas are read.
      </p>
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${kind}-file`} className="text-xs font-medium text-muted">
            File
          </label>
          <input
            ref={input}
            id={`${kind}-file`}
            type="file"
            accept=".xlsx,.csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet,text/csv"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setPreview(null);
              setDone(null);
              setError(null);
              setJob(null);
            }}
            className="text-sm"
          />
        </div>
        {kind === "stocking" ? (
          <div className="w-72">
            <Field id="stocking-import-name" label="Name of the stocking check" placeholder="Stocking plan from <file>" value={name} onChange={(e) => setName(e.target.value)} maxLength={120} />
          </div>
        ) : null}
        <Button onClick={() => run("preview")} disabled={!file || busy !== null || importing}>
          {busy === "preview" ? "Reading…" : "Preview"}
        </Button>
        {preview ? (
          <Button variant="primary" onClick={() => run("commit")} disabled={busy !== null || preview.errors.length > 0 || preview.itemCount === 0}>
            {busy === "commit" ? "Importing…" : kind === "rooms" ? `Import ${plural(preview.itemCount, "room", "rooms")}` : `Save as a stocking check (${plural(preview.itemCount, "room", "rooms")})`}
          </Button>
        ) : null}
      </div>
      {error ? (
        <div role="alert" className="text-sm text-danger">
          <p>⚠ {error.message}</p>
          {error.fields?.length ? (
            <ul className="mt-1 list-disc pl-5 text-xs">
              {error.fields.map((f) => (
                <li key={f.field + f.message}>
                  {f.field}: {f.message}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      {job ? <JobProgress key={job.id} job={job} label={`Import of ${job.result && "fileName" in job.result ? String(job.result.fileName) : (file?.name ?? "the file")}`} onFinished={(j) => (j.status === "done" ? finished(j) : setJob(j))} /> : null}
      {done ? (
        <p role="status" className="text-sm text-ok">
          ✓ Imported from {done.fileName}:{" "}
          {done.committed?.version !== undefined ? `${plural(done.itemCount, "room", "rooms")}, saved as model version ${done.committed.version}.` : null}
          {done.committed?.scenarioId ? (
            <>
              {plural(done.itemCount, "room", "rooms")} in one stocking check —{" "}
              <Link className="text-accent underline" href={`/w/${ws}/f/${facilityId}/stocking?s=${done.committed.scenarioId}`}>
                open its verdict
              </Link>
              .
            </>
          ) : null}
        </p>
      ) : null}
      {preview ? (
        <div className="flex flex-col gap-2">
          <p role="status" className={`text-sm ${preview.errors.length ? "text-danger" : "text-ok"}`}>
            {preview.errors.length
              ? `⚠ ${preview.errors.length} problem${preview.errors.length === 1 ? "" : "s"}: nothing will be imported until every row is right.`
              : `✓ ${preview.rows.length} rows read from ${preview.fileName}, no problems. Nothing is changed until you import.`}
          </p>
          {headerErrors.length ? (
            <ul className="text-sm text-danger">
              {headerErrors.map((e) => (
                <li key={e.message}>⚠ Header: {e.message}</li>
              ))}
            </ul>
          ) : null}
          <ul className="list-disc pl-5 text-xs text-muted">
            {preview.notes.map((n) => (
              <li key={n}>{n}</li>
            ))}
          </ul>
          <div className="overflow-x-auto rounded border border-line bg-surface">
            <table className="w-full text-sm">
              <thead className="bg-surface-3 text-left text-xs text-muted">
                <tr>
                  <th className="px-2 py-1 font-medium">Row</th>
                  <th className="px-2 py-1 font-medium">Item</th>
                  <th className="px-2 py-1 font-medium">Action</th>
                  {valueKeys.map((k) => (
                    <th key={k} className="px-2 py-1 font-medium">
                      {KEY_LABEL[k] ?? k}
                    </th>
                  ))}
                  <th className="px-2 py-1 font-medium">Problems</th>
                </tr>
              </thead>
              <tbody>
                {preview.rows.map((r) => {
                  const errs = errorsByRow.get(r.row) ?? [];
                  return (
                    <tr key={r.row} className={`border-t border-line ${errs.length ? "bg-danger/5" : ""}`}>
                      <td className="px-2 py-1 font-mono">{r.row}</td>
                      <td className="px-2 py-1">{r.label}</td>
                      <td className="px-2 py-1 text-xs">{r.action}</td>
                      {valueKeys.map((k) => (
                        <td key={k} className="px-2 py-1 font-mono text-xs tabular-nums">
                          {r.values[k] === null || r.values[k] === undefined ? "" : typeof r.values[k] === "number" ? fmt.number(r.values[k] as number, 2) : String(r.values[k])}
                        </td>
                      ))}
                      <td className="px-2 py-1 text-xs text-danger">
                        {errs.map((e) => (
                          <div key={e.column + e.message}>
                            ⚠ {e.column}: {e.message}
                          </div>
                        ))}
                      </td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </div>
        </div>
      ) : null}
    </section>
  );
}

export function ImportPanel({ ws, facilityId, canImportRooms, canImportStocking }: { ws: string; facilityId: string; canImportRooms: boolean; canImportStocking: boolean }) {
  return (
    <main className="flex max-w-6xl flex-col gap-4 p-4">
      <p className="text-sm text-muted">Bring a room list or a stocking plan in from a spreadsheet. A preview shows every row and what is wrong with it; the import then happens all at once, or not at all.</p>
      {canImportStocking ? <ImportSection kind="stocking" ws={ws} facilityId={facilityId} /> : null}
      {canImportRooms ? <ImportSection kind="rooms" ws={ws} facilityId={facilityId} /> : null}
    </main>
  );
}
