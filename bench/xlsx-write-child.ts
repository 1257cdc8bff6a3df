/**
 * One measured run for bench/xlsx-write.bench.ts, in a process of its own so that its peak
 * memory is its own: `node --import tsx -r bench/peak-memory.cjs bench/xlsx-write-child.ts
 * <frame.xlsx> <out.xlsx> <stream|model|none>`. Builds the takedown of the frame workbook as
 * `loadpath takedown` does, then writes the workbook: `stream` the way `loadpath takedown -o` writes
 * it (generated sheets straight into the package), `model` through the ExcelJS model of the whole
 * workbook (the way it was written before issue 16), `none` not at all. Prints one JSON line.
 */
import { takedownOfFile } from "../src/cli/takedown-input";
import { exportSheets } from "../src/workbook/memory-port";
import { cacheResults, writeXlsx } from "../src/workbook/xlsx";

async function main(): Promise<void> {
  const [input, output, mode] = process.argv.slice(2);
  const t0 = performance.now();
  const { workbook, port, result } = await takedownOfFile(input!, { units: "US" });
  if (!result.ok) throw new Error("the frame did not build");
  const t1 = performance.now();
  let streamed = false;
  if (mode === "stream") streamed = (await writeXlsx(workbook, output!, port)).streamed;
  else if (mode === "model") {
    cacheResults(workbook, port.headless);
    exportSheets(port, workbook.excel);
    await writeXlsx(workbook, output!);
  }
  const t2 = performance.now();
  console.log(JSON.stringify({ buildMs: t1 - t0, writeMs: t2 - t1, streamed }));
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
