/**
 * Calculation report figures: `loadpath report` of sample building (a) written in memory (the
 * takedown build, the read-back and the HTML), full and `--summary`, with the size of the HTML
 * per member detailed; then the invented frame of about 1,000 members of the takedown benchmarks
 * (test/workbook/takedown-fixtures.ts) written as an .xlsx file and reported in full (issue 13's
 * target: under 10 s). Needs `npm run build`.
 */
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { writeSheets } from "../test/report/helpers";
import { frameOfSize, makeFrame } from "../test/workbook/takedown-fixtures";
import { allMembers, reportOfFile } from "../src/cli/commands/report";
import type { CliIO } from "../src/cli/main";
import { report, timeMs } from "./timing";

const SAMPLE = join(__dirname, "..", "sample-workbooks", "steel-office-us.xlsx");
const quiet: CliIO = { out: () => undefined, err: () => undefined };

export async function run(): Promise<void> {
  await sample();
  const dir = mkdtempSync(join(tmpdir(), "loadpath-report-bench-"));
  try {
    const frame = makeFrame(frameOfSize(1000));
    const file = join(dir, "frame.xlsx");
    await writeSheets(file, frame.sheets);
    let html = "";
    const ms = await timeMs(async () => {
      html = (await reportOfFile(file, { units: "US" }, { date: "2026-12-04" }, quiet)).html ?? "";
    });
    if (html === "") throw new Error("the 1,000-member frame gave no report");
    report(`frame of ${frame.memberCount} members: full report (build, read back, HTML)`, ms, "ms", "under 10,000 ms");
    report(`frame of ${frame.memberCount} members: HTML size per member`, Buffer.byteLength(html) / 1024 / frame.memberCount, "KiB");
    const summaryMs = await timeMs(async () => {
      html = (await reportOfFile(file, { units: "US" }, { date: "2026-12-04", summary: true }, quiet)).html ?? "";
    });
    report(`frame of ${frame.memberCount} members: --summary (build, read back, tables)`, summaryMs, "ms");
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

async function sample(): Promise<void> {
  for (const summary of [false, true]) {
    let html = "";
    let members = 0;
    const ms = await timeMs(async () => {
      const r = await reportOfFile(SAMPLE, { units: "US" }, { date: "2026-12-04", ...(summary ? { summary: true } : {}) }, quiet);
      if (r.html === undefined || r.record === undefined) throw new Error("sample (a) gave no report");
      html = r.html;
      members = allMembers(r.record).length;
    });
    const label = summary ? "sample (a) report --summary" : `sample (a) report, ${members} members detailed`;
    report(`${label}: time (build, read back, HTML)`, ms, "ms");
    report(`${label}: HTML size`, Buffer.byteLength(html) / 1024, "KiB");
    if (!summary) report("  HTML size per member detailed", Buffer.byteLength(html) / 1024 / members, "KiB");
  }
}
