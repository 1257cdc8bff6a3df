/**
 * `loadpath demo` (`npm run demo`): recalculates the sample workbooks headless and prints their
 * results. The demo is a list of parts run in order; a new part (e.g. a takedown of a sample
 * building) is appended to {@link DEMO_PARTS}.
 */
import { existsSync, mkdirSync, readFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import type ExcelJS from "exceljs";
import { fixedDecimals } from "../../drawings/format";
import { cacheResults, evaluateWorkbook, problemAddress, readXlsx, writeXlsx } from "../../workbook/xlsx";
import { EXIT, type CliIO, type Command } from "../shared";
import { gravityLoadsPart } from "./demo-gravity-loads";
import { reportDemoPart } from "./report";
import { takedownDemoPart } from "./takedown";

/** What every demo part gets: where the package's files are and where to write. */
export interface DemoContext {
  /** The package root (holds sample-workbooks/). */
  readonly root: string;
  /** A folder for the demo's output files. */
  readonly outDir: string;
}

/** One part of the demo: prints its own section, returns an exit status. */
export interface DemoPart {
  readonly title: string;
  run(io: CliIO, ctx: DemoContext): Promise<number>;
}

/** The review caution printed with every result. */
export const CAUTION = "Caution: results are for review by a qualified engineer; code provisions apply only where the local jurisdiction adopts them, and local codes govern.";

/** The package root: the nearest folder upward holding the loadpath package.json. */
export function packageRoot(start: string = __dirname): string {
  let dir = start;
  for (;;) {
    const pkg = join(dir, "package.json");
    if (existsSync(pkg) && (JSON.parse(readFileSync(pkg, "utf8")) as { name?: string }).name === "loadpath") return dir;
    const up = dirname(dir);
    if (up === dir) return process.cwd();
    dir = up;
  }
}

/** A cell's value as cached: the result of a formula (0 included), else the plain value. */
function cellValue(cell: ExcelJS.Cell): unknown {
  return cell.formula ? cell.result : cell.value;
}

function fmt(v: unknown, digits = 2): string {
  // Round-off is removed first, so two equal results print alike (13.754999999999 and 13.755 as 13.76).
  if (typeof v === "number") return fixedDecimals(v, digits, "-");
  if (v === null || v === undefined || v === "") return "";
  if (typeof v === "object" && v !== null && "error" in v) return String((v as { error: string }).error);
  return String(v);
}

/** Columns of the printed schedule: header, width, how to read a row of the Beams sheet. */
const SCHEDULE_COLUMNS: readonly { readonly header: string; readonly width: number; readonly read: (row: ExcelJS.Row) => string }[] = [
  { header: "Mark", width: 6, read: (r) => fmt(cellValue(r.getCell(1))) },
  { header: "Span ft", width: 7, read: (r) => fmt(cellValue(r.getCell(2)), 1) },
  { header: "Reactions kip", width: 20, read: (r) => [6, 7, 8].map((c) => fmt(cellValue(r.getCell(c)))).filter((s) => s !== "").join(" / ") },
  { header: "Mmax k-ft", width: 9, read: (r) => fmt(cellValue(r.getCell(9))) },
  { header: "Mmin k-ft", width: 9, read: (r) => fmt(cellValue(r.getCell(10))) },
  { header: "Vmax kip", width: 8, read: (r) => fmt(cellValue(r.getCell(11))) },
  { header: "Defl in", width: 7, read: (r) => fmt(cellValue(r.getCell(12)), 3) },
  { header: "L/defl", width: 7, read: (r) => (typeof cellValue(r.getCell(13)) === "number" ? `L/${Math.round(cellValue(r.getCell(13)) as number)}` : "") },
  { header: "Limit", width: 6, read: (r) => `L/${fmt(cellValue(r.getCell(5)), 0)}` },
  { header: "I req in4", width: 9, read: (r) => fmt(cellValue(r.getCell(14)), 0) },
  { header: "Check", width: 6, read: (r) => fmt(cellValue(r.getCell(15))) },
];

/** Lines of a fixed-width table from the Beams sheet rows that have a mark. */
export function scheduleTable(ws: ExcelJS.Worksheet): string[] {
  const line = (cells: readonly string[]): string => cells.map((c, i) => (i < 2 ? c.padEnd(SCHEDULE_COLUMNS[i]!.width) : c.padStart(SCHEDULE_COLUMNS[i]!.width))).join("  ");
  const lines = [line(SCHEDULE_COLUMNS.map((c) => c.header)), line(SCHEDULE_COLUMNS.map((c) => "-".repeat(c.width)))];
  ws.eachRow((row, n) => {
    if (n === 1 || typeof cellValue(row.getCell(2)) !== "number") return;
    lines.push(line(SCHEDULE_COLUMNS.map((c) => c.read(row))));
  });
  return lines;
}

/** Part 1: the beam schedule sample, recalculated headless. */
export const beamSchedulePart: DemoPart = {
  title: "Beam schedule (sample-workbooks/beam-schedule.xlsx, invented members, kip-ft units)",
  async run(io, ctx) {
    const input = join(ctx.root, "sample-workbooks", "beam-schedule.xlsx");
    const wb = await readXlsx(input);
    const summary = cacheResults(wb, await evaluateWorkbook(wb));
    const output = join(ctx.outDir, "beam-schedule.xlsx");
    await writeXlsx(wb, output);
    for (const line of scheduleTable(wb.excel.getWorksheet("Beams")!)) io.out(line);
    for (const p of summary.problems) io.err(`${problemAddress(p)}: ${p.code} ${p.message}`);
    io.out("");
    io.out(`${summary.loadpathCount} LOADPATH formulas recalculated headless, ${summary.problems.length} errors; recalculated workbook: ${output}`);
    return summary.problems.some((p) => p.loadpath) ? EXIT.failed : EXIT.ok;
  },
};

/** The demo's parts, in order. */
export const DEMO_PARTS: DemoPart[] = [beamSchedulePart, gravityLoadsPart, takedownDemoPart, reportDemoPart];

const demo: Command = {
  summary: "recalculate the sample workbooks and print their results",
  usage: "Usage: loadpath demo\n\nRecalculates the sample workbooks headless (no Excel needed) and prints their results.",
  async run(_args, io) {
    const ctx: DemoContext = { root: packageRoot(), outDir: join(tmpdir(), "loadpath-demo") };
    mkdirSync(ctx.outDir, { recursive: true });
    let status: number = EXIT.ok;
    for (const part of DEMO_PARTS) {
      io.out("");
      io.out(`== ${part.title}`);
      io.out("");
      status = Math.max(status, await part.run(io, ctx));
    }
    io.out("");
    io.out(CAUTION);
    return status;
  },
};

export default demo;
