/**
 * Takedown builder throughput, headless: building and writing the takedown of invented
 * multi-storey frames of about 1,000, 5,000 and 20,000 members through the HyperFormula adapter of
 * the workbook port (read the tables, check, order, plan, write, calculate, read the results
 * back), and the recalculation after one zone load is edited in the largest workbook.
 * Targets (issue 4): 20,000 members built and written in under 5 s; one zone change
 * recalculated in under 1 s; time growing no faster than linearly with the member count.
 * Needs `npm run build` (the headless engine loads the built functions bundle).
 */
import { planTakedown } from "../src/engine/takedown";
import { MemoryWorkbookPort } from "../src/workbook/memory-port";
import { buildTakedown } from "../src/workbook/takedown-build";
import { frameOfSize, makeFrame } from "../test/workbook/takedown-fixtures";
import { report, timeMs } from "./timing";

const SIZES = [1000, 5000, 20000] as const;

/** Phase times of one build, from the progress messages. */
interface Phases {
  readonly totalMs: number;
  readonly planMs: number;
  readonly writeAndCalculateMs: number;
  readonly readBackMs: number;
}

async function buildOnce(size: number): Promise<{ port: MemoryWorkbookPort; phases: Phases; members: number; zone: string; levels: number }> {
  const shape = frameOfSize(size);
  const frame = makeFrame(shape);
  const port = await MemoryWorkbookPort.create({ sheets: frame.sheets });
  const marks: Record<string, number> = {};
  const t0 = performance.now();
  const result = await buildTakedown(port, { zones: "Zones", members: "Members", units: "US" }, (_f, message) => {
    const key = message.startsWith("Writing") ? "Writing" : message;
    marks[key] ??= performance.now();
  });
  const t1 = performance.now();
  if (!result.ok || result.problems.length > 0) throw new Error(`the ${size}-member frame did not build: ${result.problems[0]?.message ?? "not ok"}`);
  const planStart = marks["Checking the load path"] ?? t0;
  const planEnd = marks["Preparing the sheet"] ?? planStart;
  const calcStart = planEnd;
  const readStart = marks["Reading the results"] ?? t1;
  return {
    port,
    members: frame.memberCount,
    zone: frame.zoneOfLevel.L5!,
    levels: shape.levels,
    phases: { totalMs: t1 - t0, planMs: planEnd - planStart, writeAndCalculateMs: readStart - calcStart, readBackMs: t1 - readStart },
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

export async function run(): Promise<void> {
  // Warm-up: load the functions bundle and let the JIT see every path once.
  await buildOnce(300);
  planOnlyMs(1000);
  const perMember: number[] = [];
  let largest: Awaited<ReturnType<typeof buildOnce>> | null = null;
  for (const size of SIZES) {
    const built = await buildOnce(size);
    const p = built.phases;
    report(`takedown of ${built.members.toLocaleString("en-US")} members: built, written, calculated`, p.totalMs, "ms", size === 20000 ? "< 5,000 ms" : undefined);
    report(`  of which tables -> checked, ordered sheet plan (engine)`, p.planMs, "ms");
    report(`  of which writing and calculating in the headless engine`, p.writeAndCalculateMs, "ms");
    report(`  of which reading the results back`, p.readBackMs, "ms");
    report(`  per member`, p.totalMs / built.members, "ms");
    perMember.push(p.totalMs / built.members);
    if (size === 20000) largest = built;
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
  }
}
