"use client";
import { useCallback, useEffect, useRef, useState } from "react";
import { api, ApiError } from "@/lib/api-client";
import type { CanvasDoc } from "../schema";
import { FACILITY_VERSION_EVENT } from "@/features/facilities/components/facility-version";

export type SaveStatus = "saved" | "pending" | "saving" | "blocked" | "conflict" | "error" | "readonly";

export interface SaveState {
  status: SaveStatus;
  version: number;
  message: string | null;
  conflict: { conflicts: string[]; current: { version: number; doc: CanvasDoc } } | null;
}

interface SaveResponse {
  version: number;
  doc: CanvasDoc;
  rebased: boolean;
}

/**
 * Autosave of the model document through PUT …/model with the version it was based on.
 * The server merges edits that do not overlap with someone else's (then the merged document
 * is adopted when nothing was typed meanwhile); overlapping edits come back as a conflict
 * that the user resolves — nothing is overwritten without being asked.
 */
export function useAutosave(opts: {
  url: string;
  doc: CanvasDoc;
  /** Whether the current document may be saved; null while it is still being checked. */
  saveable: boolean | null;
  canEdit: boolean;
  initial: { version: number; doc: CanvasDoc };
  /** Replace the editor's document with one from the server (merged, or theirs on reload). */
  adopt: (doc: CanvasDoc) => void;
  delayMs?: number;
}): SaveState & { resolveReload: () => void; resolveKeepMine: () => void; saveNow: () => void } {
  const { url, doc, saveable, canEdit, adopt } = opts;
  const delay = opts.delayMs ?? 700;
  const base = useRef(opts.initial);
  const latest = useRef(doc);
  latest.current = doc;
  const saveableRef = useRef(saveable);
  saveableRef.current = saveable;
  const inFlight = useRef(false);
  const [state, setState] = useState<SaveState>({ status: canEdit ? "saved" : "readonly", version: opts.initial.version, message: null, conflict: null });
  const stateRef = useRef(state);
  stateRef.current = state;

  const again = useRef(false);
  const saveRef = useRef<() => Promise<void>>(async () => {});
  const save = useCallback(async () => {
    if (!canEdit) return;
    if (inFlight.current) {
      // A change arrived while a save was on its way: save again once it is back.
      again.current = true;
      return;
    }
    const sent = latest.current;
    if (sent === base.current.doc) return;
    inFlight.current = true;
    let conflicted = false;
    setState((s) => ({ ...s, status: "saving", message: null }));
    try {
      const r = await api<SaveResponse>(url, { method: "PUT", json: { baseVersion: base.current.version, doc: sent, summary: "Canvas edit" } });
      if (!r.rebased) base.current = { version: r.version, doc: sent };
      else if (latest.current === sent) {
        base.current = { version: r.version, doc: r.doc };
        adopt(r.doc);
      }
      // Rebased while more was typed: keep the old base, so the next save is merged again.
      const more = latest.current !== base.current.doc;
      setState({ status: more ? "pending" : "saved", version: r.version, message: r.rebased ? "Merged with changes saved by someone else." : null, conflict: null });
      // The facility header shows the current version; tell it (it is rendered by the server).
      window.dispatchEvent(new CustomEvent(FACILITY_VERSION_EVENT, { detail: { url, version: r.version } }));
    } catch (e) {
      if (e instanceof ApiError && e.status === 409) {
        conflicted = true;
        const body = (e.body as { error?: { conflicts?: string[]; current?: { version: number; doc: CanvasDoc } } })?.error;
        setState((s) => ({ ...s, status: "conflict", message: e.message, conflict: body?.current ? { conflicts: body.conflicts ?? [], current: body.current } : null }));
      } else {
        setState((s) => ({ ...s, status: "error", message: e instanceof Error ? e.message : "Not saved." }));
      }
    } finally {
      inFlight.current = false;
      if (again.current) {
        again.current = false;
        if (!conflicted && saveableRef.current) setTimeout(() => void saveRef.current(), 0);
      }
    }
  }, [url, canEdit, adopt]);
  saveRef.current = save;

  // Debounced save after each change (and again when a save finished with more to send).
  useEffect(() => {
    if (!canEdit) return;
    if (doc === base.current.doc) return;
    if (stateRef.current.status === "conflict") return;
    if (saveable === null) {
      setState((s) => (s.status === "saving" || s.status === "pending" ? s : { ...s, status: "pending" }));
      return;
    }
    if (!saveable) {
      setState((s) => ({ ...s, status: "blocked", message: null }));
      return;
    }
    setState((s) => (s.status === "saving" ? s : { ...s, status: "pending" }));
    const t = setTimeout(() => void save(), delay);
    return () => clearTimeout(t);
  }, [doc, saveable, canEdit, save, delay, state.version]);

  // After an error, retry a few seconds later.
  useEffect(() => {
    if (state.status !== "error" || !saveable) return;
    const t = setTimeout(() => void save(), 5000);
    return () => clearTimeout(t);
  }, [state.status, saveable, save]);

  useEffect(() => {
    const warn = (e: BeforeUnloadEvent) => {
      if (canEdit && latest.current !== base.current.doc) e.preventDefault();
    };
    window.addEventListener("beforeunload", warn);
    return () => window.removeEventListener("beforeunload", warn);
  }, [canEdit]);

  const resolveReload = useCallback(() => {
    const c = stateRef.current.conflict;
    if (!c) return;
    base.current = { version: c.current.version, doc: c.current.doc };
    adopt(c.current.doc);
    setState({ status: "saved", version: c.current.version, message: `Loaded version ${c.current.version}.`, conflict: null });
  }, [adopt]);

  const resolveKeepMine = useCallback(() => {
    const c = stateRef.current.conflict;
    if (!c) return;
    // Saving on top of the current version on purpose: the user has seen the conflict.
    base.current = { version: c.current.version, doc: c.current.doc };
    setState({ status: "pending", version: c.current.version, message: null, conflict: null });
    void save();
  }, [save]);

  return { ...state, resolveReload, resolveKeepMine, saveNow: () => void save() };
}
