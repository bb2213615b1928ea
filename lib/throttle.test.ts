import { describe, expect, it } from "vitest";
import { waitSeconds, type Backoff, type Cap } from "./throttle";

const now = 1_000_000_000;
const cap: Cap = { kind: "cap", bucket: "b", key: "k", max: 3, windowSeconds: 600 };
const slow: Backoff = { kind: "backoff", bucket: "b", key: "k", free: 5, windowSeconds: 900, baseSeconds: 30, maxSeconds: 900 };

describe("throttle waits", () => {
  it("a cap allows up to max events in the window, then waits until the oldest that must go has left", () => {
    expect(waitSeconds(cap, { n: 2, latest: now, freeingAt: null }, now)).toBe(0);
    expect(waitSeconds(cap, { n: 3, latest: now, freeingAt: now - 100_000 }, now)).toBe(500);
    expect(waitSeconds(cap, { n: 1, latest: now, freeingAt: now - 599_500 }, now, 3)).toBe(1);
    expect(waitSeconds(cap, { n: 0, latest: null, freeingAt: null }, now, 4)).toBe(600);
  });

  it("a backoff is free for the first events, then doubles from the base up to the maximum", () => {
    expect(waitSeconds(slow, { n: 4, latest: now, freeingAt: null }, now)).toBe(0);
    expect(waitSeconds(slow, { n: 5, latest: now, freeingAt: null }, now)).toBe(30);
    expect(waitSeconds(slow, { n: 6, latest: now, freeingAt: null }, now)).toBe(60);
    expect(waitSeconds(slow, { n: 7, latest: now - 20_000, freeingAt: null }, now)).toBe(100);
    expect(waitSeconds(slow, { n: 40, latest: now, freeingAt: null }, now)).toBe(900);
    expect(waitSeconds(slow, { n: 5, latest: now - 31_000, freeingAt: null }, now)).toBe(0);
  });
});
