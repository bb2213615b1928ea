/**
 * Three-way merge of JSON documents for concurrent model edits. Arrays whose items all carry
 * a string `id` are merged as maps keyed by id (a room edited by one person and a door added
 * by another both survive); other arrays and scalars are replaced whole. A path changed on
 * both sides to different values is a conflict.
 */
type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

export type MergeResult = { ok: true; merged: Json } | { ok: false; conflicts: string[] };

const isObj = (v: unknown): v is Record<string, Json> => typeof v === "object" && v !== null && !Array.isArray(v);
const isIdArray = (v: unknown): v is { id: string }[] =>
  Array.isArray(v) && v.every((x) => isObj(x) && typeof (x as { id?: unknown }).id === "string");

export function deepEqual(a: unknown, b: unknown): boolean {
  if (a === b) return true;
  if (typeof a !== typeof b || a === null || b === null || typeof a !== "object") return false;
  if (Array.isArray(a) !== Array.isArray(b)) return false;
  if (Array.isArray(a)) {
    const bb = b as unknown[];
    return a.length === bb.length && a.every((x, i) => deepEqual(x, bb[i]));
  }
  const ka = Object.keys(a as object);
  const kb = Object.keys(b as object);
  return ka.length === kb.length && ka.every((k) => deepEqual((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]));
}

function mergeAt(base: Json | undefined, theirs: Json | undefined, mine: Json | undefined, path: string, conflicts: string[]): Json | undefined {
  if (deepEqual(mine, base)) return theirs; // only they changed it (or nobody)
  if (deepEqual(theirs, base)) return mine; // only I changed it
  if (deepEqual(mine, theirs)) return mine; // both made the same change
  if (isObj(base) && isObj(theirs) && isObj(mine)) {
    const out: Record<string, Json> = {};
    for (const k of new Set([...Object.keys(base), ...Object.keys(theirs), ...Object.keys(mine)])) {
      const v = mergeAt(base[k], theirs[k], mine[k], path ? `${path}.${k}` : k, conflicts);
      if (v !== undefined) out[k] = v;
    }
    return out;
  }
  if (isIdArray(base) && isIdArray(theirs) && isIdArray(mine)) {
    const byId = (a: { id: string }[]) => new Map(a.map((x) => [x.id, x as unknown as Json]));
    const b = byId(base);
    const t = byId(theirs);
    const m = byId(mine);
    // Order: theirs first (the stored order), then items only I have, in my order (new ones,
    // or ones they deleted — the latter merge to a conflict if I had changed them).
    const ids = [...theirs.map((x) => x.id), ...mine.map((x) => x.id).filter((id) => !t.has(id))];
    const out: Json[] = [];
    for (const id of ids) {
      const v = mergeAt(b.get(id), t.get(id), m.get(id), `${path}[${id}]`, conflicts);
      if (v !== undefined) out.push(v);
    }
    return out;
  }
  conflicts.push(path || "(document)");
  return mine;
}

/** Merges my edits (base → mine) onto the stored document (base → theirs). */
export function mergeThreeWay(base: unknown, theirs: unknown, mine: unknown): MergeResult {
  const conflicts: string[] = [];
  const merged = mergeAt(base as Json, theirs as Json, mine as Json, "", conflicts);
  return conflicts.length ? { ok: false, conflicts } : { ok: true, merged: merged as Json };
}

/** A stable hash of a JSON value (keys sorted), for "results carry a hash of their inputs". */
export function canonicalJson(v: unknown): string {
  if (Array.isArray(v)) return `[${v.map(canonicalJson).join(",")}]`;
  if (isObj(v)) return `{${Object.keys(v).sort().map((k) => `${JSON.stringify(k)}:${canonicalJson(v[k])}`).join(",")}}`;
  return JSON.stringify(v ?? null);
}
