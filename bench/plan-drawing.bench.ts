/**
 * Plan drawing speed (issue 13): one level of an invented plan of 513 members (10 x 6 bays of
 * 30 ft x 24 ft: 77 columns, 66 girders, 370 beams, one one-way deck per bay) drawn as SVG, with
 * and without a selected member. Target: under 200 ms per level. The derivation is timed apart
 * (bench/framing.bench.ts); here only the drawing. Median of several runs after a warm-up.
 */
import { derive, readPlan } from "../src/engine/framing";
import type { CellValue, TableData } from "../src/engine/takedown/types";
import { renderFramingPlan } from "../src/drawings/plan";
import { loadavg } from "node:os";
import { report } from "./timing";

function tables(): { framing: TableData; decks: TableData; grids: TableData; levels: TableData } {
  const f: CellValue[][] = [["Mark", "Type", "Level", "X1", "Y1", "X2", "Y2"]];
  const d: CellValue[][] = [["Area", "Level", "Kind", "Zone", "Span", "X1", "Y1", "X2", "Y2"]];
  const g: CellValue[][] = [["Grid", "X", "Y"]];
  for (let i = 0; i <= 10; i++) g.push([`X${i}`, i * 30, null]);
  for (let j = 0; j <= 6; j++) g.push([`Y${j}`, null, j * 24]);
  for (let i = 0; i <= 10; i++) for (let j = 0; j <= 6; j++) f.push([`C${i}.${j}`, "column", "L1", `X${i}`, `Y${j}`]);
  for (let i = 0; i <= 10; i++) for (let j = 0; j < 6; j++) f.push([`G${i}.${j}`, "girder", "L1", `X${i}`, `Y${j}`, `X${i}`, `Y${j + 1}`]);
  for (let i = 0; i < 10; i++) {
    for (let j = 0; j <= 6; j++) f.push([`E${i}.${j}`, "beam", "L1", `X${i}`, `Y${j}`, `X${i + 1}`, `Y${j}`]);
    for (let j = 0; j < 6; j++) {
      for (let k = 1; k <= 5; k++) f.push([`B${i}.${j}.${k}`, "beam", "L1", `X${i}`, `Y${j}+${k * 4}`, `X${i + 1}`, `Y${j}+${k * 4}`]);
      d.push([`D${i}.${j}`, "L1", "one-way", "Office", "y", `X${i}`, `Y${j}`, `X${i + 1}`, `Y${j + 1}`]);
    }
  }
  const t = (sheet: string, values: CellValue[][]): TableData => ({ sheet, top: 0, left: 0, values });
  return { framing: t("Framing", f), decks: t("Decks", d), grids: t("Grids", g), levels: t("Levels", [["Level", "Elevation"], ["L1", 13]]) };
}

/** Median wall time of one call (ms) and the process CPU time per call (ms), after a warm-up. */
function median(fn: () => unknown, runs = 9): number {
  for (let i = 0; i < 8; i++) fn();
  const times: number[] = [];
  const cpu0 = process.cpuUsage();
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  const cpu = process.cpuUsage(cpu0);
  lastCpu = (cpu.user + cpu.system) / 1000 / runs;
  times.sort((a, b) => a - b);
  return times[Math.floor(runs / 2)]!;
}
let lastCpu = 0;

/** Prints the drawing time of one 513-member level. */
export async function run(): Promise<void> {
  const r = readPlan(tables());
  const derivation = derive(r.plan);
  const model = { plan: r.plan, grids: r.grids, derivation, units: "US" as const };
  const members = derivation.members.filter((m) => m.type !== "foundation").length;
  let size = 0;
  const plain = median(() => (size = renderFramingPlan(model, "L1").length));
  report(`one level, ${members} members and columns (${derivation.regions.length} regions): draw`, plain, "ms", "< 200 ms");
  report("  process CPU time per draw (garbage collection included)", lastCpu, "ms");
  report("  SVG size", size / 1024, "KiB");
  const selected = median(() => renderFramingPlan(model, "L1", { selected: "B4.3.2" }));
  report(`one level, ${members} members, one selected: draw`, selected, "ms", "< 200 ms");
  report("  process CPU time per draw (garbage collection included)", lastCpu, "ms");
  report("  machine load average (1 min) while measured", loadavg()[0]!, "");
}
