/**
 * Tiny benchmark harness for `npm run bench`. A `*.bench.ts` file default-exports a list of
 * cases; the runner times each one and prints the median and p90 per call. Targets are
 * printed beside the figure (met / MISSED) but never fail the run: speed is measured here,
 * not asserted in tests.
 */
export interface BenchCase {
  name: string;
  /** The work to time. Called many times; keep its inputs prepared outside. */
  fn: () => unknown;
  /** Median target in microseconds, printed beside the measurement. */
  targetMedianUs?: number;
  /** Calls per timed sample (for very fast functions); default chosen automatically. */
  batch?: number;
  /** Timed samples to take; default 200. */
  samples?: number;
}

export interface BenchResult {
  name: string;
  medianUs: number;
  p90Us: number;
  samples: number;
  batch: number;
  targetMedianUs?: number;
}

let sink: unknown;

export function runCase(c: BenchCase): BenchResult {
  // Warm up and pick a batch size so one sample takes about 0.2 ms or more.
  let batch = c.batch ?? 1;
  if (c.batch === undefined) {
    for (;;) {
      const t0 = process.hrtime.bigint();
      for (let i = 0; i < batch; i++) sink = c.fn();
      const dt = Number(process.hrtime.bigint() - t0) / 1e3;
      if (dt > 200 || batch >= 1 << 20) break;
      batch *= 2;
    }
  }
  for (let i = 0; i < Math.min(50, 5 * batch); i++) sink = c.fn();
  const samples = c.samples ?? 200;
  const times: number[] = [];
  for (let s = 0; s < samples; s++) {
    const t0 = process.hrtime.bigint();
    for (let i = 0; i < batch; i++) sink = c.fn();
    times.push(Number(process.hrtime.bigint() - t0) / 1e3 / batch);
  }
  times.sort((a, b) => a - b);
  void sink;
  return {
    name: c.name,
    medianUs: times[Math.floor(times.length / 2)],
    p90Us: times[Math.floor(times.length * 0.9)],
    samples,
    batch,
    targetMedianUs: c.targetMedianUs,
  };
}

export function formatResult(r: BenchResult): string {
  const fmt = (us: number) => (us < 1000 ? `${us.toFixed(3)} µs` : `${(us / 1000).toFixed(3)} ms`);
  const target =
    r.targetMedianUs === undefined
      ? ""
      : `  target ≤ ${fmt(r.targetMedianUs)} ${r.medianUs <= r.targetMedianUs ? "met" : "MISSED"}`;
  return `${r.name.padEnd(60)} median ${fmt(r.medianUs).padStart(12)}  p90 ${fmt(r.p90Us).padStart(12)}${target}`;
}
