/// <reference lib="webworker" />
/**
 * The browser's copy of the engine: the same `lib/engine` the API computes with, run off the
 * main thread so typing never waits for a recompute. Only the newest request is computed
 * (older ones still queued are dropped), and only the fluids the model uses are loaded.
 */
import { createFacilityEngine } from "@/lib/engine/model";
import { loadFluid } from "@/lib/engine/thermo";
import { evaluate } from "../evaluate";
import type { EngineRequest, EngineResponse } from "./protocol";

const engine = createFacilityEngine();
let next: EngineRequest | null = null;
let busy = false;

async function drain() {
  busy = true;
  while (next) {
    const req = next;
    next = null;
    let res: EngineResponse;
    try {
      res = { seq: req.seq, evaluation: await evaluate(req.doc, req.site, engine, loadFluid) };
    } catch (e) {
      res = { seq: req.seq, failure: e instanceof Error ? e.message : String(e) };
    }
    (self as unknown as DedicatedWorkerGlobalScope).postMessage(res);
  }
  busy = false;
}

self.onmessage = (ev: MessageEvent<EngineRequest>) => {
  next = ev.data;
  if (!busy) void drain();
};
