/**
 * Takedown builder throughput, headless: building and writing the takedown of invented
 * multi-storey frames of about 1,000, 5,000 and 20,000 members through the HyperFormula adapter of
 * the workbook port (read the tables, check, order, plan, write, calculate, read the results
 * back), and the recalculation after one zone load is edited in the largest workbook.
 * Every beam and girder carries the governing values over the live load patterns (LOADPATH.GOVERNING,
 * issue 11); a second run of 1,000 and 5,000 members adds the E and I columns (LOADPATH.DEFLECTION_CHECK).
 * Targets (issue 4): 20,000 members built and written in under 5 s; one zone change
 * recalculated in under 1 s; time growing no faster than linearly with the member count.
 *
 * Each build is broken into phases: the engine's plan (tables -> checked, ordered sheet plan),
 * queueing the plan's blocks in the port, the spreadsheet engine's build (parsing every formula
 * and building the dependency graph, then ordering it), its first evaluation (every formula,
 * LOADPATH functions included), reading the results back, and, beside the target, copying the
 * generated sheet into an .xlsx file in memory (what `loadpath takedown -o` adds). The engine's
 * own phase times come from its statistics (`useStats`). The process CPU time is printed beside
 * the wall time: on a machine shared with other work the wall time is the larger.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import ExcelJS from "exceljs";
import { HyperFormula, type RawCellContent } from "hyperformula";
import { planTakedown } from "../src/engine/takedown";
import { HEADLESS_CONFIG } from "../src/workbook/headless";
import { exportSheets, MemoryWorkbookPort, SHEET_LIMITS } from "../src/workbook/memory-port";
import { buildTakedown } from "../src/workbook/takedown-build";
import { frameOfSize, makeFrame } from "../test/workbook/takedown-fixtures";
import { report, timeMs } from "./timing";

const SIZES = [1000, 5000, 20000] as const;

/** Phase times of one build (ms). */
interface Phases {
  readonly totalMs: number;
  readonly cpuMs: number;
  readonly readTablesMs: number;
  readonly planMs: number;
  readonly queueMs: number;
  readonly flushMs: number;
  /** Spreadsheet engine: parsing the formulas and building the dependency graph. */
  readonly parseAndGraphMs: number;
  /** Spreadsheet engine: ordering the dependency graph. */
  readonly sortMs: number;
  /** Spreadsheet engine: evaluating every formula once. */
  readonly evaluateMs: number;
  readonly readBackMs: number;
  /** JavaScript heap in use after the build (the engine's graph of every cell dominates it). */
  readonly heapMb: number;
}

interface Built {
  readonly port: MemoryWorkbookPort;
  readonly phases: Phases;
  readonly members: number;
  readonly zone: string;
  readonly levels: number;
}

/** Milliseconds of process CPU time (all threads) since `start`. */
function cpuMsSince(start: NodeJS.CpuUsage): number {
  const d = process.cpuUsage(start);
  return (d.user + d.system) / 1000;
}

async function buildOnce(size: number, deflection = false): Promise<Built> {
  const shape = { ...frameOfSize(size), deflection };
  const frame = makeFrame(shape);
  const port = await MemoryWorkbookPort.create({ sheets: frame.sheets, config: { useStats: true } });
  const marks: Record<string, number> = {};
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const result = await buildTakedown(port, { zones: "Zones", members: "Members", units: "US" }, (_f, message) => {
    const key = message.startsWith("Writing") ? "Writing" : message;
    marks[key] ??= performance.now();
  });
  const t1 = performance.now();
  const cpuMs = cpuMsSince(cpu0);
  if (!result.ok || result.problems.length > 0) throw new Error(`the ${size}-member frame did not build: ${result.problems[0]?.message ?? "not ok"}`);
  const at = (key: string, fallback: number): number => marks[key] ?? fallback;
  const planStart = at("Checking the load path", t0);
  const planEnd = at("Preparing the sheet", planStart);
  const flushStart = at("Calculating", planEnd);
  const readStart = at("Reading the results", t1);
  const stats = port.hf.getStats();
  const stat = (name: string): number => stats.get(name as never) ?? 0;
  return {
    port,
    members: frame.memberCount,
    zone: frame.zoneOfLevel.L5!,
    levels: shape.levels,
    phases: {
      totalMs: t1 - t0,
      cpuMs,
      readTablesMs: planStart - t0,
      planMs: planEnd - planStart,
      queueMs: flushStart - planEnd,
      flushMs: readStart - flushStart,
      parseAndGraphMs: stat("GRAPH_BUILD"),
      sortMs: stat("TOP_SORT"),
      evaluateMs: stat("EVALUATION"),
      readBackMs: t1 - readStart,
      heapMb: process.memoryUsage().heapUsed / 1e6,
    },
  };
}

/** Row of a zone in the Zones sheet (1-based), found by its name in column A. */
function zoneRow(port: MemoryWorkbookPort, zone: string): number {
  const values = port.hf.getSheetValues(port.hf.getSheetId("Zones")!);
  return values.findIndex((r) => r[0] === zone) + 1;
}

/** Engine-only time (tables -> plan), without the spreadsheet engine. */
function planOnlyMs(size: number): number {
  const frame = makeFrame(frameOfSize(size));
  const t = (rows: unknown[][], sheet: string) => ({ sheet, top: 0, left: 0, values: rows as never });
  const t0 = performance.now();
  planTakedown({ zones: t(frame.sheets.Zones!, "Zones"), members: t(frame.sheets.Members!, "Members"), units: "US", sheet: "Takedown", title: "bench" });
  return performance.now() - t0;
}

/** The generated sheet copied into an .xlsx file in memory (formulas with cached values). */
async function exportMs(port: MemoryWorkbookPort): Promise<number> {
  return timeMs(async () => {
    const excel = new ExcelJS.Workbook();
    exportSheets(port, excel);
    await excel.xlsx.writeBuffer();
  });
}

/**
 * The spreadsheet engine alone on the same workbook with every add-in call replaced by SUM of the
 * same arguments: the time no change to the functions, the plan or the read-back can go below
 * while the sheet has this many cells.
 */
function engineFloorMs(port: MemoryWorkbookPort): number {
  const hf = port.hf;
  const sheets: Record<string, RawCellContent[][]> = {};
  for (const name of hf.getSheetNames()) {
    sheets[name] = hf.getSheetSerialized(hf.getSheetId(name)!).map((row) =>
      row.map((c) => (typeof c === "string" && c.startsWith("=") ? c.replace(/\bLOADPATH\.[A-Z_]+\(/g, "SUM(") : c)),
    );
  }
  const t0 = performance.now();
  const floor = HyperFormula.buildFromSheets(sheets, { ...HEADLESS_CONFIG, ...SHEET_LIMITS });
  const ms = performance.now() - t0;
  floor.destroy();
  return ms;
}

/** Number of non-blank cells and of formulas of the generated sheet. */
function cellCounts(port: MemoryWorkbookPort): { cells: number; formulas: number } {
  let cells = 0;
  let formulas = 0;
  for (const row of port.hf.getSheetSerialized(port.hf.getSheetId("Takedown")!)) {
    for (const c of row) {
      if (c === null || c === undefined || c === "") continue;
      cells++;
      if (typeof c === "string" && c.startsWith("=")) formulas++;
    }
  }
  return { cells, formulas };
}

function reportPhases(built: Built): void {
  const p = built.phases;
  const n = built.members;
  report(`takedown of ${n.toLocaleString("en-US")} members: built, written, calculated`, p.totalMs, "ms", n >= 20000 ? "< 5,000 ms" : undefined);
  report(`  process CPU time meanwhile (all threads)`, p.cpuMs, "ms");
  report(`  reading the tables through the port`, p.readTablesMs, "ms");
  report(`  build plan: tables -> checked, ordered sheet plan (engine)`, p.planMs, "ms");
  report(`  write: plan queued in the port in blocks`, p.queueMs, "ms");
  report(`  calculate: spreadsheet engine built from the sheets`, p.flushMs, "ms");
  report(`    of which parsing formulas + dependency graph`, p.parseAndGraphMs, "ms");
  report(`    of which ordering the dependency graph`, p.sortMs, "ms");
  report(`    of which evaluating every formula`, p.evaluateMs, "ms");
  report(`  read back: results read from the sheet, JSON`, p.readBackMs, "ms");
  report(`  per member`, p.totalMs / n, "ms");
  report(`  JavaScript heap in use after the build`, p.heapMb, "MB");
}

export async function run(): Promise<void> {
  // Warm-up: load the functions bundle and let the JIT see every path (a 300-member warm-up left
  // the 1,000-member figure twice the per-member time of the larger ones).
  (await buildOnce(300)).port.hf.destroy();
  (await buildOnce(1000)).port.hf.destroy();
  planOnlyMs(1000);
  const perMember: number[] = [];
  let largest: Built | null = null;
  for (const size of SIZES) {
    const built = await buildOnce(size);
    reportPhases(built);
    perMember.push(built.phases.totalMs / built.members);
    if (size === SIZES[SIZES.length - 1]) largest = built;
    else built.port.hf.destroy();
  }
  // Members with E and I (issue 11): the deflection check's six columns beside the governing values.
  for (const size of [1000, 5000] as const) {
    const built = await buildOnce(size, true);
    report(`takedown of ${built.members.toLocaleString("en-US")} members with E and I columns (deflection check): built, written, calculated`, built.phases.totalMs, "ms");
    report(`  process CPU time meanwhile (all threads)`, built.phases.cpuMs, "ms");
    report(`  of which evaluating every formula`, built.phases.evaluateMs, "ms");
    built.port.hf.destroy();
  }
  report("plan only (engine, no spreadsheet engine), 20,000 members", planOnlyMs(20000), "ms");
  const growth = perMember[perMember.length - 1]! / perMember[0]!;
  report("time per member, 20,000 / 1,000 members", growth, "x", "<= 1 (linear)");
  if (largest) {
    const row = zoneRow(largest.port, largest.zone);
    const cell = `B${row}`;
    const before = largest.port.value("Zones", cell) as number;
    const ms = await timeMs(() => largest!.port.setCell("Zones", cell, before + 10));
    report(`recalculation after one zone change (${largest.zone} D: one floor of ${largest.levels - 1})`, ms, "ms", "< 1,000 ms");
    const counts = cellCounts(largest.port);
    report(`generated sheet of ${largest.members.toLocaleString("en-US")} members: cells, of which formulas`, counts.cells, "cells");
    report(`  formulas`, counts.formulas, "formulas");
    report(`spreadsheet engine alone, add-in calls replaced by SUM (floor)`, engineFloorMs(largest.port), "ms");
    report(`generated sheet written to .xlsx in memory, ${largest.members.toLocaleString("en-US")} members`, await exportMs(largest.port), "ms");
  }
}
