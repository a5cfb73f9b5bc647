// Timing of repeated calls: warm-up first, then percentiles of the measured runs.
import { performance } from "node:perf_hooks";

export type Timing = { p50: number; p95: number; runs: number };

export async function measure(runs: number, fn: (i: number) => Promise<unknown>, warmup = 5): Promise<Timing> {
  for (let i = 0; i < warmup; i++) await fn(-1 - i);
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const start = performance.now();
    await fn(i);
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  const at = (q: number) => times[Math.min(times.length - 1, Math.floor(q * times.length))]!;
  return { p50: round(at(0.5)), p95: round(at(0.95)), runs };
}

const round = (ms: number) => Math.round(ms * 100) / 100;

export type Row = { what: string; handler: Timing; bare: Timing };

export function markdown(rows: Row[]): string {
  const lines = [
    "| what | route handler p50 / p95 (ms) | bare SQL p50 / p95 (ms) | ratio (p50) |",
    "| --- | --- | --- | --- |",
    ...rows.map(
      (r) =>
        `| ${r.what} | ${r.handler.p50} / ${r.handler.p95} | ${r.bare.p50} / ${r.bare.p95} | ${(r.handler.p50 / r.bare.p50).toFixed(1)}× |`,
    ),
  ];
  return lines.join("\n");
}
