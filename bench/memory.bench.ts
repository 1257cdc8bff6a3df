/**
 * Peak memory of `loadpath takedown <frame>.xlsx` (check only, no -o) on invented frames of about
 * 1,000, 10,000, 40,000 and 100,000 members, each in a fresh Node process with the default heap,
 * as a user runs it: the resident set's high-water mark, the largest JavaScript heap in use, the
 * wall time, and the exit status with the first line of what the command said. A run that stops
 * on a size limit is reported with its message; figures are printed, never asserted.
 * Needs `npm run build` (the command runs from dist/cli.js).
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import ExcelJS from "exceljs";
import { frameOfSize, makeFrame } from "../test/workbook/takedown-fixtures";
import { report } from "./timing";

const SIZES = [1000, 10000, 40000, 100000] as const;
const ROOT = resolve(__dirname, "..");

/** The frame's Zones and Members sheets written as an .xlsx file. */
export async function writeFrameWorkbook(members: number, path: string): Promise<number> {
  const frame = makeFrame(frameOfSize(members));
  const wb = new ExcelJS.Workbook();
  for (const [name, rows] of Object.entries(frame.sheets)) {
    const ws = wb.addWorksheet(name);
    for (const row of rows) ws.addRow(row.map((c) => (c === null ? null : c)));
  }
  await wb.xlsx.writeFile(path);
  return frame.memberCount;
}

export async function run(): Promise<void> {
  const dir = mkdtempSync(join(tmpdir(), "loadpath-memory-"));
  try {
    for (const size of SIZES) {
      const file = join(dir, `frame-${size}.xlsx`);
      const count = await writeFrameWorkbook(size, file);
      const t0 = performance.now();
      const r = spawnSync(process.execPath, ["-r", join(__dirname, "peak-memory.cjs"), join(ROOT, "bin", "loadpath.js"), "takedown", file], { encoding: "utf8", maxBuffer: 1 << 28 });
      const ms = performance.now() - t0;
      const peak = /loadpath-peak rss=(\d+) heap=(\d+)/.exec(r.stderr ?? "");
      const said = `${r.stdout ?? ""}\n${r.stderr ?? ""}`.split("\n").find((l) => l.trim() !== "" && !l.startsWith("loadpath-peak")) ?? "";
      const n = count.toLocaleString("en-US");
      report(`takedown of ${n} members (${(statSync(file).size / 1e6).toFixed(1)} MB .xlsx): wall time`, ms, "ms");
      if (peak) {
        report(`  peak resident memory`, Number(peak[1]) / 1e6, "MB");
        report(`  peak JavaScript heap in use`, Number(peak[2]) / 1e6, "MB");
      } else console.log("   peak memory not recorded: the process was killed before it could print it");
      console.log(`   exit status ${r.status ?? r.signal}: ${said.slice(0, 160)}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
