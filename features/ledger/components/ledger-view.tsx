"use client";
import { Fragment, useEffect, useMemo, useState } from "react";
import {
  flexRender,
  getCoreRowModel,
  getExpandedRowModel,
  getGroupedRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ExpandedState,
  type GroupingState,
  type SortingState,
} from "@tanstack/react-table";
import { Bar, BarChart, CartesianGrid, Legend, Tooltip, XAxis, YAxis } from "recharts";
import type { LedgerResult } from "@/lib/engine/loads";
import { convert, fmt, UNIT_LABELS, type UnitSystem } from "@/lib/units";
import { KIND_LABEL, ledgerRows, stackByRoom, type LedgerRow } from "../rows";

/** Categorical colours for load kinds, in OKLCH at even lightness so no kind shouts (light and dark). */
const KIND_COLOUR: Record<string, string> = {
  transmission: "oklch(0.62 0.09 230)",
  infiltration: "oklch(0.7 0.1 200)",
  ventilation: "oklch(0.72 0.08 170)",
  product: "oklch(0.62 0.12 145)",
  packaging: "oklch(0.75 0.09 120)",
  batch: "oklch(0.55 0.1 160)",
  respiration: "oklch(0.7 0.12 95)",
  moisture: "oklch(0.72 0.08 220)",
  people: "oklch(0.7 0.12 60)",
  lights: "oklch(0.8 0.12 85)",
  machinery: "oklch(0.6 0.1 40)",
  forklifts: "oklch(0.55 0.12 30)",
  batteryCharging: "oklch(0.6 0.1 350)",
  heater: "oklch(0.62 0.14 15)",
  evaporatorFans: "oklch(0.6 0.08 280)",
  defrost: "oklch(0.7 0.08 300)",
};

export function LedgerView({ ledger, s, meta }: { ledger: LedgerResult; s: UnitSystem; meta: { version: number; inputHash: string; engineVersion: string } }) {
  const rows = useMemo(() => ledgerRows(ledger), [ledger]);
  const kw = (w: number) => convert.powerToDisplay(w, s, "refrigeration");
  const pLabel = UNIT_LABELS[s].power_refrigeration;
  const [sorting, setSorting] = useState<SortingState>([]);
  const [grouping, setGrouping] = useState<GroupingState>(["room"]);
  // Rooms open, components closed: a component opens to show its trace.
  const [expanded, setExpanded] = useState<ExpandedState>(() => Object.fromEntries(ledger.rooms.map((r) => [`room:${r.roomName}`, true])));
  const [view, setView] = useState<"chart" | "table">("chart");
  // The chart measures its box, which only exists in the browser: it is drawn after hydration.
  const [inBrowser, setInBrowser] = useState(false);
  useEffect(() => {
    const t = setTimeout(() => setInBrowser(true), 0);
    return () => clearTimeout(t);
  }, []);

  const columns = useMemo<ColumnDef<LedgerRow>[]>(
    () => [
      { id: "room", accessorKey: "room", header: "Room", enableGrouping: true },
      { id: "label", accessorKey: "label", header: "Component", aggregationFn: "count", aggregatedCell: ({ getValue }) => `${getValue<number>()} components` },
      { id: "kind", accessorFn: (r) => KIND_LABEL[r.kind], header: "Kind", aggregatedCell: () => null },
      { id: "powerW", accessorKey: "powerW", header: `Load (${pLabel})`, aggregationFn: "sum", cell: ({ getValue }) => fmt.power(getValue<number>(), s), aggregatedCell: ({ getValue }) => fmt.power(getValue<number>(), s) },
      { id: "sensibleW", accessorKey: "sensibleW", header: "Sensible", aggregationFn: "sum", cell: ({ getValue }) => fmt.power(getValue<number>(), s), aggregatedCell: ({ getValue }) => fmt.power(getValue<number>(), s) },
      { id: "latentW", accessorKey: "latentW", header: "Latent", aggregationFn: "sum", cell: ({ getValue }) => fmt.power(getValue<number>(), s), aggregatedCell: ({ getValue }) => fmt.power(getValue<number>(), s) },
      {
        id: "energy",
        accessorKey: "energyKWhPerDay",
        header: `24-h energy (${UNIT_LABELS[s].energy}/day)`,
        aggregationFn: "sum",
        cell: ({ getValue }) => fmt.number(convert.energyToDisplay(getValue<number>(), s), 1),
        aggregatedCell: ({ getValue }) => fmt.number(convert.energyToDisplay(getValue<number>(), s), 1),
      },
      { id: "share", accessorKey: "share", header: "Share of room", aggregationFn: "sum", cell: ({ getValue }) => fmt.percent(getValue<number>()), aggregatedCell: () => null },
    ],
    [s, pLabel],
  );

  const table = useReactTable({
    data: rows,
    columns,
    state: { sorting, grouping, expanded },
    onSortingChange: setSorting,
    onGroupingChange: setGrouping,
    onExpandedChange: setExpanded,
    getRowCanExpand: () => true,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getGroupedRowModel: getGroupedRowModel(),
    getExpandedRowModel: getExpandedRowModel(),
    autoResetExpanded: false,
    autoResetPageIndex: false,
  });

  const stack = useMemo(() => stackByRoom(ledger), [ledger]);
  const chartData = stack.rooms.map((r) => ({ ...r, ...Object.fromEntries(stack.kinds.map((k) => [k, kw(r[k] ?? 0)])) }));
  const t = ledger.totals;

  return (
    <main className="flex flex-col gap-4 p-4">
      <section aria-label="Totals" className="flex flex-wrap gap-6 text-sm">
        <Stat label="Required capacity (Σ rooms)" value={fmt.power(t.requiredCapacityW, s)} />
        <Stat label="Coincident peak × SF" value={fmt.power(t.requiredPeakCapacityW, s)} />
        <Stat label="24-h average load" value={fmt.power(t.averageLoadW, s)} />
        <Stat label="24-h energy" value={`${fmt.number(convert.energyToDisplay(t.totalEnergyKWhPerDay, s), 0)} ${UNIT_LABELS[s].energy}/day`} />
        <Stat label="Sensible / latent" value={`${fmt.power(t.sensibleW, s)} / ${fmt.power(t.latentW, s)}`} />
        <p className="basis-full text-xs text-muted">
          Server calculation of version {meta.version} · engine {meta.engineVersion} · input hash <span className="font-mono">{meta.inputHash}</span>
        </p>
      </section>

      <section aria-label="Rooms" className="overflow-x-auto">
        <table className="w-full max-w-5xl text-sm">
          <caption className="pb-1 text-left text-xs font-semibold text-muted">Design capacity per room</caption>
          <thead className="text-xs text-muted">
            <tr className="border-b border-line">
              <th className="py-1 text-left font-normal">Room</th>
              <th className="text-right font-normal">24-h energy</th>
              <th className="text-right font-normal">Safety factor</th>
              <th className="text-right font-normal">Run time</th>
              <th className="text-right font-normal">Required (24 h)</th>
              <th className="text-right font-normal">Peak hour × SF</th>
              <th className="text-right font-normal">Design</th>
            </tr>
          </thead>
          <tbody className="font-mono">
            {ledger.rooms.map((r) => (
              <tr key={r.roomId} className="border-b border-line/60">
                <td className="py-1 font-sans">{r.roomName}</td>
                <td className="text-right">{fmt.number(convert.energyToDisplay(r.totalEnergyKWhPerDay, s), 0)} {UNIT_LABELS[s].energy}</td>
                <td className="text-right">{fmt.percent(r.safetyFactor)}</td>
                <td className="text-right">{fmt.number(r.runHoursPerDay, 1)} h/day</td>
                <td className="text-right" title="24-h energy × (1 + safety factor) ÷ run time">{fmt.power(r.requiredCapacityW, s)}</td>
                <td className="text-right" title={`peak at ${String(r.peakHour).padStart(2, "0")}:00`}>{fmt.power(r.requiredPeakCapacityW, s)}</td>
                <td className="text-right font-semibold">{fmt.power(r.designCapacityW, s)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <section aria-label="Load components by room">
        <div className="mb-2 flex items-center gap-2 text-xs">
          <h3 className="font-semibold text-muted">Components by room</h3>
          <div role="group" aria-label="Chart or table" className="ml-2 flex overflow-hidden rounded border border-line">
            {(["chart", "table"] as const).map((v) => (
              <button key={v} aria-pressed={view === v} className={`px-2 py-0.5 ${view === v ? "bg-accent text-accent-ink" : "bg-surface"}`} onClick={() => setView(v)}>
                {v === "chart" ? "Chart" : "Table"}
              </button>
            ))}
          </div>
        </div>
        {view === "chart" ? (
          <div className="min-h-96 w-full max-w-5xl" role="img" aria-label={`Stacked bar chart of load components by room, in ${pLabel}; the table view lists the same values.`}>
            {inBrowser && (
              <BarChart responsive style={{ width: "100%", height: 384 }} data={chartData} margin={{ top: 8, right: 16, left: 8, bottom: 8 }}>
                <CartesianGrid strokeDasharray="3 3" stroke="var(--line)" />
                <XAxis dataKey="room" tick={{ fontSize: 11, fill: "var(--muted)" }} interval={0} />
                <YAxis tick={{ fontSize: 11, fill: "var(--muted)" }} label={{ value: pLabel, angle: -90, position: "insideLeft", fill: "var(--muted)", fontSize: 11 }} />
                <Tooltip
                  formatter={(v, name) => [`${fmt.number(Number(v), s === "IP" ? 0 : 2)} ${pLabel}`, KIND_LABEL[name as keyof typeof KIND_LABEL] ?? String(name)]}
                  contentStyle={{ background: "var(--surface)", border: "1px solid var(--line)", fontSize: 12 }}
                />
                <Legend formatter={(name) => KIND_LABEL[name as keyof typeof KIND_LABEL] ?? name} wrapperStyle={{ fontSize: 11 }} />
                {stack.kinds.map((k) => (
                  <Bar key={k} dataKey={k} stackId="load" fill={KIND_COLOUR[k]} isAnimationActive={false} />
                ))}
              </BarChart>
            )}
          </div>
        ) : (
          <div className="overflow-x-auto">
            <table className="text-xs">
              <thead className="text-muted">
                <tr className="border-b border-line">
                  <th className="py-1 pr-3 text-left font-normal">Room</th>
                  {stack.kinds.map((k) => (
                    <th key={k} className="px-2 text-right font-normal">
                      {KIND_LABEL[k]}
                    </th>
                  ))}
                </tr>
              </thead>
              <tbody className="font-mono">
                {stack.rooms.map((r) => (
                  <tr key={r.roomId} className="border-b border-line/60">
                    <td className="py-1 pr-3 font-sans">{r.room}</td>
                    {stack.kinds.map((k) => (
                      <td key={k} className="px-2 text-right">
                        {r[k] ? fmt.power(r[k]!, s) : "—"}
                      </td>
                    ))}
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </section>

      <section aria-label="Heat ledger">
        <div className="mb-2 flex items-center gap-3 text-xs">
          <h3 className="font-semibold text-muted">Every component</h3>
          <label className="flex items-center gap-1">
            <input type="checkbox" checked={grouping.length > 0} onChange={(e) => setGrouping(e.target.checked ? ["room"] : [])} /> Group by room
          </label>
          <span className="text-muted">Click a column to sort; expand a row to see its method, source, inputs and formula.</span>
        </div>
        <table className="w-full text-sm">
          <thead className="text-xs text-muted">
            {table.getHeaderGroups().map((hg) => (
              <tr key={hg.id} className="border-b border-line">
                <th className="w-6" aria-label="Expand" />
                {hg.headers.map((h) => {
                  const sorted = h.column.getIsSorted();
                  const numeric = !["room", "label", "kind"].includes(h.column.id);
                  return (
                    <th key={h.id} className={`py-1 font-normal ${numeric ? "text-right" : "text-left"}`} aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                      <button className="hover:text-ink" onClick={h.column.getToggleSortingHandler()}>
                        {flexRender(h.column.columnDef.header, h.getContext())} {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : ""}
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <Fragment key={row.id}>
                <tr className={`border-b border-line/60 ${row.getIsGrouped() ? "bg-surface-2 font-semibold" : ""}`}>
                  <td>
                    <button className="px-1 text-muted" aria-expanded={row.getIsExpanded()} aria-label={row.getIsExpanded() ? "Collapse" : "Expand"} onClick={row.getToggleExpandedHandler()}>
                      {row.getIsExpanded() ? "▾" : "▸"}
                    </button>
                  </td>
                  {row.getVisibleCells().map((cell) => {
                    const numeric = !["room", "label", "kind"].includes(cell.column.id);
                    return (
                      <td key={cell.id} className={`py-1 ${numeric ? "text-right font-mono" : ""}`}>
                        {cell.getIsGrouped()
                          ? flexRender(cell.column.columnDef.cell, cell.getContext())
                          : cell.getIsAggregated()
                            ? flexRender(cell.column.columnDef.aggregatedCell ?? cell.column.columnDef.cell, cell.getContext())
                            : cell.getIsPlaceholder()
                              ? null
                              : flexRender(cell.column.columnDef.cell, cell.getContext())}
                      </td>
                    );
                  })}
                </tr>
                {row.getIsExpanded() && !row.getIsGrouped() ? (
                  <tr className="border-b border-line/60 bg-surface-2">
                    <td />
                    <td colSpan={columns.length} className="py-2 text-xs">
                      <Trace row={row.original} />
                    </td>
                  </tr>
                ) : null}
              </Fragment>
            ))}
          </tbody>
        </table>
        <p className="mt-3 text-xs text-muted">{ledger.options.statements.join(" ")}</p>
      </section>
    </main>
  );
}

function Stat({ label, value }: { label: string; value: string }) {
  return (
    <div className="flex flex-col">
      <span className="text-xs text-muted">{label}</span>
      <span className="font-mono text-base">{value}</span>
    </div>
  );
}

function Trace({ row }: { row: LedgerRow }) {
  const t = row.trace;
  return (
    <div className="grid max-w-4xl gap-1">
      <p>
        <span className="font-semibold">{t.method}</span> — <span className="text-muted">{t.source}</span>
      </p>
      <p className="font-mono">{t.formula}</p>
      <dl className="grid grid-cols-[repeat(auto-fill,minmax(14rem,1fr))] gap-x-4 gap-y-0.5">
        {Object.entries(t.inputs).map(([k, v]) => (
          <div key={k} className="flex justify-between gap-2">
            <dt className="text-muted">{k}</dt>
            <dd className="font-mono">{typeof v === "number" ? fmt.number(v, Math.abs(v) >= 100 ? 1 : 4) : v}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}
