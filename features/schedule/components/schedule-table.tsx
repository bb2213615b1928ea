"use client";
import { useEffect, useMemo, useState } from "react";
import { useQuery } from "@tanstack/react-query";
import {
  flexRender,
  getCoreRowModel,
  getExpandedRowModel,
  getFilteredRowModel,
  getGroupedRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type GroupingState,
  type SortingState,
  type VisibilityState,
} from "@tanstack/react-table";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/api-client";
import { JobProgress, type JobDto } from "@/features/jobs";
import { fmt, type UnitSystem } from "@/lib/units";
import { markText } from "../changes";
import { scheduleKindWord } from "../columns";
import type { ScheduleDto, ScheduleRowDto } from "../schema";

type Format = "xlsx" | "csv";
const when = (iso: string) => new Date(iso).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short" });

function columns(s: UnitSystem): ColumnDef<ScheduleRowDto>[] {
  const num = (v: number | undefined, f: (x: number) => string) => (v === undefined ? "" : f(v));
  return [
    { id: "tag", header: "Tag", accessorKey: "tag", enableHiding: false },
    { id: "kind", header: "Item", accessorFn: (r) => scheduleKindWord(r.kind) },
    { id: "description", header: "Description", accessorKey: "description" },
    { id: "room", header: "Room", accessorFn: (r) => r.roomName ?? "—" },
    { id: "circuit", header: "Circuit", accessorFn: (r) => r.circuitTag ?? (r.kind === "condenser" ? "condensers" : "—") },
    { id: "refrigerant", header: "Refrigerant", accessorFn: (r) => r.refrigerant ?? "" },
    { id: "quantity", header: "Qty (standby)", accessorKey: "quantity", cell: (c) => `${c.row.original.quantity}${c.row.original.standbyQuantity ? ` (${c.row.original.standbyQuantity})` : ""}`, meta: { numeric: true } },
    {
      id: "dutyPerUnit",
      header: "Duty / unit",
      accessorKey: "dutyPerUnitW",
      cell: (c) => fmt.power(c.row.original.dutyPerUnitW, s, c.row.original.kind === "condenser" || c.row.original.kind === "cascade-hx" ? "heat" : "refrigeration"),
      meta: { numeric: true },
    },
    {
      id: "duty",
      header: "Duty total",
      accessorKey: "dutyW",
      cell: (c) => fmt.power(c.row.original.dutyW, s, c.row.original.kind === "condenser" || c.row.original.kind === "cascade-hx" ? "heat" : "refrigeration"),
      aggregationFn: "sum",
      aggregatedCell: () => "",
      meta: { numeric: true },
    },
    { id: "electrical", header: "Electrical", accessorKey: "electricalW", cell: (c) => fmt.power(c.row.original.electricalW, s, "electrical"), meta: { numeric: true } },
    { id: "evaporating", header: "Evap. / suction", accessorFn: (r) => r.temperatures.evaporating ?? r.temperatures.suction, cell: (c) => num(c.getValue() as number | undefined, (v) => fmt.temp(v, s)), meta: { numeric: true } },
    { id: "condensing", header: "Condensing", accessorFn: (r) => r.temperatures.condensing, cell: (c) => num(c.getValue() as number | undefined, (v) => fmt.temp(v, s)), meta: { numeric: true } },
    { id: "rating", header: "Rating conditions", accessorKey: "ratingConditions" },
    {
      id: "changed",
      header: "Since last export",
      accessorFn: (r) => r.mark.status,
      cell: (c) => {
        const m = c.row.original.mark;
        if (m.status === "same") return <span className="text-muted">—</span>;
        return (
          <span className="font-sans text-xs font-semibold text-accent" title={markText(m)}>
            {m.status === "new" ? "● new" : `◆ ${markText(m)}`}
          </span>
        );
      },
    },
  ];
}

export function ScheduleTable({ ws, facilityId, unitSystem, initial, canExport }: { ws: string; facilityId: string; unitSystem: UnitSystem; initial: ScheduleDto; canExport: boolean }) {
  const base = `/api/v1/workspaces/${ws}/facilities/${facilityId}`;
  const q = useQuery({ queryKey: ["schedule", facilityId], queryFn: () => api<ScheduleDto>(`${base}/schedule`), initialData: initial });
  const data = q.data;
  const cols = useMemo(() => columns(unitSystem), [unitSystem]);
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filter, setFilter] = useState("");
  const [grouping, setGrouping] = useState<GroupingState>([]);
  const [visibility, setVisibility] = useState<VisibilityState>({ rating: false, refrigerant: false });
  const [starting, setStarting] = useState<Format | null>(null);
  const [exports, setExports] = useState<Partial<Record<Format, JobDto>>>({});
  // The exports of this tab survive leaving the page: coming back shows their progress or download.
  const storeKey = `rimeplan:exports:${facilityId}`;
  useEffect(() => {
    try {
      const saved = JSON.parse(sessionStorage.getItem(storeKey) ?? "{}") as Partial<Record<Format, JobDto>>;
      if (saved && typeof saved === "object") setExports((e) => ({ ...saved, ...e }));
    } catch {
      sessionStorage.removeItem(storeKey);
    }
  }, [storeKey]);
  useEffect(() => {
    if (Object.keys(exports).length) sessionStorage.setItem(storeKey, JSON.stringify(exports));
  }, [exports, storeKey]);
  const [msg, setMsg] = useState<{ ok: boolean; text: string } | null>(null);
  const table = useReactTable({
    data: data.rows,
    columns: cols,
    state: { sorting, globalFilter: filter, grouping, columnVisibility: visibility, expanded: true },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    onGroupingChange: setGrouping,
    onColumnVisibilityChange: setVisibility,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    getGroupedRowModel: getGroupedRowModel(),
    getExpandedRowModel: getExpandedRowModel(),
    globalFilterFn: "includesString",
    // Groups stay open; no reset is queued during render (React 19 warns about those).
    autoResetExpanded: false,
    autoResetPageIndex: false,
  });
  const changed = data.rows.filter((r) => r.mark.status !== "same").length;

  // An export runs as a job on the worker: the page stays usable while it is made.
  async function exportAs(format: Format) {
    setStarting(format);
    setMsg(null);
    try {
      const r = await api<{ job: JobDto }>(`${base}/exports`, { method: "POST", json: { format } });
      setExports((e) => ({ ...e, [format]: r.job }));
    } catch (e) {
      setMsg({ ok: false, text: e instanceof ApiError ? e.message : `The export could not be started (${String(e)}).` });
    } finally {
      setStarting(null);
    }
  }
  const running = (f: Format) => starting === f || (exports[f] !== undefined && !["done", "failed"].includes(exports[f]!.status));
  function finished(format: Format, job: JobDto) {
    setExports((e) => ({ ...e, [format]: job }));
    if (job.status === "done") q.refetch();
  }

  return (
    <main className="flex flex-col gap-3 p-4">
      <header className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 className="text-base font-semibold">Equipment schedule</h2>
          <p className="text-xs text-muted">
            {data.revision.issued && data.revision.letter ? `Revision ${data.revision.letter} (${data.revision.status})` : `Version ${data.revision.number}, not issued`} · {data.rows.length} items ·{" "}
            {data.lastExport
              ? `last exported ${when(data.lastExport.at)} by ${data.lastExport.by} (version ${data.lastExport.revisionNumber}${data.lastExport.issued ? ", issued" : ""}) · ${changed} changed since`
              : "not exported yet"}
            {data.removed.length ? ` · removed since: ${data.removed.join(", ")}` : ""}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <a href={`/w/${ws}/f/${facilityId}/report`} className="text-sm text-accent hover:underline">
            Printable calculation report
          </a>
        {canExport ? (
          <div className="flex gap-2">
            <Button variant="primary" onClick={() => exportAs("xlsx")} disabled={running("xlsx")}>
              Export to Excel (.xlsx)
            </Button>
            <Button onClick={() => exportAs("csv")} disabled={running("csv")}>
              Export CSV
            </Button>
          </div>
        ) : null}
        </div>
      </header>
      {(["xlsx", "csv"] as const).map((f) =>
        exports[f] ? <JobProgress key={exports[f]!.id} job={exports[f]!} label={f === "xlsx" ? "Excel export" : "CSV export"} onFinished={(j) => finished(f, j)} /> : null,
      )}
      {msg ? (
        <p role={msg.ok ? "status" : "alert"} className={`text-sm ${msg.ok ? "text-ok" : "text-danger"}`}>
          {msg.ok ? "✓" : "⚠"} {msg.text}
        </p>
      ) : null}
      <div className="flex flex-wrap items-end gap-4">
        <div className="flex flex-col gap-1">
          <label htmlFor="schedule-filter" className="text-xs font-medium text-muted">
            Filter
          </label>
          <input id="schedule-filter" type="search" value={filter} onChange={(e) => setFilter(e.target.value)} placeholder="tag, room, refrigerant…" className="rounded border border-line bg-surface px-2 py-1.5 text-sm" />
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor="schedule-group" className="text-xs font-medium text-muted">
            Group by
          </label>
          <select id="schedule-group" value={grouping[0] ?? ""} onChange={(e) => setGrouping(e.target.value ? [e.target.value] : [])} className="rounded border border-line bg-surface px-2 py-1.5 text-sm">
            <option value="">none</option>
            <option value="circuit">circuit</option>
            <option value="room">room</option>
            <option value="kind">item</option>
          </select>
        </div>
        <details className="relative">
          <summary className="cursor-pointer rounded border border-line bg-surface-2 px-3 py-1.5 text-sm">Columns</summary>
          <div className="absolute z-10 mt-1 flex w-56 flex-col gap-1 rounded border border-line bg-surface p-2 shadow">
            {table
              .getAllLeafColumns()
              .filter((c) => c.getCanHide())
              .map((c) => (
                <label key={c.id} className="flex items-center gap-2 text-sm">
                  <input type="checkbox" checked={c.getIsVisible()} onChange={c.getToggleVisibilityHandler()} />
                  {String(c.columnDef.header)}
                </label>
              ))}
          </div>
        </details>
      </div>
      {data.warnings.length ? (
        <ul className="text-xs text-warn">
          {data.warnings.map((w) => (
            <li key={w}>⚠ {w}</li>
          ))}
        </ul>
      ) : null}
      <div className="overflow-x-auto rounded border border-line">
        <table className="w-full text-sm">
          <thead className="bg-surface-2 text-left text-xs text-muted">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id}>
                {hg.headers.map((h) => {
                  const numeric = (h.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                  const sorted = h.column.getIsSorted();
                  return (
                    <th key={h.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"} className={`px-2 py-1.5 font-medium ${numeric ? "text-right" : ""}`}>
                      <button type="button" onClick={h.column.getToggleSortingHandler()} className="inline-flex items-center gap-1 hover:text-ink">
                        {flexRender(h.column.columnDef.header, h.getContext())}
                        <span aria-hidden="true">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) =>
              row.getIsGrouped() ? (
                <tr key={row.id} className="border-t border-line bg-surface-3">
                  <td colSpan={row.getVisibleCells().length} className="px-2 py-1 text-xs font-semibold">
                    {String(row.groupingValue)} · {row.subRows.length} item{row.subRows.length === 1 ? "" : "s"}
                  </td>
                </tr>
              ) : (
                <tr key={row.id} data-tag={row.original.tag} className={`border-t border-line ${row.original.mark.status !== "same" ? "bg-accent/5" : ""}`}>
                  {row.getVisibleCells().map((c) => {
                    const numeric = (c.column.columnDef.meta as { numeric?: boolean } | undefined)?.numeric;
                    return (
                      <td key={c.id} className={`px-2 py-1 ${numeric ? "whitespace-nowrap text-right font-mono tabular-nums" : ""} ${c.column.id === "tag" ? "font-mono font-semibold" : ""}`}>
                        {c.getIsPlaceholder() ? null : flexRender(c.column.columnDef.cell, c.getContext())}
                      </td>
                    );
                  })}
                </tr>
              ),
            )}
          </tbody>
        </table>
      </div>
      {table.getRowModel().rows.length === 0 ? <p className="text-sm text-muted">No item matches “{filter}”.</p> : null}
    </main>
  );
}
