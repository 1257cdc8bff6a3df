/**
 * Writing a takedown to .xlsx (issue 16, item 3): invented frames of about 1,000, 5,000 and
 * 20,000 members, written the way `loadpath takedown -o` writes them (the generated sheet streamed
 * straight into the input's package) and, for comparison, through the ExcelJS model of the whole
 * workbook (the way it was written before). Each run is a fresh Node process
 * (bench/xlsx-write-child.ts) that builds the takedown and then writes it, so its peak resident
 * memory is its own; a run that builds without writing gives the peak of the build alone.
 * Target (issue 16): 20,000 members written to .xlsx in under 6 s; memory under 1 GB.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { writeFrameWorkbook } from "./memory.bench";
import { report } from "./timing";

const SIZES = [1000, 5000, 20000] as const;
const MODES = ["none", "stream", "model"] as const;

interface Run {
  readonly buildMs: number;
  readonly writeMs: number;
  readonly streamed: boolean;
  readonly peakRssMb: number;
}

function measure(input: string, output: string, mode: (typeof MODES)[number]): Run {
  const r = spawnSync(process.execPath, ["--import", "tsx", "-r", join(__dirname, "peak-memory.cjs"), join(__dirname, "xlsx-write-child.ts"), input, output, mode], { encoding: "utf8", maxBuffer: 1 << 26 });
  const line = (r.stdout ?? "").split("\n").find((l) => l.startsWith("{"));
  const peak = /loadpath-peak rss=(\d+)/.exec(r.stderr ?? "");
  if (r.status !== 0 || !line || !peak) throw new Error(`the ${mode} run on ${input} failed (${r.status ?? r.signal}): ${(r.stderr ?? "").slice(0, 400)}`);
  return { ...(JSON.parse(line) as Omit<Run, "peakRssMb">), peakRssMb: Number(peak[1]) / 1e6 };
}

export async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), "loadpath-xlsx-write-"));
  try {
    for (const size of SIZES) {
      const input = join(dir, `frame-${size}.xlsx`);
      const members = (await writeFrameWorkbook(size, input)).toLocaleString("en-US");
      const runs = Object.fromEntries(MODES.map((m) => [m, measure(input, join(dir, `out-${size}-${m}.xlsx`), m)])) as Record<(typeof MODES)[number], Run>;
      if (!runs.stream.streamed) console.log("   (the stream run fell back to the ExcelJS model)");
      report(`${members} members: build (as loadpath takedown), no write`, runs.none.buildMs, "ms");
      report(`  peak resident memory, build only`, runs.none.peakRssMb, "MB");
      report(`  written, streamed into the package`, runs.stream.writeMs, "ms", size >= 20000 ? "< 6,000 ms" : undefined);
      report(`  peak resident memory, build + streamed write`, runs.stream.peakRssMb, "MB", size >= 20000 ? "< 1,000 MB" : undefined);
      report(`  .xlsx size, streamed`, statSync(join(dir, `out-${size}-stream.xlsx`)).size / 1e6, "MB");
      report(`  written through the ExcelJS model (before)`, runs.model.writeMs, "ms");
      report(`  peak resident memory, build + ExcelJS model write`, runs.model.peakRssMb, "MB");
      report(`  .xlsx size, ExcelJS model`, statSync(join(dir, `out-${size}-model.xlsx`)).size / 1e6, "MB");
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
