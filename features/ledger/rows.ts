/**
 * The heat ledger flattened for tables and charts: one row per room component, and the
 * per-room stack of component kinds for the bar chart. Pure (shared by the page and tests).
 */
import type { LoadComponent, LoadComponentKind, LoadTrace } from "@/lib/engine/loads/types";
import type { LedgerResult } from "@/lib/engine/loads";

export interface LedgerRow {
  id: string;
  roomId: string;
  room: string;
  kind: LoadComponentKind;
  label: string;
  powerW: number;
  sensibleW: number;
  latentW: number;
  energyKWhPerDay: number;
  /** Share of the room's 24-h energy. */
  share: number;
  trace: LoadTrace;
}

export const KIND_LABEL: Record<LoadComponentKind, string> = {
  transmission: "Transmission",
  infiltration: "Infiltration",
  ventilation: "Ventilation",
  product: "Product",
  packaging: "Packaging",
  batch: "Batch freezing",
  respiration: "Respiration",
  moisture: "Product moisture loss",
  people: "People",
  lights: "Lights",
  machinery: "Machinery",
  forklifts: "Forklifts",
  batteryCharging: "Battery charging",
  heater: "Heaters",
  evaporatorFans: "Evaporator fans",
  defrost: "Defrost",
};

export const KIND_ORDER = Object.keys(KIND_LABEL) as LoadComponentKind[];

export function ledgerRows(ledger: LedgerResult): LedgerRow[] {
  return ledger.rooms.flatMap((r) =>
    r.components.map((c: LoadComponent, i) => ({
      id: `${r.roomId}:${i}`,
      roomId: r.roomId,
      room: r.roomName,
      kind: c.kind,
      label: c.label,
      powerW: c.powerW,
      sensibleW: c.sensibleW,
      latentW: c.latentW,
      energyKWhPerDay: c.energyKWhPerDay,
      share: r.totalEnergyKWhPerDay > 0 ? c.energyKWhPerDay / r.totalEnergyKWhPerDay : 0,
      trace: c.trace,
    })),
  );
}

/** Per room, the 24-h average power of each component kind, W (kinds absent in every room left out). */
export function stackByRoom(ledger: LedgerResult): { kinds: LoadComponentKind[]; rooms: ({ room: string; roomId: string } & Partial<Record<LoadComponentKind, number>>)[] } {
  const used = new Set<LoadComponentKind>();
  const rooms = ledger.rooms.map((r) => {
    const row: { room: string; roomId: string } & Partial<Record<LoadComponentKind, number>> = { room: r.roomName, roomId: r.roomId };
    for (const c of r.components) {
      if (c.powerW === 0) continue;
      used.add(c.kind);
      row[c.kind] = (row[c.kind] ?? 0) + c.powerW;
    }
    return row;
  });
  return { kinds: KIND_ORDER.filter((k) => used.has(k)), rooms };
}
