/**
 * The key figures each canvas node shows, from one evaluation, formatted in the user's unit
 * system (room: set point and required kW; door: size and protection, infiltration; evaporator:
 * duty and TD; circuit: refrigerant, suction and condensing temperatures, COP, shaft kW;
 * condenser: heat rejected).
 */
import type { FacilityResult } from "@/lib/engine/model";
import { fmt, type UnitSystem } from "@/lib/units";
import { circuits, condensers, evaporators, nodeId, OUTDOORS } from "./graph";
import type { CanvasDoc } from "./schema";

export type Figure = {
  label: string;
  value: string;
  /** What the number is, for hover (method / basis). */
  title?: string;
};

export type NodeView = {
  kind: string;
  title: string;
  subtitle?: string;
  figures: Figure[];
};

const PROTECTION: Record<string, string> = {
  none: "no protection",
  stripCurtain: "strip curtain",
  airCurtain: "air curtain",
  vestibule: "vestibule",
  fastDoor: "fast door",
};

const KIND_LABEL: Record<string, string> = {
  storage: "storage",
  blast: "blast freezer",
  ripening: "ripening",
  dock: "loading dock",
  ca: "CA store",
  processing: "processing",
  anteroom: "anteroom",
};

/**
 * Formatting a number for display costs more than computing it (locale formatting), and a
 * canvas redraws hundreds of unchanged figures per edit: formatted strings are memoised.
 */
const memo = new Map<string, string>();
function cached(key: string, f: () => string): string {
  let v = memo.get(key);
  if (v === undefined) {
    if (memo.size > 50_000) memo.clear();
    v = f();
    memo.set(key, v);
  }
  return v;
}
const F = {
  temp: (v: number, s: UnitSystem) => cached(`t|${s}|${v}`, () => fmt.temp(v, s)),
  tempDiff: (v: number, s: UnitSystem) => cached(`d|${s}|${v}`, () => fmt.tempDiff(v, s)),
  power: (v: number, s: UnitSystem, k: "refrigeration" | "electrical" | "heat" = "refrigeration") => cached(`p|${s}|${k}|${v}`, () => fmt.power(v, s, k)),
  length: (v: number, s: UnitSystem) => cached(`l|${s}|${v}`, () => fmt.length(v, s)),
  cop: (v: number) => cached(`c|${v}`, () => fmt.cop(v)),
  number: (v: number, d: number) => cached(`n|${d}|${v}`, () => fmt.number(v, d)),
};

/** Node id → what it shows; figures are left out where the evaluation has no result for the item. */
export function nodeViews(doc: CanvasDoc, result: FacilityResult | null, s: UnitSystem): Map<string, NodeView> {
  const out = new Map<string, NodeView>();
  const rooms = new Map((result?.ledger.rooms ?? []).map((r) => [r.roomId, r]));
  const doorLoad = new Map<string, number>();
  for (const r of result?.ledger.rooms ?? [])
    for (const c of r.components) if (c.kind === "infiltration" && c.sourceId) doorLoad.set(c.sourceId, (doorLoad.get(c.sourceId) ?? 0) + c.powerW);
  const sized = new Map((result?.plant.evaporators ?? []).map((e) => [e.id, e]));
  const circ = new Map((result?.plant.circuits ?? []).map((c) => [c.id, c]));
  const cond = new Map((result?.plant.condensers ?? []).map((c) => [c.id, c]));

  out.set(OUTDOORS, { kind: "Outdoors", title: "Outdoors", subtitle: "site design conditions", figures: [] });
  for (const r of doc.rooms) {
    const res = rooms.get(r.id);
    const figures: Figure[] = [{ label: "Set point", value: F.temp(r.setPointC, s) }];
    if (res) figures.push({ label: "Required", value: F.power(res.designCapacityW, s), title: "Design capacity: the larger of 24-h energy × (1 + safety factor) ÷ run hours and the peak hour × (1 + safety factor)" });
    out.set(nodeId("room", r.id), { kind: "Room", title: r.name, subtitle: `${KIND_LABEL[r.kind] ?? r.kind} · ${F.number(r.lengthM * r.widthM, 0)} m²`, figures });
  }
  for (const d of doc.doors) {
    const figures: Figure[] = [
      { label: "Size", value: `${F.length(d.widthM, s).replace(/ .*/, "")} × ${F.length(d.heightM, s)}` },
      { label: "Protection", value: PROTECTION[d.protection ?? "none"] },
    ];
    const q = doorLoad.get(d.id);
    if (q !== undefined) figures.push({ label: "Infiltration", value: F.power(q, s), title: "Gosney–Olama doorway infiltration, 24-h average" });
    out.set(nodeId("door", d.id), { kind: "Door", title: d.name || d.id, subtitle: d.passagesPerDay !== undefined ? `${F.number(d.passagesPerDay, 0)} passages/day` : undefined, figures });
  }
  for (const e of evaporators(doc)) {
    const z = sized.get(e.id);
    const figures: Figure[] = z
      ? [
          { label: "Duty", value: F.power(z.dutyW, s) },
          { label: "TD", value: F.tempDiff(z.tdK, s) },
          { label: "Units", value: String(z.units) },
        ]
      : [];
    out.set(nodeId("evaporator", e.id), { kind: "Evaporator", title: e.tag, subtitle: e.feed?.type === "pumped" ? "pumped feed" : "direct expansion", figures });
  }
  for (const c of circuits(doc)) {
    const r = circ.get(c.id);
    const figures: Figure[] = r
      ? [
          { label: "Suction", value: F.temp(r.suctionC, s) },
          { label: "Condensing", value: F.temp(r.condensingC, s) },
          { label: "COP", value: F.cop(r.cop), title: r.copCarnot ? `Carnot COP ${F.cop(r.copCarnot)}` : undefined },
          { label: "Shaft", value: F.power(r.shaftPowerW, s, "electrical").replace("kW(e)", "kW shaft"), title: "Compressor shaft power (mechanical)" },
        ]
      : [];
    out.set(nodeId("circuit", c.id), { kind: "Circuit", title: c.tag, subtitle: `${c.refrigerant} · ${c.arrangement ?? "single-stage"}`, figures });
  }
  for (const c of condensers(doc)) {
    const r = cond.get(c.id);
    const figures: Figure[] = r ? [{ label: "Rejected", value: F.power(r.heatRejectedW, s, "heat") }, { label: "Condensing", value: F.temp(r.condensingC, s) }] : [];
    out.set(nodeId("condenser", c.id), { kind: "Condenser", title: c.tag, subtitle: c.type, figures });
  }
  return out;
}
