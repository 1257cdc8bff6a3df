/**
 * Preloaded (`node -r bench/peak-memory.cjs ...`) into a child process by bench/memory.bench.ts:
 * samples the JavaScript heap every 20 ms and, when the process exits, prints one line on stderr
 * `loadpath-peak rss=<bytes> heap=<bytes>` (the resident set's high-water mark from the kernel, the
 * largest heap in use seen by the sampler).
 */
"use strict";
let heapPeak = 0;
const sample = () => {
  const h = process.memoryUsage().heapUsed;
  if (h > heapPeak) heapPeak = h;
};
setInterval(sample, 20).unref();
process.on("exit", () => {
  sample();
  process.stderr.write(`loadpath-peak rss=${process.resourceUsage().maxRSS * 1024} heap=${heapPeak}\n`);
});
