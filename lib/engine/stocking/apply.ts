/**
 * Applying a stocking scenario's changes to a facility model: the same function works on the
 * parsed engine model and on the stored (raw) model document, so a check and the revision a
 * designer applies from it are the same change.
 */
import { getCommodity } from "../loads";
import type { RoomChange, ScenarioChanges } from "./schema";

/** A stocking input that cannot be applied to this model, naming the field. */
export class StockingError extends Error {
  constructor(
    public readonly code: "UNKNOWN_ROOM" | "UNKNOWN_COMMODITY" | "MISSING_INPUT" | "NO_INSTALLED_PLANT",
    message: string,
    /** Dotted path into the scenario changes (e.g. "rooms.0.commodityId"). */
    public readonly field: string,
  ) {
    super(message);
    this.name = "StockingError";
  }
}

interface ProductLike {
  commodityId: string;
  massKgPerDay: number;
  enteringTempC: number;
  finalTempC?: number;
  pullDownHours: number;
  [k: string]: unknown;
}
interface StoredLike {
  commodityId: string;
  massKg?: number;
  palletPositions?: number;
  kgPerPallet?: number;
}
interface RoomLike {
  id: string;
  name: string;
  setPointC: number;
  products?: ProductLike[];
  storedProduce?: StoredLike[];
}

const PRODUCT_FIELDS = ["commodityId", "tonnesPerDay", "enteringTempC", "finalTempC", "pullDownHours"] as const;

function applyRoom<R extends RoomLike>(room: R, c: RoomChange, i: number): R {
  const f = (k: string) => `rooms.${i}.${k}`;
  if (c.commodityId !== undefined && !getCommodity(c.commodityId))
    throw new StockingError("UNKNOWN_COMMODITY", `no commodity "${c.commodityId}" in the library`, f("commodityId"));
  const next: R = { ...room };
  if (c.setPointC !== undefined) next.setPointC = c.setPointC;
  const products = [...(room.products ?? [])];
  // A new commodity alone changes a room's stored stock when it has no intake stream.
  const streamFields = products.length > 0 || !room.storedProduce?.length ? PRODUCT_FIELDS : PRODUCT_FIELDS.filter((k) => k !== "commodityId");
  if (streamFields.some((k) => c[k] !== undefined)) {
    // The first product stream is the one a scenario changes (a room's main intake).
    const first = products[0];
    if (first) {
      products[0] = {
        ...first,
        ...(c.commodityId !== undefined ? { commodityId: c.commodityId } : {}),
        ...(c.tonnesPerDay !== undefined ? { massKgPerDay: c.tonnesPerDay * 1000 } : {}),
        ...(c.enteringTempC !== undefined ? { enteringTempC: c.enteringTempC } : {}),
        ...(c.finalTempC !== undefined ? { finalTempC: c.finalTempC } : {}),
        ...(c.pullDownHours !== undefined ? { pullDownHours: c.pullDownHours } : {}),
      };
    } else {
      const commodityId = c.commodityId ?? room.storedProduce?.[0]?.commodityId;
      if (!commodityId) throw new StockingError("MISSING_INPUT", `${room.name} has no product intake yet: choose a commodity`, f("commodityId"));
      if (c.tonnesPerDay === undefined) throw new StockingError("MISSING_INPUT", `${room.name} has no product intake yet: give tonnes per day`, f("tonnesPerDay"));
      if (c.enteringTempC === undefined) throw new StockingError("MISSING_INPUT", `${room.name} has no product intake yet: give the entering temperature`, f("enteringTempC"));
      if (c.pullDownHours === undefined) throw new StockingError("MISSING_INPUT", `${room.name} has no product intake yet: give the pull-down hours`, f("pullDownHours"));
      products.push({
        id: "stocking-check",
        commodityId,
        massKgPerDay: c.tonnesPerDay * 1000,
        enteringTempC: c.enteringTempC,
        ...(c.finalTempC !== undefined ? { finalTempC: c.finalTempC } : {}),
        pullDownHours: c.pullDownHours,
      });
    }
    next.products = products;
  }
  const stored = [...(room.storedProduce ?? [])];
  if (c.storedMassKg !== undefined) {
    const commodityId = c.commodityId ?? stored[0]?.commodityId ?? products[0]?.commodityId;
    if (!commodityId) throw new StockingError("MISSING_INPUT", `${room.name} holds no stock yet: choose a commodity`, f("commodityId"));
    // A stored mass replaces pallet positions × kg per pallet (the ledger takes one or the other).
    stored[0] = { commodityId, massKg: c.storedMassKg };
    next.storedProduce = stored;
  } else if (c.commodityId !== undefined && stored.length > 0) {
    stored[0] = { ...stored[0], commodityId: c.commodityId };
    next.storedProduce = stored;
  }
  return next;
}

/**
 * Returns a copy of `model` with the scenario's changes applied (the input is not touched).
 * Per room: a new set point; the first product stream's commodity, t/day, entering and final
 * temperature and pull-down (a stream is added when the room has none, which then needs
 * commodity, t/day, entering temperature and pull-down); the first stored-stock entry's
 * mass or commodity. Throws StockingError naming the change's field.
 */
export function applyStockingChanges<M extends { rooms: RoomLike[] }>(model: M, changes: Pick<ScenarioChanges, "rooms">): M {
  const rooms = [...model.rooms];
  changes.rooms.forEach((c, i) => {
    const idx = rooms.findIndex((r) => r.id === c.roomId);
    if (idx < 0) throw new StockingError("UNKNOWN_ROOM", `no room with id "${c.roomId}" in this facility`, `rooms.${i}.roomId`);
    rooms[idx] = applyRoom(rooms[idx], c, i);
  });
  return { ...model, rooms };
}
