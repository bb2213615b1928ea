"use client";
import "@xyflow/react/dist/style.css";
import { useCallback, useEffect, useMemo, useRef, useState, type DragEvent, type KeyboardEvent } from "react";
import {
  Background,
  BackgroundVariant,
  ConnectionMode,
  Controls,
  MiniMap,
  ReactFlow,
  ReactFlowProvider,
  ViewportPortal,
  applyEdgeChanges,
  applyNodeChanges,
  useReactFlow,
  type Connection,
  type Edge,
  type EdgeChange,
  type FinalConnectionState,
  type NodeChange,
  type Viewport,
} from "@xyflow/react";
import { Button } from "@/components/ui/button";
import { api, ApiError } from "@/lib/api-client";
import type { UnitSystem } from "@/lib/units";
import type { SiteConditions } from "@/features/facilities/schema";
import {
  addNode,
  autoLayout,
  checkConnection,
  connect,
  copyNodes,
  disconnect,
  labelOf,
  linksOf,
  nodeIdsOf,
  OUTDOORS,
  parseNodeId,
  pasteClip,
  removeNodes,
  replaceEntity,
  type AddKind,
  type Clip,
  type LinkKind,
} from "../graph";
import { initHistory, push, redo, reset, undo, type History } from "../history";
import { nodeViews } from "../figures";
import { useEngine } from "../hooks/use-engine";
import { useAutosave } from "../hooks/use-autosave";
import type { CanvasDoc, LayoutDto } from "../schema";
import { nodeTypes, type CanvasNode } from "./nodes";
import { Inspector } from "./inspector";
import { ResultsPanel } from "./results-panel";
import { Outline } from "./outline";

export interface CanvasEditorProps {
  ws: string;
  facilityId: string;
  initial: { version: number; doc: CanvasDoc; site: SiteConditions };
  layout: LayoutDto;
  canEdit: boolean;
  role: string;
  unitSystem: UnitSystem;
}

export function CanvasEditor(props: CanvasEditorProps) {
  return (
    <ReactFlowProvider>
      <Editor {...props} />
    </ReactFlowProvider>
  );
}

const PALETTE: { kind: AddKind; label: string; hint: string }[] = [
  { kind: "room", label: "Room", hint: "a cooled space" },
  { kind: "door", label: "Door", hint: "joins two rooms, or a room and Outdoors" },
  { kind: "evaporator", label: "Evaporator", hint: "sits in a room, feeds a circuit" },
  { kind: "circuit", label: "Circuit", hint: "a suction group and its compressors" },
  { kind: "condenser", label: "Condenser", hint: "takes a circuit's heat" },
];

const EDGE_STYLE: Record<LinkKind, React.CSSProperties> = {
  "door-side": { strokeDasharray: "4 3", stroke: "var(--muted)" },
  "evaporator-room": { stroke: "var(--ok)" },
  "evaporator-circuit": { stroke: "var(--accent)", strokeWidth: 2 },
  "circuit-condenser": { stroke: "var(--warn)", strokeWidth: 2 },
  "circuit-cascade": { stroke: "var(--warn)", strokeWidth: 2, strokeDasharray: "8 3" },
};

const isMac = () => typeof navigator !== "undefined" && /Mac|iPhone|iPad/.test(navigator.platform);

function Editor({ ws, facilityId, initial, layout, canEdit, role, unitSystem: s }: CanvasEditorProps) {
  const base = `/api/v1/workspaces/${ws}/facilities/${facilityId}`;
  const rf = useReactFlow();
  const [hist, setHist] = useState<History<CanvasDoc>>(() => initHistory(initial.doc));
  const doc = hist.present;
  const docRef = useRef(doc);
  docRef.current = doc;
  const site = initial.site;
  const commit = useCallback((next: CanvasDoc, key?: string) => {
    if (next === docRef.current) return;
    docRef.current = next;
    setHist((h) => push(h, next, { key }));
  }, []);
  const adopt = useCallback((d: CanvasDoc) => {
    docRef.current = d;
    setHist(reset(d));
  }, []);

  const engine = useEngine(doc, site);
  const ev = engine.evaluation;
  const current = engine.forDoc === doc;
  const saveState = useAutosave({ url: `${base}/model`, doc, saveable: current && ev ? ev.saveable : null, canEdit, initial: { version: initial.version, doc: initial.doc }, adopt });

  const [toast, setToast] = useState<{ kind: "refused" | "info" | "error"; text: string } | null>(null);
  useEffect(() => {
    if (!toast) return;
    const t = setTimeout(() => setToast(null), toast.kind === "refused" ? 7000 : 4000);
    return () => clearTimeout(t);
  }, [toast]);

  // ---- nodes and edges --------------------------------------------------------------------
  const known = useRef<Record<string, { x: number; y: number }>>(autoLayout(initial.doc, layout.positions));
  const toSelect = useRef<Set<string>>(new Set());
  const [nodes, setNodes] = useState<CanvasNode[]>([]);
  const [edges, setEdges] = useState<Edge[]>([]);
  const views = useMemo(() => nodeViews(doc, ev?.result ?? null, s), [doc, ev, s]);
  const notes = useMemo(() => {
    const m = new Map<string, { state: "problem" | "skipped"; note: string }>();
    if (!ev) return m;
    for (const p of ev.problems) if (p.nid && !m.has(p.nid)) m.set(p.nid, { state: "problem", note: p.message });
    for (const k of ev.skipped) if (k.nid && !m.has(k.nid)) m.set(k.nid, { state: "skipped", note: k.message });
    return m;
  }, [ev]);
  const stale = !current || engine.pending || !ev?.result;

  useEffect(() => {
    known.current = autoLayout(doc, known.current);
    setNodes((prev) => {
      const byId = new Map(prev.map((n) => [n.id, n]));
      const sel = toSelect.current;
      const out = nodeIdsOf(doc).map((nid): CanvasNode => {
        const view = views.get(nid) ?? { kind: parseNodeId(nid).kind, title: labelOf(doc, nid), figures: [] };
        const note = notes.get(nid);
        const data = { ...view, state: note?.state ?? "ok", note: note?.note, readOnly: !canEdit } as CanvasNode["data"];
        const p = byId.get(nid);
        if (p) {
          // Unchanged nodes keep their object, so React Flow re-renders only what an edit reached.
          const selected = sel.size ? sel.has(nid) : p.selected;
          if (selected === p.selected && JSON.stringify(p.data) === JSON.stringify(data)) return p;
          return { ...p, data, selected };
        }
        return { id: nid, type: parseNodeId(nid).kind, position: known.current[nid], data, deletable: canEdit && nid !== OUTDOORS, selected: sel.has(nid) };
      });
      toSelect.current = new Set();
      return out;
    });
  }, [doc, views, notes, canEdit]);

  useEffect(() => {
    setEdges((prev) => {
      const byId = new Map(prev.map((e) => [e.id, e]));
      return linksOf(doc).map((l) => {
        const p = byId.get(l.id);
        if (p && p.source === l.source && p.target === l.target && p.deletable === canEdit) return p;
        return {
        id: l.id,
        source: l.source,
        target: l.target,
        sourceHandle: "b",
        targetHandle: "t",
          selected: p?.selected ?? false,
          deletable: canEdit,
          style: EDGE_STYLE[l.kind],
          ariaLabel: `${labelOf(doc, l.source)} to ${labelOf(doc, l.target)}`,
        };
      });
    });
  }, [doc, canEdit]);

  const selectedIds = nodes.filter((n) => n.selected).map((n) => n.id);
  const [inspected, setInspected] = useState<string | null>(null);
  const inspectedLive = inspected && nodes.some((n) => n.id === inspected) ? inspected : null;

  const onNodesChange = useCallback((changes: NodeChange<CanvasNode>[]) => {
    setNodes((ns) => applyNodeChanges(changes.filter((c) => c.type !== "remove"), ns));
    let moved = false;
    for (const c of changes) {
      if (c.type === "select" && c.selected) setInspected(c.id);
      // Arrow-key moves arrive as position changes outside a drag: keep and save them too.
      if (c.type === "position" && c.position && !c.dragging) {
        known.current[c.id] = c.position;
        moved = true;
      }
    }
    if (moved) setLayoutDirty((n) => n + 1);
  }, []);
  const onEdgesChange = useCallback((changes: EdgeChange[]) => setEdges((es) => applyEdgeChanges(changes.filter((c) => c.type !== "remove"), es)), []);

  // ---- layout (positions, viewport) saved apart from the model ------------------------------
  const viewport = useRef<Viewport | null>(layout.viewport);
  const [layoutDirty, setLayoutDirty] = useState(0);
  useEffect(() => {
    if (!canEdit || layoutDirty === 0) return;
    const t = setTimeout(() => {
      const ids = new Set(nodeIdsOf(docRef.current));
      const positions = Object.fromEntries(Object.entries(known.current).filter(([k]) => ids.has(k)));
      api(`${base}/layout`, { method: "PUT", json: { positions, viewport: viewport.current } }).catch((e) =>
        setToast({ kind: "error", text: `Node positions not saved: ${e instanceof Error ? e.message : String(e)}` }),
      );
    }, 800);
    return () => clearTimeout(t);
  }, [layoutDirty, canEdit, base]);
  const onNodeDragStop = useCallback(() => {
    setNodes((ns) => {
      for (const n of ns) known.current[n.id] = n.position;
      return ns;
    });
    setLayoutDirty((n) => n + 1);
  }, []);

  // ---- editing ----------------------------------------------------------------------------
  const isValidConnection = useCallback((c: Edge | Connection) => checkConnection(docRef.current, c.source, c.target).ok, []);
  const onConnect = useCallback(
    (c: Connection) => {
      try {
        commit(connect(docRef.current, c.source, c.target));
      } catch (e) {
        setToast({ kind: "refused", text: (e as Error).message });
      }
    },
    [commit],
  );
  const onConnectEnd = useCallback((event: MouseEvent | TouchEvent, state: FinalConnectionState) => {
    if (state.isValid || !state.fromNode) return;
    let to = state.toNode?.id ?? null;
    if (!to) {
      const pt = "changedTouches" in event ? event.changedTouches[0] : (event as MouseEvent);
      const el = document.elementFromPoint(pt.clientX, pt.clientY)?.closest(".react-flow__node");
      to = el?.getAttribute("data-id") ?? null;
    }
    if (!to || to === state.fromNode.id) return;
    const r = checkConnection(docRef.current, state.fromNode.id, to);
    if (!r.ok) setToast({ kind: "refused", text: r.message });
  }, []);
  const onDelete = useCallback(
    ({ nodes: ns, edges: es }: { nodes: CanvasNode[]; edges: Edge[] }) => {
      if (!canEdit) return;
      const next = removeNodes(
        disconnect(
          docRef.current,
          es.map((e) => e.id),
        ),
        ns.map((n) => n.id).filter((id) => id !== OUTDOORS),
      );
      commit(next);
      if (ns.length) setInspected(null);
    },
    [commit, canEdit],
  );

  const wrapper = useRef<HTMLDivElement>(null);
  const addAt = useCallback(
    (kind: AddKind, screen?: { x: number; y: number }) => {
      const rect = wrapper.current?.getBoundingClientRect();
      const pt = screen ?? (rect ? { x: rect.left + rect.width / 2 - 90, y: rect.top + rect.height / 2 - 40 } : { x: 0, y: 0 });
      const pos = rf.screenToFlowPosition(pt);
      const { doc: next, nid } = addNode(docRef.current, kind);
      // Nodes are about 200 × 110 px: step right until the new one overlaps none.
      const others = Object.values(known.current);
      const hits = () => others.some((p) => Math.abs(p.x - pos.x) < 210 && Math.abs(p.y - pos.y) < 120);
      for (let i = 0; i < 200 && hits(); i++) pos.x += 60;
      known.current[nid] = { x: Math.round(pos.x / 20) * 20, y: Math.round(pos.y / 20) * 20 };
      toSelect.current = new Set([nid]);
      setInspected(nid);
      commit(next);
      setLayoutDirty((n) => n + 1);
    },
    [rf, commit],
  );
  const onDrop = (e: DragEvent) => {
    const kind = e.dataTransfer.getData("application/x-rimeplan-node") as AddKind;
    if (!kind || !canEdit) return;
    e.preventDefault();
    addAt(kind, { x: e.clientX - 90, y: e.clientY - 30 });
  };

  const clip = useRef<Clip | null>(null);
  const doUndo = useCallback(() => setHist((h) => undo(h)), []);
  const doRedo = useCallback(() => setHist((h) => redo(h)), []);
  const onKeyDown = (e: KeyboardEvent) => {
    const t = e.target as HTMLElement;
    if (t.closest("input, textarea, select, [contenteditable=true]")) return;
    const mod = isMac() ? e.metaKey : e.ctrlKey;
    const k = e.key.toLowerCase();
    if (mod && k === "z" && !e.shiftKey && canEdit) {
      e.preventDefault();
      doUndo();
    } else if (mod && ((k === "z" && e.shiftKey) || k === "y") && canEdit) {
      e.preventDefault();
      doRedo();
    } else if (mod && k === "c") {
      if (!selectedIds.length) return;
      clip.current = copyNodes(docRef.current, selectedIds, known.current);
      setToast({ kind: "info", text: `Copied ${selectedIds.length} item${selectedIds.length > 1 ? "s" : ""}.` });
    } else if (mod && k === "v" && canEdit && clip.current) {
      e.preventDefault();
      const p = pasteClip(docRef.current, clip.current);
      Object.assign(known.current, p.positions);
      toSelect.current = new Set(p.nids);
      commit(p.doc);
      setLayoutDirty((n) => n + 1);
    } else if (mod && k === "a") {
      e.preventDefault();
      setNodes((ns) => ns.map((n) => ({ ...n, selected: true })));
    } else if (k === "escape") {
      setNodes((ns) => ns.map((n) => (n.selected ? { ...n, selected: false } : n)));
      setInspected(null);
    }
  };

  const focusNode = useCallback(
    (nid: string) => {
      const p = known.current[nid];
      setNodes((ns) => ns.map((n) => ({ ...n, selected: n.id === nid })));
      setInspected(nid);
      if (p) void rf.setCenter(p.x + 90, p.y + 50, { zoom: Math.max(rf.getZoom(), 0.9), duration: 300 });
    },
    [rf],
  );

  const onEntityChange = useCallback((entity: object, key: string) => {
    if (!inspectedRef.current) return;
    commit(replaceEntity(docRef.current, inspectedRef.current, entity), key);
  }, [commit]);
  const inspectedRef = useRef(inspectedLive);
  inspectedRef.current = inspectedLive;

  // ---- site plan ---------------------------------------------------------------------------
  const [bg, setBg] = useState(layout.background);
  const upload = async (file: File) => {
    try {
      const r = await api<{ layout: LayoutDto }>(`${base}/layout/background`, { method: "PUT", body: file, headers: { "content-type": "application/octet-stream" } });
      setBg(r.layout.background);
      setToast({ kind: "info", text: "Site plan uploaded: it is drawn behind the nodes." });
    } catch (e) {
      setToast({ kind: "error", text: e instanceof ApiError ? e.message : "The site plan was not uploaded." });
    }
  };
  const setPlanWidth = async (widthM: number) => {
    if (!bg || widthM === bg.widthM) return;
    if (!Number.isInteger(widthM) || widthM < 10 || widthM > 5000) {
      setToast({ kind: "error", text: "Plan width must be a whole number of metres between 10 and 5000." });
      return;
    }
    const ids = new Set(nodeIdsOf(docRef.current));
    const positions = Object.fromEntries(Object.entries(known.current).filter(([k]) => ids.has(k)));
    try {
      const r = await api<{ layout: LayoutDto }>(`${base}/layout`, { method: "PUT", json: { positions, viewport: viewport.current, backgroundWidthM: widthM } });
      setBg(r.layout.background);
    } catch (e) {
      setToast({ kind: "error", text: e instanceof Error ? e.message : "Plan width not saved." });
    }
  };
  const removeBg = async () => {
    const r = await api<{ layout: LayoutDto }>(`${base}/layout/background`, { method: "DELETE" });
    setBg(r.layout.background);
  };

  const problems = ev ? ev.problems.length + ev.skipped.length : 0;
  const [resultsOpen, setResultsOpen] = useState(true);
  const [view, setView] = useState<"canvas" | "outline">("canvas");
  const selectOnly = useCallback((nid: string) => {
    setNodes((ns) => ns.map((n) => (n.selected === (n.id === nid) ? n : { ...n, selected: n.id === nid })));
    setInspected(nid);
  }, []);
  const [bannerOpen, setBannerOpen] = useState(true);

  return (
    <div id="canvas-editor" className="flex h-[calc(100vh-7.5rem)] min-h-[560px] border-t border-line" onKeyDown={onKeyDown}>
      {canEdit ? (
        <aside aria-label="Add to the layout" className="flex w-40 shrink-0 flex-col gap-1.5 border-r border-line bg-surface-2 p-2">
          <h3 className="text-xs font-semibold text-muted">Add</h3>
          {PALETTE.map((p) => (
            <button
              key={p.kind}
              draggable
              onDragStart={(e) => {
                e.dataTransfer.setData("application/x-rimeplan-node", p.kind);
                e.dataTransfer.effectAllowed = "copy";
              }}
              onClick={() => addAt(p.kind)}
              className="rounded border border-line bg-surface px-2 py-1.5 text-left text-sm hover:border-accent"
              title={`Add a ${p.label.toLowerCase()}: ${p.hint} (click, or drag onto the canvas)`}
            >
              + {p.label}
              <span className="block text-[10px] text-muted">{p.hint}</span>
            </button>
          ))}
          <div className="mt-2 flex gap-1">
            <Button className="!px-2 !py-0.5 text-xs" onClick={doUndo} disabled={!hist.past.length} title="Undo (Ctrl+Z)">
              ↶ Undo
            </Button>
            <Button className="!px-2 !py-0.5 text-xs" onClick={doRedo} disabled={!hist.future.length} title="Redo (Ctrl+Shift+Z)">
              ↷ Redo
            </Button>
          </div>
          <details className="mt-2 text-[11px] text-muted">
            <summary className="cursor-pointer">Keys</summary>
            <ul className="mt-1 flex flex-col gap-0.5">
              <li>Drag from a handle to connect</li>
              <li>Shift+click / Shift+drag: select several</li>
              <li>Delete: remove selection</li>
              <li>Ctrl+C / Ctrl+V: copy, paste</li>
              <li>Ctrl+Z / Ctrl+Shift+Z: undo, redo</li>
              <li>Ctrl+A: select all · Esc: clear</li>
              <li>Tab to a node, arrows move it</li>
            </ul>
          </details>
          <div className="mt-auto flex flex-col gap-1 text-[11px]">
            <label className="cursor-pointer text-accent hover:underline">
              {bg ? "Replace site plan" : "Site plan (PNG/JPEG, ≤ 5 MB)"}
              <input type="file" accept="image/png,image/jpeg,application/pdf" className="sr-only" onChange={(e) => e.target.files?.[0] && void upload(e.target.files[0])} />
            </label>
            {bg ? (
              <>
                <label className="flex items-center gap-1 text-muted" htmlFor="plan-width">
                  Plan width
                  <input
                    id="plan-width"
                    type="number"
                    min={10}
                    max={5000}
                    step={1}
                    defaultValue={bg.widthM}
                    className="w-16 rounded border border-line bg-surface px-1 text-right font-mono"
                    onBlur={(e) => void setPlanWidth(Number(e.target.value))}
                    onKeyDown={(e) => e.key === "Enter" && void setPlanWidth(Number((e.target as HTMLInputElement).value))}
                  />
                  m
                </label>
                <button className="text-left text-muted hover:underline" onClick={() => void removeBg()}>
                  Remove site plan
                </button>
              </>
            ) : null}
          </div>
        </aside>
      ) : null}
      <div className="flex min-w-0 flex-1 flex-col">
        <div className="flex items-center gap-3 border-b border-line bg-surface-2 px-3 py-1 text-xs">
          <SaveBadge state={saveState} problems={problems} />
          {engine.failure ? <span className="text-danger">⚠ {engine.failure}</span> : null}
          {!canEdit ? <span className="text-muted">Read-only: your role ({role}) can look and inspect but not change the model.</span> : null}
          <span className="ml-auto text-muted">{selectedIds.length > 1 ? `${selectedIds.length} selected` : null}</span>
          <div role="group" aria-label="View" className="flex overflow-hidden rounded border border-line">
            {(["canvas", "outline"] as const).map((v) => (
              <button key={v} aria-pressed={view === v} className={`px-2 py-0.5 ${view === v ? "bg-accent text-accent-ink" : "bg-surface"}`} onClick={() => setView(v)}>
                {v === "canvas" ? "Canvas" : "Outline"}
              </button>
            ))}
          </div>
        </div>
        {saveState.status === "conflict" ? (
          <div role="alert" className="flex flex-wrap items-center gap-2 border-b border-danger/50 bg-danger/5 px-3 py-2 text-sm text-danger">
            <span>⚠ {saveState.message}</span>
            <Button className="!py-0.5 text-xs" onClick={saveState.resolveReload}>
              Load version {saveState.conflict?.current.version} (drop my unsaved change)
            </Button>
            <Button variant="danger" className="!py-0.5 text-xs" onClick={saveState.resolveKeepMine}>
              Keep mine and save over it
            </Button>
          </div>
        ) : null}
        {ev && problems > 0 ? (
          <div className="border-b border-warn/50 bg-warn/5 px-3 py-1.5 text-xs" role="region" aria-label="Model problems">
            <button className="font-medium text-warn" onClick={() => setBannerOpen((o) => !o)} aria-expanded={bannerOpen}>
              ⚠ {problems} item{problems > 1 ? "s" : ""} to fix or complete{canEdit ? " — the model is saved once they are" : ""} {bannerOpen ? "▴" : "▾"}
            </button>
            {bannerOpen ? (
              <ul className="mt-1 flex max-h-28 flex-col gap-0.5 overflow-auto">
                {[...ev.problems.map((p) => ({ nid: p.nid, text: `${p.field ? p.field + ": " : ""}${p.message}`, kind: "problem" })), ...ev.skipped.map((k) => ({ nid: k.nid, text: k.message, kind: "skipped" }))].map((p, i) => (
                  <li key={i}>
                    {p.nid ? (
                      <button className="text-left text-ink hover:underline" onClick={() => focusNode(p.nid!)}>
                        <span className="font-medium">{labelOf(doc, p.nid)}</span> — {p.text}
                      </button>
                    ) : p.text.startsWith("site") ? (
                      <a className="text-ink hover:underline" href={`/w/${ws}/f/${facilityId}/settings`}>
                        Site conditions — {p.text}
                      </a>
                    ) : (
                      <span className="text-ink">{p.text}</span>
                    )}
                  </li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : null}
        {view === "outline" ? (
          <div className="min-h-0 flex-1">
            <Outline doc={doc} result={ev?.result ?? null} s={s} canEdit={canEdit} onSelect={selectOnly} onCommit={commit} />
          </div>
        ) : null}
        <div ref={wrapper} className={`relative min-h-0 flex-1 ${view === "outline" ? "hidden" : ""}`} onDragOver={(e) => canEdit && e.preventDefault()} onDrop={onDrop} data-testid="canvas">
          <ReactFlow<CanvasNode, Edge>
            nodes={nodes}
            edges={edges}
            nodeTypes={nodeTypes}
            onNodesChange={onNodesChange}
            onEdgesChange={onEdgesChange}
            onConnect={onConnect}
            onConnectEnd={onConnectEnd}
            isValidConnection={isValidConnection}
            onDelete={onDelete}
            onNodeDragStop={onNodeDragStop}
            onMoveEnd={(_, v) => {
              viewport.current = v;
              if (canEdit) setLayoutDirty((n) => n + 1);
            }}
            connectionMode={ConnectionMode.Loose}
            nodesDraggable={canEdit}
            nodesConnectable={canEdit}
            elementsSelectable
            deleteKeyCode={canEdit ? ["Delete", "Backspace"] : null}
            multiSelectionKeyCode="Shift"
            selectionKeyCode="Shift"
            snapToGrid
            snapGrid={[20, 20]}
            minZoom={0.1}
            maxZoom={2.5}
            defaultViewport={layout.viewport ?? (initial.doc.rooms.length === 0 ? { x: 320, y: 40, zoom: 1 } : undefined)}
            fitView={!layout.viewport && initial.doc.rooms.length > 0}
            fitViewOptions={{ padding: 0.15, maxZoom: 1.2 }}
            proOptions={{ hideAttribution: true }}
          >
            {bg ? (
              <ViewportPortal>
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img
                  src={`${base}/layout/background?v=${encodeURIComponent(bg.updatedAt)}`}
                  alt="Site plan"
                  className="pointer-events-none absolute max-w-none select-none opacity-35"
                  style={{ transform: "translate(-300px, -200px)", width: bg.widthM * 10 }}
                />
              </ViewportPortal>
            ) : null}
            <Background variant={BackgroundVariant.Dots} gap={20} size={1} />
            <MiniMap pannable zoomable ariaLabel="Overview of the layout" className="!bg-surface-2" style={{ width: 150, height: 100 }} maskColor="color-mix(in oklch, var(--surface-3) 60%, transparent)" />
            <Controls showInteractive={false} />
          </ReactFlow>
          {doc.rooms.length === 0 && canEdit ? (
            <div className="pointer-events-none absolute inset-x-0 top-1/3 mx-auto w-80 rounded border border-line bg-surface/90 p-4 text-center text-sm">
              <p className="font-medium">Draw the facility here.</p>
              <p className="mt-1 text-muted">Start with “+ Room” on the left, then doors, evaporators, a circuit and a condenser; drag between handles to connect them.</p>
            </div>
          ) : null}
          {toast ? (
            <div role={toast.kind === "info" ? "status" : "alert"} className={`absolute left-1/2 top-3 z-10 max-w-lg -translate-x-1/2 rounded border px-3 py-2 text-sm shadow ${toast.kind === "info" ? "border-line bg-surface" : "border-danger/60 bg-surface text-danger"}`}>
              {toast.kind === "refused" ? "✕ Connection refused: " : toast.kind === "error" ? "⚠ " : ""}
              {toast.text}
            </div>
          ) : null}
        </div>
        <section aria-label="Results" className="border-t border-line bg-surface">
          <button className="flex w-full items-center gap-2 px-3 py-1 text-xs font-semibold text-muted hover:bg-surface-2" onClick={() => setResultsOpen((o) => !o)} aria-expanded={resultsOpen}>
            Results {resultsOpen ? "▾" : "▸"}
            {stale && ev?.result ? <span className="font-normal">(updating…)</span> : null}
          </button>
          {resultsOpen ? (
            <div className="max-h-56 overflow-auto">
              <ResultsPanel result={ev?.result ?? null} s={s} ms={ev?.ms ?? null} onSelect={focusNode} />
            </div>
          ) : null}
        </section>
      </div>
      <aside className="w-80 shrink-0 overflow-y-auto border-l border-line bg-surface" aria-label="Selected item">
        {inspectedLive && selectedIds.length <= 1 ? (
          <Inspector
            key={inspectedLive}
            nid={inspectedLive}
            doc={doc}
            unitSystem={s}
            canEdit={canEdit}
            problems={ev?.problems.filter((p) => p.nid === inspectedLive) ?? []}
            onChange={onEntityChange}
            onDelete={() => {
              commit(removeNodes(docRef.current, [inspectedLive]));
              setInspected(null);
            }}
          />
        ) : selectedIds.length > 1 ? (
          <div className="flex flex-col gap-2 p-3 text-sm">
            <p>{selectedIds.length} items selected.</p>
            {canEdit ? (
              <Button variant="danger" onClick={() => commit(removeNodes(docRef.current, selectedIds.filter((n) => n !== OUTDOORS)))}>
                Delete {selectedIds.length} items
              </Button>
            ) : null}
          </div>
        ) : (
          <div className="p-3 text-xs text-muted">
            <p>Select a node to see {canEdit ? "and edit " : ""}its inputs.</p>
            <p className="mt-2">
              {[
                [doc.rooms.length, "room"],
                [doc.doors.length, "door"],
                [doc.plant.evaporators?.length ?? 0, "evaporator"],
                [doc.plant.circuits?.length ?? 0, "circuit"],
                [doc.plant.condensers?.length ?? 0, "condenser"],
              ]
                .map(([n, w]) => `${n} ${w}${n === 1 ? "" : "s"}`)
                .join(" · ")}
            </p>
          </div>
        )}
      </aside>
    </div>
  );
}

function SaveBadge({ state, problems }: { state: ReturnType<typeof useAutosave>; problems: number }) {
  const v = `version ${state.version}`;
  switch (state.status) {
    case "readonly":
      return <span className="text-muted">{v}</span>;
    case "saved":
      return (
        <span className="text-ok" data-save="saved">
          ✓ Saved · {v}
          {state.message ? <span className="ml-2 text-muted">{state.message}</span> : null}
        </span>
      );
    case "pending":
    case "saving":
      return (
        <span className="text-muted" data-save="saving">
          ● Saving… ({v})
        </span>
      );
    case "blocked":
      return (
        <span className="text-warn" data-save="blocked">
          ◌ Not saved yet: {problems} item{problems === 1 ? "" : "s"} to complete (listed below) · last saved {v}
        </span>
      );
    case "conflict":
      return <span className="text-danger" data-save="conflict">⚠ Conflict · not saved</span>;
    case "error":
      return (
        <span className="text-danger" data-save="error">
          ⚠ Not saved: {state.message} (retrying)
        </span>
      );
  }
}
