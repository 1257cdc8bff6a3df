/**
 * The pane's weight and start-up: gzip sizes of the bundles Excel loads (task pane, functions)
 * and of the demo page's bundle, and the time from navigation to an interactive pane (tables
 * found, build button enabled) on the demo page in Debian's Chromium. Needs `npm run build`.
 */
import { existsSync, readFileSync } from "node:fs";
import { join } from "node:path";
import { gzipSync } from "node:zlib";
import { report } from "./timing";
import { DIST, launch, missingPrerequisite, serve } from "../test/browser/harness";

/** Gzip size of a built file in kB (1 kB = 1000 bytes), or NaN when it is missing. */
export function gzipKb(file: string): number {
  const path = join(DIST, file);
  return existsSync(path) ? gzipSync(readFileSync(path), { level: 9 }).length / 1000 : Number.NaN;
}

/** Milliseconds from navigation start to the pane's "ready" mark, one fresh page per run. */
async function interactiveMs(runs: number): Promise<number[]> {
  const server = await serve();
  const browser = await launch(320, 900);
  const out: number[] = [];
  try {
    for (let i = 0; i < runs; i++) {
      const page = await browser.context.newPage();
      await page.goto(`${server.url}pane-demo.html`);
      await page.waitForSelector('[data-testid="build"]:not([disabled])', { timeout: 60_000 });
      out.push(await page.evaluate(() => performance.getEntriesByName("loadpath-pane-ready")[0]?.startTime ?? performance.now()));
      await page.close();
    }
  } finally {
    await browser.close();
    await server.close();
  }
  return out;
}

/** Print the figures. */
export async function run(): Promise<void> {
  report("task pane bundle (dist/taskpane.js), gzip", gzipKb("taskpane.js"), "kB", "< 500 kB");
  report("functions bundle (dist/functions.js), gzip", gzipKb("functions.js"), "kB", "< 150 kB");
  report("demo page bundle (dist/pane-demo.js, with HyperFormula), gzip", gzipKb("pane-demo.js"), "kB");
  const missing = missingPrerequisite();
  if (missing) {
    console.log(`   (pane start-up not measured: ${missing})`);
    return;
  }
  const times = await interactiveMs(5);
  const sorted = [...times].sort((a, b) => a - b);
  report("demo page load to interactive pane, first load (fresh profile)", times[0] ?? Number.NaN, "ms");
  report("demo page load to interactive pane, median of 5", sorted[2] ?? Number.NaN, "ms");
}

if (require.main === module) void run();
