/**
 * Undo/redo as a history of whole documents (cheap: edits share unchanged entities by
 * reference). Typing into one field within `coalesceMs` makes one step, not one per key.
 */
export interface History<T> {
  past: T[];
  present: T;
  future: T[];
  /** Key and time of the last push, to coalesce bursts on the same field. */
  lastKey?: string;
  lastAt?: number;
}

export const HISTORY_LIMIT = 200;

export function initHistory<T>(present: T): History<T> {
  return { past: [], present, future: [] };
}

export function push<T>(h: History<T>, next: T, opts: { key?: string; now?: number; coalesceMs?: number } = {}): History<T> {
  if (next === h.present) return h;
  const now = opts.now ?? Date.now();
  const coalesce = opts.key !== undefined && opts.key === h.lastKey && h.lastAt !== undefined && now - h.lastAt < (opts.coalesceMs ?? 1000);
  const past = coalesce ? h.past : [...h.past, h.present].slice(-HISTORY_LIMIT);
  return { past, present: next, future: [], lastKey: opts.key, lastAt: now };
}

export function undo<T>(h: History<T>): History<T> {
  if (h.past.length === 0) return h;
  return { past: h.past.slice(0, -1), present: h.past[h.past.length - 1], future: [h.present, ...h.future] };
}

export function redo<T>(h: History<T>): History<T> {
  if (h.future.length === 0) return h;
  return { past: [...h.past, h.present], present: h.future[0], future: h.future.slice(1) };
}

/**
 * Replaces the present without an undo step and forgets the steps: used when the document
 * merged by the server (someone else's changes included) is adopted, so that undo can never
 * silently take another person's edit back out.
 */
export function reset<T>(present: T): History<T> {
  return initHistory(present);
}
