"use client";
import { memo } from "react";
import { Handle, Position, type Node, type NodeProps } from "@xyflow/react";
import type { NodeView } from "../figures";

export type CanvasNodeData = NodeView & {
  /** "problem": a validation or calculation problem; "skipped": not connected yet, left out of the results. */
  state: "ok" | "problem" | "skipped";
  note?: string;
  readOnly: boolean;
};

export type CanvasNode = Node<CanvasNodeData>;

const ACCENT: Record<string, string> = {
  Room: "border-l-[color:var(--accent)]",
  Door: "border-l-[color:var(--muted)]",
  Evaporator: "border-l-[color:var(--ok)]",
  Circuit: "border-l-[color:var(--warn)]",
  Condenser: "border-l-[color:var(--danger)]",
  Outdoors: "border-l-[color:var(--line)]",
};

const ICON: Record<string, string> = { Room: "▭", Door: "⇆", Evaporator: "❄", Circuit: "⟳", Condenser: "≋", Outdoors: "☼" };

function Box({ data, selected }: NodeProps<CanvasNode>) {
  const handle = "!h-2.5 !w-2.5 !border-line !bg-surface-3";
  return (
    <div
      className={`min-w-44 max-w-60 rounded border border-l-4 bg-surface px-2.5 py-2 text-xs shadow-sm ${ACCENT[data.kind] ?? ""} ${
        selected ? "border-accent ring-2 ring-accent/40" : "border-line"
      } ${data.state === "skipped" ? "border-dashed" : ""}`}
      aria-label={`${data.kind} ${data.title}`}
    >
      <Handle type="source" position={Position.Top} id="t" className={handle} isConnectable={!data.readOnly} />
      <div className="flex items-center gap-1.5 text-[10px] uppercase tracking-wide text-muted">
        <span aria-hidden>{ICON[data.kind]}</span>
        {data.kind}
        {data.state === "problem" ? (
          <span className="ml-auto font-medium normal-case text-danger" title={data.note}>
            ⚠ check
          </span>
        ) : data.state === "skipped" ? (
          <span className="ml-auto font-medium normal-case text-warn" title={data.note}>
            ◌ not connected
          </span>
        ) : null}
      </div>
      <div className="truncate text-sm font-semibold text-ink" title={data.title}>
        {data.title}
      </div>
      {data.subtitle ? <div className="truncate text-muted">{data.subtitle}</div> : null}
      {data.figures.length ? (
        <dl className="mt-1.5 grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5">
          {data.figures.map((f) => (
            <div key={f.label} className="contents" title={f.title}>
              <dt className="text-muted">{f.label}</dt>
              <dd className="text-right font-mono text-ink" data-figure={f.label}>
                {f.value}
              </dd>
            </div>
          ))}
        </dl>
      ) : null}
      <Handle type="source" position={Position.Bottom} id="b" className={handle} isConnectable={!data.readOnly} />
    </div>
  );
}

const NodeBox = memo(Box);

/** Defined once, outside any component, as React Flow asks. */
export const nodeTypes = {
  room: NodeBox,
  door: NodeBox,
  evaporator: NodeBox,
  circuit: NodeBox,
  condenser: NodeBox,
  outdoors: NodeBox,
};
