import type { BenchCase } from "@/scripts/bench-harness";
import { generateFacility } from "../loads/generate";
import { computeFacility, createFacilityEngine, facilityModelSchema, type FacilityModel } from "../model";
import { loadFluid } from "../thermo";
import type { PlantInputRaw } from "./schema";

/**
 * A synthetic plant for the 200-room benchmark facility: rooms grouped into 20 circuits by
 * temperature class — low-temperature rooms on ammonia two-stage (pumped) and CO2 cascade
 * low stages, the rest on single-stage ammonia (DX) and R449A — two evaporative condensers.
 * Invented for benchmarks, not a real site.
 */
export function generatePlant(rooms: { id: string; setPointC: number }[]): PlantInputRaw {
  const lt = rooms.filter((r) => r.setPointC < -5);
  const mt = rooms.filter((r) => r.setPointC >= -5);
  const nLt = Math.round((20 * lt.length) / rooms.length);
  const nMt = 20 - nLt;
  const circuits: NonNullable<PlantInputRaw["circuits"]> = [];
  const evaporators: NonNullable<PlantInputRaw["evaporators"]> = [];
  for (let k = 0; k < nMt; k++)
    circuits.push({
      id: `mt-${k}`,
      tag: `MT-${k + 1}`,
      refrigerant: k % 4 === 3 ? "R449A" : "R717",
      compressor: { type: "screw", units: 3, standbyUnits: 1 },
      heatRejection: { to: "condenser", condenserId: k % 2 ? "cd-b" : "cd-a" },
    });
  for (let k = 0; k < nLt; k++) {
    const cascade = k % 3 === 2;
    circuits.push({
      id: `lt-${k}`,
      tag: `LT-${k + 1}`,
      refrigerant: cascade ? "R744" : "R717",
      arrangement: cascade ? "single-stage" : "two-stage",
      compressor: { type: cascade ? "reciprocating" : "screw", units: 2, standbyUnits: 1 },
      heatRejection: cascade ? { to: "circuit", circuitId: `mt-${k % nMt}`, condensingC: -5, approachK: 5 } : { to: "condenser", condenserId: "cd-a" },
    });
  }
  mt.forEach((r, i) =>
    evaporators.push({ id: `ev-${r.id}`, tag: `EV-${r.id}`, roomId: r.id, circuitId: `mt-${i % nMt}`, feed: { type: "dx", superheatK: 6 } }),
  );
  lt.forEach((r, i) =>
    evaporators.push({ id: `ev-${r.id}`, tag: `EV-${r.id}`, roomId: r.id, circuitId: `lt-${i % nLt}`, feed: { type: "pumped", circulationRatio: 4 } }),
  );
  return {
    evaporators,
    circuits,
    condensers: [
      { id: "cd-a", tag: "CD-A", type: "evaporative" },
      { id: "cd-b", tag: "CD-B", type: "evaporative" },
    ],
  };
}

export default async function cases(): Promise<BenchCase[]> {
  await Promise.all([loadFluid("R717"), loadFluid("R744"), loadFluid("R449A")]);
  const ledger = generateFacility(200);
  const plant = generatePlant(ledger.rooms.map((r) => ({ id: r.id, setPointC: r.setPointC })));
  const model: FacilityModel = facilityModelSchema.parse({ schemaVersion: 1, ...ledger, plant });
  // The edit: one room's lights, toggled so every call has a changed room to recompute.
  const edited: FacilityModel = {
    ...model,
    rooms: model.rooms.map((r, i) => (i === 17 ? { ...r, lights: { ...r.lights!, wPerM2: 6 } } : r)),
  };
  const engine = createFacilityEngine();
  engine.compute(model);
  let flip = false;
  // As the canvas worker does it: every edit re-parses the document, so no object is shared
  // with the previous call and the memo works from the input hashes alone. The fresh copies
  // are made here, outside the timing: one per call (5 warm-up + 40 samples, batch 1).
  const rawEdited = structuredClone(ledger);
  rawEdited.rooms[17] = { ...rawEdited.rooms[17], lights: { ...rawEdited.rooms[17].lights!, wPerM2: 6 } };
  const editedParsed = facilityModelSchema.parse({ schemaVersion: 1, ...rawEdited, plant });
  const copies = Array.from({ length: 50 }, (_, i) => structuredClone(i % 2 ? model : editedParsed));
  const hashEngine = createFacilityEngine();
  hashEngine.compute(model);
  let next = 0;
  return [
    { name: "plant: 200 rooms + 20 circuits, full recompute (computeFacility)", fn: () => computeFacility(model), targetMedianUs: 5000 },
    {
      name: "plant: 200 rooms + 20 circuits, edit touching one room (incremental)",
      fn: () => engine.compute((flip = !flip) ? edited : model),
      targetMedianUs: 1000,
    },
    {
      name: "plant: edit touching one room, document re-parsed (hash-keyed memo)",
      fn: () => hashEngine.compute(copies[next++ % copies.length]),
      batch: 1,
      samples: 40,
      // Half the full-recompute budget: the edit must cost well under a full recompute.
      targetMedianUs: 2500,
    },
    { name: "plant: validate the facility model (facilityModelSchema.parse)", fn: () => facilityModelSchema.parse({ schemaVersion: 1, ...ledger, plant }) },
  ];
}
