/** Shared timing helpers for the benchmarks: warm up, then repeat until enough time has passed. */

/** Operations per second of `fn`, measured over at least `minMs` after a warm-up. */
export function opsPerSecond(fn: () => unknown, minMs = 1000): number {
  for (let i = 0; i < 2000; i++) fn();
  let n = 0;
  const t0 = performance.now();
  let t = t0;
  while (t - t0 < minMs) {
    for (let i = 0; i < 1000; i++) fn();
    n += 1000;
    t = performance.now();
  }
  return (n * 1000) / (t - t0);
}

/** Milliseconds taken by one call of an async function. */
export async function timeMs(fn: () => Promise<unknown> | unknown): Promise<number> {
  const t0 = performance.now();
  await fn();
  return performance.now() - t0;
}

/** A figure line: name, value, unit and the target it is measured against. */
export function report(name: string, value: number, unit: string, target?: string): void {
  const v = value >= 100 ? Math.round(value).toLocaleString("en-US") : value.toFixed(3);
  console.log(`   ${name.padEnd(58)} ${v.padStart(14)} ${unit}${target ? `   (target ${target})` : ""}`);
}
