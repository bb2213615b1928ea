/**
 * The canvas model: how the facility document maps to nodes and links, which links are
 * allowed, and the edits the canvas makes (add, connect, disconnect, delete, paste). Pure and
 * immutable: every edit returns a new document, untouched entities keep their references (the
 * incremental engine and the undo history rely on that).
 */
import type { CanvasDoc, CircuitDoc, CondenserDoc, DoorDoc, EvaporatorDoc, NodeKind, RoomDoc } from "./schema";

export const OUTDOORS = "outdoors";

export function nodeId(kind: Exclude<NodeKind, "outdoors">, id: string): string {
  return `${kind}:${id}`;
}

export function parseNodeId(nid: string): { kind: NodeKind; id: string } {
  if (nid === OUTDOORS) return { kind: "outdoors", id: OUTDOORS };
  const i = nid.indexOf(":");
  return { kind: nid.slice(0, i) as NodeKind, id: nid.slice(i + 1) };
}

export const evaporators = (d: CanvasDoc) => d.plant.evaporators ?? [];
export const circuits = (d: CanvasDoc) => d.plant.circuits ?? [];
export const condensers = (d: CanvasDoc) => d.plant.condensers ?? [];

export type LinkKind = "door-side" | "evaporator-room" | "evaporator-circuit" | "circuit-condenser" | "circuit-cascade";

export interface Link {
  id: string;
  kind: LinkKind;
  /** The upper node of the drawing (door, room, evaporator, circuit). */
  source: string;
  target: string;
}

/** Every link the document implies, one per reference (a door has two). */
export function linksOf(doc: CanvasDoc): Link[] {
  const out: Link[] = [];
  const rooms = new Set(doc.rooms.map((r) => r.id));
  const circuitIds = new Set(circuits(doc).map((c) => c.id));
  const condenserIds = new Set(condensers(doc).map((c) => c.id));
  for (const d of doc.doors) {
    d.sides.forEach((s, k) => {
      if (s === OUTDOORS) out.push({ id: `link:door:${d.id}:${k}`, kind: "door-side", source: nodeId("door", d.id), target: OUTDOORS });
      else if (rooms.has(s)) out.push({ id: `link:door:${d.id}:${k}`, kind: "door-side", source: nodeId("door", d.id), target: nodeId("room", s) });
    });
  }
  for (const e of evaporators(doc)) {
    if (rooms.has(e.roomId)) out.push({ id: `link:evroom:${e.id}`, kind: "evaporator-room", source: nodeId("room", e.roomId), target: nodeId("evaporator", e.id) });
    if (circuitIds.has(e.circuitId)) out.push({ id: `link:evcircuit:${e.id}`, kind: "evaporator-circuit", source: nodeId("evaporator", e.id), target: nodeId("circuit", e.circuitId) });
  }
  for (const c of circuits(doc)) {
    const hr = c.heatRejection;
    if (hr.to === "condenser" && condenserIds.has(hr.condenserId))
      out.push({ id: `link:reject:${c.id}`, kind: "circuit-condenser", source: nodeId("circuit", c.id), target: nodeId("condenser", hr.condenserId) });
    if (hr.to === "circuit" && circuitIds.has(hr.circuitId))
      out.push({ id: `link:reject:${c.id}`, kind: "circuit-cascade", source: nodeId("circuit", c.id), target: nodeId("circuit", hr.circuitId) });
  }
  return out;
}

/** Every node id of the document (Outdoors always present: doors to outdoors join it). */
export function nodeIdsOf(doc: CanvasDoc): string[] {
  return [
    OUTDOORS,
    ...doc.rooms.map((r) => nodeId("room", r.id)),
    ...doc.doors.map((d) => nodeId("door", d.id)),
    ...evaporators(doc).map((e) => nodeId("evaporator", e.id)),
    ...circuits(doc).map((c) => nodeId("circuit", c.id)),
    ...condensers(doc).map((c) => nodeId("condenser", c.id)),
  ];
}

const roomName = (doc: CanvasDoc, id: string) => (id === OUTDOORS ? "Outdoors" : (doc.rooms.find((r) => r.id === id)?.name ?? id));

export function labelOf(doc: CanvasDoc, nid: string): string {
  const { kind, id } = parseNodeId(nid);
  switch (kind) {
    case "outdoors":
      return "Outdoors";
    case "room":
      return roomName(doc, id);
    case "door":
      return doc.doors.find((d) => d.id === id)?.name || `Door ${id}`;
    case "evaporator":
      return evaporators(doc).find((e) => e.id === id)?.tag ?? id;
    case "circuit":
      return circuits(doc).find((c) => c.id === id)?.tag ?? id;
    case "condenser":
      return condensers(doc).find((c) => c.id === id)?.tag ?? id;
  }
}

export type ConnectionCheck = { ok: true } | { ok: false; message: string };

const refuse = (message: string): ConnectionCheck => ({ ok: false, message });

/** Would following the cascade from `to` ever come back to `from`? */
function cascadeLoops(doc: CanvasDoc, from: string, to: string): boolean {
  const byId = new Map(circuits(doc).map((c) => [c.id, c]));
  const seen = new Set<string>();
  let cur = byId.get(to);
  while (cur && !seen.has(cur.id)) {
    if (cur.id === from) return true;
    seen.add(cur.id);
    cur = cur.heatRejection.to === "circuit" ? byId.get(cur.heatRejection.circuitId) : undefined;
  }
  return false;
}

/** Orders a pair so that the kinds read the way the link is stored. */
function ordered(a: string, b: string): [string, string] {
  const rank: Record<NodeKind, number> = { door: 0, outdoors: 1, room: 1, evaporator: 2, circuit: 3, condenser: 4 };
  return rank[parseNodeId(a).kind] <= rank[parseNodeId(b).kind] ? [a, b] : [b, a];
}

/**
 * The connection rules (PRODUCT.md): a door joins two rooms or a room and Outdoors; an
 * evaporator sits in one room and feeds one circuit; a circuit rejects to one condenser or, in
 * a cascade, into another circuit. `from` is where the drag started: for two circuits it is
 * the low stage that rejects into `to`.
 */
export function checkConnection(doc: CanvasDoc, from: string, to: string): ConnectionCheck {
  if (from === to) return refuse("A node cannot connect to itself.");
  const A = parseNodeId(from);
  const B = parseNodeId(to);
  if (A.kind === "circuit" && B.kind === "circuit") {
    const low = circuits(doc).find((c) => c.id === A.id)!;
    if (linksOf(doc).some((l) => l.id === `link:reject:${low.id}`))
      return refuse(`${low.tag} already rejects its heat (a circuit rejects to one condenser or one circuit): delete that link first.`);
    if (cascadeLoops(doc, A.id, B.id)) return refuse(`A cascade loop: ${labelOf(doc, to)} already rejects, through its chain, into ${low.tag}.`);
    return { ok: true };
  }
  const [a, b] = ordered(from, to);
  const ka = parseNodeId(a).kind;
  const kb = parseNodeId(b).kind;
  const ia = parseNodeId(a).id;
  const ib = parseNodeId(b).id;
  const links = linksOf(doc);
  if (ka === "door" && (kb === "room" || kb === "outdoors")) {
    const door = doc.doors.find((d) => d.id === ia)!;
    const joined = door.sides.filter((s) => s === OUTDOORS || doc.rooms.some((r) => r.id === s));
    if (joined.includes(ib)) return refuse(`${labelOf(doc, a)} already opens onto ${roomName(doc, ib)}.`);
    if (joined.length >= 2)
      return refuse(`${labelOf(doc, a)} already joins ${joined.map((s) => roomName(doc, s)).join(" and ")}: a door joins two spaces. Delete one of its links first.`);
    return { ok: true };
  }
  if (ka === "room" && kb === "evaporator") {
    if (links.some((l) => l.id === `link:evroom:${ib}`))
      return refuse(`${labelOf(doc, b)} already sits in ${roomName(doc, evaporators(doc).find((e) => e.id === ib)!.roomId)}: an evaporator sits in one room. Delete that link first.`);
    return { ok: true };
  }
  if (ka === "evaporator" && kb === "circuit") {
    if (links.some((l) => l.id === `link:evcircuit:${ia}`))
      return refuse(`${labelOf(doc, a)} already feeds ${labelOf(doc, nodeId("circuit", evaporators(doc).find((e) => e.id === ia)!.circuitId))}: an evaporator feeds one circuit. Delete that link first.`);
    return { ok: true };
  }
  if (ka === "circuit" && kb === "condenser") {
    if (links.some((l) => l.id === `link:reject:${ia}`))
      return refuse(`${labelOf(doc, a)} already rejects its heat: a circuit rejects to one condenser (or one circuit). Delete that link first.`);
    return { ok: true };
  }
  return refuse(RULE_HINTS[`${ka}-${kb}`] ?? `A ${KIND_WORD[ka]} cannot connect to a ${KIND_WORD[kb]}.`);
}

const KIND_WORD: Record<NodeKind, string> = {
  room: "room",
  door: "door",
  evaporator: "evaporator",
  circuit: "circuit",
  condenser: "condenser",
  outdoors: "Outdoors",
};

const RULE_HINTS: Record<string, string> = {
  "room-room": "Rooms do not connect directly: add a door and connect it to both rooms.",
  "outdoors-room": "A room reaches Outdoors through a door: add a door and connect it to the room and to Outdoors.",
  "room-outdoors": "A room reaches Outdoors through a door: add a door and connect it to the room and to Outdoors.",
  "room-circuit": "A room is cooled through an evaporator: add an evaporator in the room and connect it to the circuit.",
  "room-condenser": "A room does not connect to a condenser: place an evaporator in the room, feed it to a circuit, and let the circuit reject to the condenser.",
  "door-door": "Doors join rooms, not other doors.",
  "door-evaporator": "A door joins rooms or Outdoors, not an evaporator.",
  "door-circuit": "A door joins rooms or Outdoors, not a circuit.",
  "door-condenser": "A door joins rooms or Outdoors, not a condenser.",
  "evaporator-evaporator": "Evaporators do not connect to each other: each sits in a room and feeds a circuit.",
  "evaporator-condenser": "An evaporator feeds a circuit, and the circuit rejects to the condenser.",
  "outdoors-evaporator": "An evaporator sits in a room, not outdoors.",
  "outdoors-circuit": "Outdoors joins doors only.",
  "outdoors-condenser": "Outdoors joins doors only; a condenser's sink comes from the site conditions.",
  "condenser-condenser": "Condensers do not connect to each other.",
};

/** Applies an allowed connection (see `checkConnection`); returns the new document. */
export function connect(doc: CanvasDoc, from: string, to: string): CanvasDoc {
  const check = checkConnection(doc, from, to);
  if (!check.ok) throw new Error(check.message);
  const A = parseNodeId(from);
  const B = parseNodeId(to);
  if (A.kind === "circuit" && B.kind === "circuit")
    return updateCircuit(doc, A.id, (c) => ({ ...c, heatRejection: { to: "circuit", circuitId: B.id } }));
  const [a, b] = ordered(from, to);
  const pa = parseNodeId(a);
  const pb = parseNodeId(b);
  if (pa.kind === "door") {
    return {
      ...doc,
      doors: doc.doors.map((d) => {
        if (d.id !== pa.id) return d;
        const valid = (s: string) => s === OUTDOORS || doc.rooms.some((r) => r.id === s);
        const sides: [string, string] = [...d.sides];
        const k = valid(sides[0]) ? 1 : 0;
        sides[k] = pb.id;
        return { ...d, sides };
      }),
    };
  }
  if (pa.kind === "room") return updateEvaporator(doc, pb.id, (e) => ({ ...e, roomId: pa.id }));
  if (pa.kind === "evaporator") return updateEvaporator(doc, pa.id, (e) => ({ ...e, circuitId: pb.id }));
  return updateCircuit(doc, pa.id, (c) => ({ ...c, heatRejection: { to: "condenser", condenserId: pb.id } }));
}

function updateEvaporator(doc: CanvasDoc, id: string, f: (e: EvaporatorDoc) => EvaporatorDoc): CanvasDoc {
  return { ...doc, plant: { ...doc.plant, evaporators: evaporators(doc).map((e) => (e.id === id ? f(e) : e)) } };
}
function updateCircuit(doc: CanvasDoc, id: string, f: (c: CircuitDoc) => CircuitDoc): CanvasDoc {
  return { ...doc, plant: { ...doc.plant, circuits: circuits(doc).map((c) => (c.id === id ? f(c) : c)) } };
}

const UNSET_REJECTION = { to: "condenser", condenserId: "" } as const;

/** Removes links (by `linksOf` id): the reference is cleared, the entities stay. */
export function disconnect(doc: CanvasDoc, linkIds: string[]): CanvasDoc {
  let d = doc;
  for (const lid of linkIds) {
    const parts = lid.split(":");
    const kind = parts[1];
    if (kind === "door") {
      const k = Number(parts[parts.length - 1]);
      const id = parts.slice(2, -1).join(":");
      d = {
        ...d,
        doors: d.doors.map((x) => {
          if (x.id !== id) return x;
          const sides: [string, string] = [...x.sides];
          sides[k] = "";
          return { ...x, sides };
        }),
      };
    } else {
      const id = parts.slice(2).join(":");
      if (kind === "evroom") d = updateEvaporator(d, id, (e) => ({ ...e, roomId: "" }));
      else if (kind === "evcircuit") d = updateEvaporator(d, id, (e) => ({ ...e, circuitId: "" }));
      else if (kind === "reject") d = updateCircuit(d, id, (c) => ({ ...c, heatRejection: UNSET_REJECTION }));
    }
  }
  return d;
}

/** Deletes entities; references to them are cleared (connected items stay, unlinked). */
export function removeNodes(doc: CanvasDoc, nids: string[]): CanvasDoc {
  const del = (k: NodeKind) => new Set(nids.map(parseNodeId).filter((p) => p.kind === k).map((p) => p.id));
  const rooms = del("room");
  const doors = del("door");
  const evs = del("evaporator");
  const cs = del("circuit");
  const cds = del("condenser");
  const clearSide = (s: string) => (rooms.has(s) ? "" : s);
  return {
    ...doc,
    rooms: doc.rooms.filter((r) => !rooms.has(r.id)),
    doors: doc.doors
      .filter((d) => !doors.has(d.id))
      .map((d) => (d.sides.some((s) => rooms.has(s)) ? { ...d, sides: [clearSide(d.sides[0]), clearSide(d.sides[1])] as [string, string] } : d)),
    plant: {
      ...doc.plant,
      evaporators: evaporators(doc)
        .filter((e) => !evs.has(e.id))
        .map((e) => (rooms.has(e.roomId) || cs.has(e.circuitId) ? { ...e, roomId: rooms.has(e.roomId) ? "" : e.roomId, circuitId: cs.has(e.circuitId) ? "" : e.circuitId } : e)),
      circuits: circuits(doc)
        .filter((c) => !cs.has(c.id))
        .map((c) => {
          const hr = c.heatRejection;
          const gone = (hr.to === "condenser" && cds.has(hr.condenserId)) || (hr.to === "circuit" && cs.has(hr.circuitId));
          return gone ? { ...c, heatRejection: UNSET_REJECTION } : c;
        }),
      condensers: condensers(doc).filter((c) => !cds.has(c.id)),
    },
    ...(rooms.size && Array.isArray(doc.plantOptions) ? { plantOptions: pruneOptionRooms(doc.plantOptions, rooms) } : {}),
  };
}

type OptionDoc = { plant?: { evaporators?: { roomId: string }[]; installed?: { evaporators?: { roomId: string }[] } } };

/**
 * Plant options share the rooms (lib/engine/options.ts): an option's evaporators (and installed
 * evaporators) in a deleted room go with the room. Options without any keep their reference.
 */
function pruneOptionRooms(options: unknown[], rooms: Set<string>): unknown[] {
  return options.map((o) => {
    const p = (o as OptionDoc).plant;
    const evs = p?.evaporators ?? [];
    const inst = p?.installed?.evaporators ?? [];
    if (!evs.some((e) => rooms.has(e.roomId)) && !inst.some((e) => rooms.has(e.roomId))) return o;
    return {
      ...(o as object),
      plant: {
        ...p,
        evaporators: evs.filter((e) => !rooms.has(e.roomId)),
        ...(p?.installed ? { installed: { ...p.installed, evaporators: inst.filter((e) => !rooms.has(e.roomId)) } } : {}),
      },
    };
  });
}

export type IdGen = (prefix: string) => string;

export const randomId: IdGen = (prefix) => `${prefix}-${Math.random().toString(36).slice(2, 8)}`;

function nextTag(doc: CanvasDoc, prefix: string): string {
  const used = new Set([...evaporators(doc), ...circuits(doc), ...condensers(doc)].map((x) => x.tag));
  for (let n = 1; ; n++) if (!used.has(`${prefix}-${n}`)) return `${prefix}-${n}`;
}

function uniqueId(doc: CanvasDoc, gen: IdGen, prefix: string): string {
  const used = new Set(nodeIdsOf(doc).map((n) => parseNodeId(n).id));
  for (;;) {
    const id = gen(prefix);
    if (!used.has(id) && id !== OUTDOORS) return id;
  }
}

const PANEL = [{ material: "PIR panel", thicknessM: 0.15, conductivityWmK: 0.023 }];

/** A new 10 × 10 × 6 m chilled room with a default insulated envelope (all walls and roof outdoors). */
export function newRoom(doc: CanvasDoc, gen: IdGen = randomId): RoomDoc {
  const n = doc.rooms.length + 1;
  return {
    id: uniqueId(doc, gen, "room"),
    name: `Room ${n}`,
    kind: "storage",
    lengthM: 10,
    widthM: 10,
    heightM: 6,
    setPointC: 2,
    rhPct: 85,
    surfaces: [
      { kind: "wall", orientation: "N", along: "length", otherSide: "outdoors", layers: PANEL },
      { kind: "wall", orientation: "S", along: "length", otherSide: "outdoors", layers: PANEL },
      { kind: "wall", orientation: "E", along: "width", otherSide: "outdoors", layers: PANEL },
      { kind: "wall", orientation: "W", along: "width", otherSide: "outdoors", layers: PANEL },
      { kind: "roof", otherSide: "outdoors", layers: PANEL },
      { kind: "floor", otherSide: "ground", layers: [{ material: "concrete slab", thicknessM: 0.15, conductivityWmK: 1.4 }, { material: "XPS", thicknessM: 0.1, conductivityWmK: 0.032 }] },
    ],
  };
}

export function newDoor(doc: CanvasDoc, gen: IdGen = randomId): DoorDoc {
  return { id: uniqueId(doc, gen, "door"), name: `Door ${doc.doors.length + 1}`, widthM: 2.4, heightM: 3, sides: ["", ""], passagesPerDay: 60, protection: "stripCurtain" };
}

export function newEvaporator(doc: CanvasDoc, gen: IdGen = randomId): EvaporatorDoc {
  return { id: uniqueId(doc, gen, "ev"), tag: nextTag(doc, "EV"), roomId: "", circuitId: "" };
}

export function newCircuit(doc: CanvasDoc, gen: IdGen = randomId): CircuitDoc {
  return { id: uniqueId(doc, gen, "c"), tag: nextTag(doc, "C"), refrigerant: "R717", heatRejection: UNSET_REJECTION };
}

export function newCondenser(doc: CanvasDoc, gen: IdGen = randomId): CondenserDoc {
  return { id: uniqueId(doc, gen, "cd"), tag: nextTag(doc, "CD"), type: "evaporative" };
}

export type AddKind = Exclude<NodeKind, "outdoors">;

/** Adds a new default entity of `kind`; returns the document and the new node's id. */
export function addNode(doc: CanvasDoc, kind: AddKind, gen: IdGen = randomId): { doc: CanvasDoc; nid: string } {
  switch (kind) {
    case "room": {
      const r = newRoom(doc, gen);
      return { doc: { ...doc, rooms: [...doc.rooms, r] }, nid: nodeId("room", r.id) };
    }
    case "door": {
      const d = newDoor(doc, gen);
      return { doc: { ...doc, doors: [...doc.doors, d] }, nid: nodeId("door", d.id) };
    }
    case "evaporator": {
      const e = newEvaporator(doc, gen);
      return { doc: { ...doc, plant: { ...doc.plant, evaporators: [...evaporators(doc), e] } }, nid: nodeId("evaporator", e.id) };
    }
    case "circuit": {
      const c = newCircuit(doc, gen);
      return { doc: { ...doc, plant: { ...doc.plant, circuits: [...circuits(doc), c] } }, nid: nodeId("circuit", c.id) };
    }
    case "condenser": {
      const c = newCondenser(doc, gen);
      return { doc: { ...doc, plant: { ...doc.plant, condensers: [...condensers(doc), c] } }, nid: nodeId("condenser", c.id) };
    }
  }
}

/** The entity behind a node, for the inspector. */
export function entityOf(doc: CanvasDoc, nid: string): RoomDoc | DoorDoc | EvaporatorDoc | CircuitDoc | CondenserDoc | undefined {
  const { kind, id } = parseNodeId(nid);
  if (kind === "room") return doc.rooms.find((r) => r.id === id);
  if (kind === "door") return doc.doors.find((d) => d.id === id);
  if (kind === "evaporator") return evaporators(doc).find((e) => e.id === id);
  if (kind === "circuit") return circuits(doc).find((c) => c.id === id);
  if (kind === "condenser") return condensers(doc).find((c) => c.id === id);
  return undefined;
}

/** Replaces the entity behind a node (same id) with `next`. */
export function replaceEntity(doc: CanvasDoc, nid: string, next: object): CanvasDoc {
  const { kind, id } = parseNodeId(nid);
  const same = (next as { id?: unknown }).id === id;
  const swap = <T extends { id: string }>(list: T[]) => list.map((x) => (x.id === id ? ((same ? next : { ...next, id }) as T) : x));
  if (kind === "room") return { ...doc, rooms: swap(doc.rooms) };
  if (kind === "door") return { ...doc, doors: swap(doc.doors) };
  if (kind === "evaporator") return { ...doc, plant: { ...doc.plant, evaporators: swap(evaporators(doc)) } };
  if (kind === "circuit") return { ...doc, plant: { ...doc.plant, circuits: swap(circuits(doc)) } };
  if (kind === "condenser") return { ...doc, plant: { ...doc.plant, condensers: swap(condensers(doc)) } };
  return doc;
}

/** A copied selection: the entities and their positions. */
export interface Clip {
  rooms: RoomDoc[];
  doors: DoorDoc[];
  evaporators: EvaporatorDoc[];
  circuits: CircuitDoc[];
  condensers: CondenserDoc[];
  positions: Record<string, { x: number; y: number }>;
}

export function copyNodes(doc: CanvasDoc, nids: string[], positions: Record<string, { x: number; y: number }>): Clip {
  const set = new Set(nids);
  const pick = <T extends { id: string }>(list: T[], k: AddKind) => list.filter((x) => set.has(nodeId(k, x.id)));
  const clip: Clip = {
    rooms: pick(doc.rooms, "room"),
    doors: pick(doc.doors, "door"),
    evaporators: pick(evaporators(doc), "evaporator"),
    circuits: pick(circuits(doc), "circuit"),
    condensers: pick(condensers(doc), "condenser"),
    positions: {},
  };
  for (const n of nids) if (positions[n]) clip.positions[n] = positions[n];
  return structuredClone(clip);
}

/**
 * Pastes a clip with fresh ids and tags. References between pasted items follow the copies;
 * references to items outside the clip are kept (a pasted evaporator stays in its room).
 * Returns the new document, the new node ids and their positions (offset by `offset`).
 */
export function pasteClip(doc: CanvasDoc, clip: Clip, gen: IdGen = randomId, offset = 40): { doc: CanvasDoc; nids: string[]; positions: Record<string, { x: number; y: number }> } {
  let d = doc;
  const map = new Map<string, string>();
  const nids: string[] = [];
  const positions: Record<string, { x: number; y: number }> = {};
  const ref = (k: AddKind, old: string) => map.get(`${k}:${old}`) ?? old;
  for (const r of clip.rooms) {
    const id = uniqueId(d, gen, "room");
    map.set(`room:${r.id}`, id);
    d = { ...d, rooms: [...d.rooms, { ...r, id, name: `${r.name} (copy)` }] };
  }
  const pastedRooms = new Set(clip.rooms.map((r) => ref("room", r.id)));
  d = {
    ...d,
    rooms: d.rooms.map((r) =>
      pastedRooms.has(r.id)
        ? { ...r, surfaces: (r.surfaces ?? []).map((s) => (typeof s.otherSide === "object" ? { ...s, otherSide: { roomId: ref("room", s.otherSide.roomId) } } : s)) }
        : r,
    ),
  };
  for (const x of clip.doors) {
    const id = uniqueId(d, gen, "door");
    map.set(`door:${x.id}`, id);
    d = { ...d, doors: [...d.doors, { ...x, id, name: x.name ? `${x.name} (copy)` : undefined, sides: [ref("room", x.sides[0]), ref("room", x.sides[1])] }] };
  }
  for (const c of clip.condensers) {
    const id = uniqueId(d, gen, "cd");
    map.set(`condenser:${c.id}`, id);
    d = { ...d, plant: { ...d.plant, condensers: [...condensers(d), { ...c, id, tag: nextTag(d, "CD") }] } };
  }
  for (const c of clip.circuits) {
    const id = uniqueId(d, gen, "c");
    map.set(`circuit:${c.id}`, id);
    d = { ...d, plant: { ...d.plant, circuits: [...circuits(d), { ...c, id, tag: nextTag(d, "C"), tags: undefined }] } };
  }
  // Heat rejection follows the copies once every pasted circuit and condenser has its id.
  const pastedCircuits = new Set(clip.circuits.map((c) => ref("circuit", c.id)));
  d = {
    ...d,
    plant: {
      ...d.plant,
      circuits: circuits(d).map((c) => {
        if (!pastedCircuits.has(c.id)) return c;
        const hr = c.heatRejection;
        return hr.to === "condenser" ? { ...c, heatRejection: { ...hr, condenserId: ref("condenser", hr.condenserId) } } : { ...c, heatRejection: { ...hr, circuitId: ref("circuit", hr.circuitId) } };
      }),
    },
  };
  for (const e of clip.evaporators) {
    const id = uniqueId(d, gen, "ev");
    map.set(`evaporator:${e.id}`, id);
    d = { ...d, plant: { ...d.plant, evaporators: [...evaporators(d), { ...e, id, tag: nextTag(d, "EV"), roomId: ref("room", e.roomId), circuitId: ref("circuit", e.circuitId) }] } };
  }
  for (const [key, id] of map) {
    const k = key.slice(0, key.indexOf(":")) as AddKind;
    const oldNid = nodeId(k, key.slice(key.indexOf(":") + 1));
    const nid = nodeId(k, id);
    nids.push(nid);
    const p = clip.positions[oldNid];
    if (p) positions[nid] = { x: p.x + offset, y: p.y + offset };
  }
  return { doc: d, nids, positions };
}

export interface Skipped {
  /** The node left out, or null for an installed-plant record (not drawn on the canvas). */
  nid: string | null;
  message: string;
}

/**
 * The computable part of a document: items not yet connected (a door without both sides, an
 * evaporator without a room or circuit, a circuit that rejects nowhere — and whatever depends
 * on them) are left out and listed, so the rest computes while the user is still drawing.
 */
export function pruneIncomplete(doc: CanvasDoc): { doc: CanvasDoc; skipped: Skipped[] } {
  const skipped: Skipped[] = [];
  const rooms = new Set(doc.rooms.map((r) => r.id));
  const doors = doc.doors.filter((d) => {
    const ok = d.sides.every((s) => s === OUTDOORS || rooms.has(s));
    if (!ok) skipped.push({ nid: nodeId("door", d.id), message: `${d.name || d.id} is not connected on both sides: connect it to two rooms, or to a room and Outdoors.` });
    return ok;
  });
  const condenserIds = new Set(condensers(doc).map((c) => c.id));
  let cs = circuits(doc);
  for (let changed = true; changed; ) {
    changed = false;
    const ids = new Set(cs.map((c) => c.id));
    const next = cs.filter((c) => {
      const hr = c.heatRejection;
      const ok = hr.to === "condenser" ? condenserIds.has(hr.condenserId) : ids.has(hr.circuitId);
      if (!ok) {
        const why = hr.to === "condenser" ? "rejects its heat nowhere: connect it to a condenser (or, in a cascade, to another circuit)." : "rejects into a circuit that cannot be computed yet.";
        skipped.push({ nid: nodeId("circuit", c.id), message: `${c.tag} ${why}` });
        changed = true;
      }
      return ok;
    });
    cs = next;
  }
  const cids = new Set(cs.map((c) => c.id));
  const evs = evaporators(doc).filter((e) => {
    const inRoom = rooms.has(e.roomId);
    const onCircuit = cids.has(e.circuitId);
    if (!inRoom) skipped.push({ nid: nodeId("evaporator", e.id), message: `${e.tag} is in no room: connect it to the room it cools.` });
    else if (!circuits(doc).some((c) => c.id === e.circuitId)) skipped.push({ nid: nodeId("evaporator", e.id), message: `${e.tag} feeds no circuit: connect it to a circuit.` });
    else if (!onCircuit) skipped.push({ nid: nodeId("evaporator", e.id), message: `${e.tag} feeds a circuit that cannot be computed yet.` });
    return inRoom && onCircuit;
  });
  // Installed-plant records (kept for stocking checks) that point at items not computed now.
  const inst = doc.plant.installed as { evaporators?: { tag: string; roomId: string; circuitId: string }[]; compressors?: { tag: string; circuitId: string }[]; condensers?: { tag: string; condenserId: string }[] } | undefined;
  let installed = inst;
  if (inst) {
    const keep = <T extends { tag: string }>(list: T[] | undefined, ok: (x: T) => boolean, what: string) =>
      (list ?? []).filter((x) => {
        if (ok(x)) return true;
        skipped.push({ nid: null, message: `Installed ${what} ${x.tag} refers to an item that is missing or not connected; it is left out until that item is back.` });
        return false;
      });
    const next = {
      ...inst,
      evaporators: keep(inst.evaporators, (x) => rooms.has(x.roomId) && cids.has(x.circuitId), "evaporator"),
      compressors: keep(inst.compressors, (x) => cids.has(x.circuitId), "compressor"),
      condensers: keep(inst.condensers, (x) => condenserIds.has(x.condenserId), "condenser"),
    };
    const same = next.evaporators.length === (inst.evaporators ?? []).length && next.compressors.length === (inst.compressors ?? []).length && next.condensers.length === (inst.condensers ?? []).length;
    if (!same) installed = next;
  }
  const unchanged = doors.length === doc.doors.length && evs.length === evaporators(doc).length && cs.length === circuits(doc).length && installed === inst;
  if (unchanged) return { doc, skipped };
  return { doc: { ...doc, doors, plant: { ...doc.plant, evaporators: evs, circuits: cs, ...(inst ? { installed } : {}) } }, skipped };
}

/** The node a validation path (`rooms.2.setPointC`, `plant.circuits.0.tag`) points at, and the field inside it. */
export function nodeForPath(doc: CanvasDoc, path: ReadonlyArray<PropertyKey>): { nid: string | null; field: string } {
  const p = path.map(String);
  const idx = (i: number) => Number(p[i]);
  if (p[0] === "rooms" && doc.rooms[idx(1)]) return { nid: nodeId("room", doc.rooms[idx(1)].id), field: p.slice(2).join(".") };
  if (p[0] === "doors" && doc.doors[idx(1)]) return { nid: nodeId("door", doc.doors[idx(1)].id), field: p.slice(2).join(".") };
  if (p[0] === "plant" && p[1] === "evaporators" && evaporators(doc)[idx(2)]) return { nid: nodeId("evaporator", evaporators(doc)[idx(2)].id), field: p.slice(3).join(".") };
  if (p[0] === "plant" && p[1] === "circuits" && circuits(doc)[idx(2)]) return { nid: nodeId("circuit", circuits(doc)[idx(2)].id), field: p.slice(3).join(".") };
  if (p[0] === "plant" && p[1] === "condensers" && condensers(doc)[idx(2)]) return { nid: nodeId("condenser", condensers(doc)[idx(2)].id), field: p.slice(3).join(".") };
  return { nid: null, field: p.join(".") };
}

const ROW_Y: Record<NodeKind, number> = { door: 0, outdoors: 0, room: 200, evaporator: 420, circuit: 620, condenser: 840 };
const COL_W = 240;
const DOOR_W = 210;

/**
 * Positions for nodes that have none: rooms in a row, doors above the rooms they join,
 * each room's evaporators below it, circuits below their evaporators (low stages first),
 * condensers at the bottom. Saved positions are kept.
 */
export function autoLayout(doc: CanvasDoc, saved: Record<string, { x: number; y: number }>): Record<string, { x: number; y: number }> {
  const out: Record<string, { x: number; y: number }> = { ...saved };
  const taken = new Set(Object.values(out).map((p) => `${Math.round(p.x)}|${Math.round(p.y)}`));
  const place = (nid: string, x: number, y: number) => {
    if (out[nid]) return;
    let px = x;
    while (taken.has(`${Math.round(px)}|${Math.round(y)}`)) px += COL_W;
    out[nid] = { x: px, y };
    taken.add(`${Math.round(px)}|${Math.round(y)}`);
  };
  const roomX = new Map<string, number>();
  doc.rooms.forEach((r, i) => {
    const nid = nodeId("room", r.id);
    place(nid, i * COL_W * 1.25, ROW_Y.room);
    roomX.set(r.id, out[nid].x);
  });
  place(OUTDOORS, -COL_W * 1.25, ROW_Y.room);
  roomX.set(OUTDOORS, out[OUTDOORS].x);
  // Doors sit above the spaces they join, swept left to right so that none overlap.
  const wanted = doc.doors
    .filter((d) => !out[nodeId("door", d.id)])
    .map((d) => {
      const xs = d.sides.map((s) => roomX.get(s)).filter((x): x is number => x !== undefined);
      return { nid: nodeId("door", d.id), x: xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : 0 };
    })
    .sort((a, b) => a.x - b.x);
  let lastX = -Infinity;
  for (const w of wanted) {
    const x = Math.max(w.x, lastX + DOOR_W);
    place(w.nid, x, ROW_Y.door);
    lastX = out[w.nid].x;
  }
  const evX = new Map<string, number[]>();
  evaporators(doc).forEach((e) => {
    const nid = nodeId("evaporator", e.id);
    place(nid, roomX.get(e.roomId) ?? 0, ROW_Y.evaporator);
    evX.set(e.circuitId, [...(evX.get(e.circuitId) ?? []), out[nid].x]);
  });
  const lowStage = new Set(circuits(doc).filter((c) => c.heatRejection.to === "circuit").map((c) => c.id));
  const cdX = new Map<string, number[]>();
  circuits(doc).forEach((c, i) => {
    const xs = evX.get(c.id);
    const x = xs?.length ? xs.reduce((a, b) => a + b, 0) / xs.length : i * COL_W;
    const nid = nodeId("circuit", c.id);
    place(nid, x, ROW_Y.circuit + (lowStage.has(c.id) ? 0 : lowStage.size ? 110 : 0));
    if (c.heatRejection.to === "condenser") cdX.set(c.heatRejection.condenserId, [...(cdX.get(c.heatRejection.condenserId) ?? []), out[nid].x]);
  });
  condensers(doc).forEach((c, i) => {
    const xs = cdX.get(c.id);
    place(nodeId("condenser", c.id), xs?.length ? xs.reduce((a, b) => a + b, 0) / xs.length : i * COL_W, ROW_Y.condenser + (lowStage.size ? 110 : 0));
  });
  return out;
}
