import { describe, expect, it } from "vitest";
import { z } from "zod";
import { inspectJson, strippedKeys, refuseUnknownKeys } from "./validation";

describe("inspectJson: checks parsed JSON before any schema sees it", () => {
  it("refuses NUL characters in values and keys, naming the field", () => {
    expect(() => inspectJson({ a: [{ name: "x\u0000y" }] })).toThrow(expect.objectContaining({ field: "a.0.name", code: "validation" }));
    expect(() => inspectJson({ "k\u0000": 1 })).toThrow(/NUL/);
  });

  it("refuses nesting deeper than the limit without exhausting the stack", () => {
    const deep = JSON.parse("[".repeat(100_000) + "]".repeat(100_000));
    expect(() => inspectJson({ doc: deep })).toThrow(/nested too deeply: at most 64/);
    let ok: unknown = 1;
    for (let i = 0; i < 63; i++) ok = [ok];
    expect(() => inspectJson(ok)).not.toThrow();
  });

  it("refuses non-finite numbers and prototype keys", () => {
    expect(() => inspectJson({ n: JSON.parse("1e999") })).toThrow(expect.objectContaining({ field: "n" }));
    expect(() => inspectJson(JSON.parse('{"a":{"__proto__":{"admin":true}}}'))).toThrow(expect.objectContaining({ field: "a.__proto__" }));
    expect(() => inspectJson({ b: { constructor: {} } })).toThrow(/not an accepted key/);
  });
});

describe("strippedKeys / refuseUnknownKeys: the keys a schema dropped", () => {
  const schema = z.object({ name: z.string().trim(), rooms: z.array(z.object({ id: z.string() })), tags: z.record(z.string(), z.number()).optional() });
  it("finds unknown keys at any depth, not keys of records or trimmed values", () => {
    const input = { name: " a ", rooms: [{ id: "x" }, { id: "y", colour: "red" }], tags: { free: 1 }, extra: 2 };
    expect(strippedKeys(input, schema.parse(input))).toEqual(["rooms.1.colour", "extra"]);
    expect(() => refuseUnknownKeys(input, schema.parse(input))).toThrow(expect.objectContaining({ field: "rooms.1.colour" }));
    const clean = { name: "a", rooms: [], tags: { free: 1 } };
    expect(strippedKeys(clean, schema.parse(clean))).toEqual([]);
  });
});
