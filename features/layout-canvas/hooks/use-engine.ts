"use client";
import { useEffect, useRef, useState } from "react";
import type { SiteConditions } from "@/features/facilities/schema";
import type { Evaluation } from "../evaluate";
import type { CanvasDoc } from "../schema";
import type { EngineRequest, EngineResponse } from "../worker/protocol";

export interface EngineState {
  /** The newest evaluation received (possibly of an older document while `pending`). */
  evaluation: Evaluation | null;
  pending: boolean;
  failure: string | null;
  /** The document the evaluation belongs to. */
  forDoc: CanvasDoc | null;
}

/**
 * Runs the engine in a Web Worker on every change of the document (lightly debounced so a
 * burst of keystrokes costs one computation); the worker computes only the newest request.
 */
export function useEngine(doc: CanvasDoc, site: SiteConditions, debounceMs = 25): EngineState {
  const worker = useRef<Worker | null>(null);
  const seq = useRef(0);
  const sent = useRef(new Map<number, CanvasDoc>());
  const [state, setState] = useState<EngineState>({ evaluation: null, pending: true, failure: null, forDoc: null });

  useEffect(() => {
    const w = new Worker(new URL("../worker/engine.worker.ts", import.meta.url), { type: "module", name: "rimeplan-engine" });
    w.onmessage = (ev: MessageEvent<EngineResponse>) => {
      const latest = ev.data.seq === seq.current;
      const forDoc = sent.current.get(ev.data.seq) ?? null;
      for (const k of sent.current.keys()) if (k <= ev.data.seq) sent.current.delete(k);
      if (ev.data.failure !== undefined) setState((s) => ({ ...s, pending: !latest, failure: ev.data.failure ?? null }));
      else setState({ evaluation: ev.data.evaluation, pending: !latest, failure: null, forDoc });
    };
    w.onerror = (e) => setState((s) => ({ ...s, pending: false, failure: `The calculation worker stopped: ${e.message || "unknown error"}. Reload the page.` }));
    worker.current = w;
    return () => {
      w.terminate();
      worker.current = null;
    };
  }, []);

  useEffect(() => {
    const t = setTimeout(() => {
      seq.current += 1;
      const req: EngineRequest = { seq: seq.current, doc, site };
      sent.current.set(seq.current, doc);
      worker.current?.postMessage(req);
      setState((s) => (s.pending ? s : { ...s, pending: true }));
    }, debounceMs);
    return () => clearTimeout(t);
  }, [doc, site, debounceMs]);

  return state;
}
